// Sky-plane shapes the plots draw that the solution states only by parameters: ring ellipses, the limb's
// 1-sigma envelope, and per-endpoint error bars. Frame as in the geometry package: f east, g north (km),
// position angles from north through east.
import { ellipseFrame, ellipseOutline } from '@limbus/geometry/ellipse';
import type { LimbEllipse, RingSolution, SkyPointKm, SolutionChord } from '@limbus/geometry';

const DEG = Math.PI / 180;

/**
 * A circular ring of radius R seen at opening angle B projects to an ellipse with semi-axes R and R·|sin B|
 * (an inclined circle, orthographic projection). P is taken, as for the limb, as the position angle of the
 * semi-minor axis, which is where the projected pole lies.
 */
export function ringEllipse(
  ring: Pick<RingSolution, 'centerFKm' | 'centerGKm' | 'radiusKm' | 'openingAngleDeg' | 'positionAngleDeg'>,
): LimbEllipse {
  return {
    centerFKm: ring.centerFKm,
    centerGKm: ring.centerGKm,
    equatorialRadiusKm: ring.radiusKm,
    oblateness: 1 - Math.abs(Math.sin(ring.openingAngleDeg * DEG)),
    positionAngleDeg: ring.positionAngleDeg,
  };
}

export function outlineKm(ellipse: LimbEllipse, pointCount: number): SkyPointKm[] {
  return ellipseOutline(ellipse, pointCount);
}

/**
 * Distance (km) from an origin inside the ellipse to its edge along the position angle (radians, north
 * through east), or null when the origin is not inside. The ray p = o + t·d, mapped to the ellipse frame,
 * makes (u/a)² + (w/b)² = 1 a quadratic in t; inside, C < 0 and the positive root is the crossing.
 */
export function rayToEllipseKm(
  origin: SkyPointKm,
  positionAngleRad: number,
  ellipse: LimbEllipse,
): number | null {
  const fr = ellipseFrame(ellipse);
  const df = origin.fKm - fr.centerFKm;
  const dg = origin.gKm - fr.centerGKm;
  const dirF = Math.sin(positionAngleRad);
  const dirG = Math.cos(positionAngleRad);
  const u0 = df * fr.cosP - dg * fr.sinP;
  const w0 = df * fr.sinP + dg * fr.cosP;
  const du = dirF * fr.cosP - dirG * fr.sinP;
  const dw = dirF * fr.sinP + dirG * fr.cosP;
  const a2 = fr.semiMajorKm * fr.semiMajorKm;
  const b2 = fr.semiMinorKm * fr.semiMinorKm;
  const qa = (du * du) / a2 + (dw * dw) / b2;
  const qb = 2 * ((u0 * du) / a2 + (w0 * dw) / b2);
  const qc = (u0 * u0) / a2 + (w0 * w0) / b2 - 1;
  if (!(qc < 0) || !(qa > 0)) return null;
  return (-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
}

export interface BandEnvelope {
  innerKm: SkyPointKm[];
  outerKm: SkyPointKm[];
}

/**
 * The region swept by the band's sample ellipses: along each direction from the fitted centre, the nearest
 * and farthest sample edge. Samples that do not contain the centre are left out (they cannot be measured
 * along a ray from it). Null when no sample remains.
 */
export function bandEnvelope(
  centre: SkyPointKm,
  samples: LimbEllipse[],
  directionCount: number,
): BandEnvelope | null {
  const innerKm: SkyPointKm[] = [];
  const outerKm: SkyPointKm[] = [];
  for (let i = 0; i < directionCount; i++) {
    const pa = (2 * Math.PI * i) / directionCount;
    let lo = Infinity;
    let hi = -Infinity;
    for (const sample of samples) {
      const r = rayToEllipseKm(centre, pa, sample);
      if (r === null) continue;
      lo = Math.min(lo, r);
      hi = Math.max(hi, r);
    }
    if (hi < lo) return null;
    innerKm.push({ fKm: centre.fKm + lo * Math.sin(pa), gKm: centre.gKm + lo * Math.cos(pa) });
    outerKm.push({ fKm: centre.fKm + hi * Math.sin(pa), gKm: centre.gKm + hi * Math.cos(pa) });
  }
  return { innerKm, outerKm };
}

/** Unit vector of the chord's direction of motion in the sky plane; the error bars of its timings lie along it. */
export function chordDirection(chord: Pick<SolutionChord, 'velocityKmPerS' | 'path'>): SkyPointKm {
  let f = chord.velocityKmPerS.f;
  let g = chord.velocityKmPerS.g;
  const first = chord.path[0];
  const last = chord.path[chord.path.length - 1];
  if (Math.hypot(f, g) === 0 && first !== undefined && last !== undefined) {
    f = last.fKm - first.fKm;
    g = last.gKm - first.gKm;
  }
  const norm = Math.hypot(f, g);
  return norm === 0 ? { fKm: 1, gKm: 0 } : { fKm: f / norm, gKm: g / norm };
}

/** The two ends of a ±sigma error bar along the chord. */
export function errorBarKm(
  point: SkyPointKm,
  direction: SkyPointKm,
  sigmaKm: number,
): [SkyPointKm, SkyPointKm] {
  return [
    { fKm: point.fKm - direction.fKm * sigmaKm, gKm: point.gKm - direction.gKm * sigmaKm },
    { fKm: point.fKm + direction.fKm * sigmaKm, gKm: point.gKm + direction.gKm * sigmaKm },
  ];
}

/** A length near a fifth of the span that reads well on a scale bar: 1, 2 or 5 times a power of ten. */
export function niceScaleLengthKm(spanKm: number): number {
  const target = spanKm / 5;
  if (!(target > 0) || !Number.isFinite(target)) return 1;
  const power = 10 ** Math.floor(Math.log10(target));
  const step = [5, 2, 1].find((m) => m * power <= target) ?? 1;
  return step * power;
}
