// Shadow-path lines on the ground: at each grid time, the point P of the WGS84 ellipsoid (height 0) whose
// sky-plane place is the offset d along the left normal, ((P − B')·e_f, (P − B')·e_g) = d·n. Such points
// form the line P = Q + λs, Q = (B'·e_f + d·n_f)·e_f + (B'·e_g + d·n_g)·e_g, which is turned into
// Earth-fixed axes and met with the ellipsoid on the star's side (predict/ellipsoid.ts). A time where the
// line misses the Earth, or meets it where the star is on or below the horizon, has no point.
import type { Vec3 } from '../astro/vec3.js';
import { RAD, wrap } from '../math.js';
import { ttSecondsToUtcIso } from '../time/scales.js';
import { starFacingSurfacePoint, surfaceGeodeticRad } from './ellipsoid.js';
import type { PredictionSky } from './sky-frame.js';
import type { PathPoint } from './types.js';

/** Longitude in degrees reduced to [−180, 180). */
export function longitudeDeg(lonRad: number): number {
  return wrap(lonRad * RAD + 180, 360) - 180;
}

/** One list of points per offset (km, + left of the shadow's motion), in grid-time order. */
export function pathLines(
  sky: PredictionSky,
  gridTt: readonly number[],
  offsetsKm: readonly number[],
): PathPoint[][] {
  const lines: PathPoint[][] = offsetsKm.map(() => []);
  for (const tt of gridTt) {
    const body = sky.body(tt);
    const n = sky.leftNormal(body, tt);
    const { eF, eG, s } = body.basis;
    const toEarthFixed = sky.toEarthFixed(tt);
    const u = toEarthFixed(s);
    const timeUtc = ttSecondsToUtcIso(tt);
    offsetsKm.forEach((d, k) => {
      const f = body.fKm + d * n.fKm;
      const g = body.gKm + d * n.gKm;
      const q: Vec3 = [f * eF[0] + g * eG[0], f * eF[1] + g * eG[1], f * eF[2] + g * eG[2]];
      const p = starFacingSurfacePoint(toEarthFixed(q), u);
      if (p === null) return;
      const { latRad, lonRad } = surfaceGeodeticRad(p);
      (lines[k] as PathPoint[]).push({ timeUtc, latDeg: latRad * RAD, lonDeg: longitudeDeg(lonRad) });
    });
  }
  return lines;
}
