// The star's direction through a prediction window. The shadow at an instant is cast along the star's
// direction at that instant (astro/star.ts: proper motion and parallax), so a prediction that spans hours
// evaluates it at every instant rather than once per event as the solve does (docs/method.md,
// "Prediction"). The parallax term needs the Earth's barycentric position (~16 µs each from
// astronomy-engine), so the direction is computed at knots every 600 s of TT and interpolated linearly in
// between: proper motion is linear in time, and the Earth's path departs from its chord over 600 s by
// a·h²/8 ≈ 0.3 km ≈ 2e-9 au, i.e. < 1e-16 rad of parallax shift for any star closer than 10 pc.
import { skyPlaneBasis, starDirection, type SkyPlaneBasis } from '../astro/star.js';
import { add, scale, unit, type Vec3 } from '../astro/vec3.js';
import type { StarInput } from '../types.js';

export const STAR_KNOT_SECONDS = 600;

export class StarTrack {
  private readonly knots = new Map<number, Vec3>();

  constructor(private readonly star: StarInput) {}

  private knot(index: number): Vec3 {
    let s = this.knots.get(index);
    if (!s) {
      s = starDirection(this.star, index * STAR_KNOT_SECONDS);
      this.knots.set(index, s);
    }
    return s;
  }

  /** Unit vector from the geocentre to the star at a TT instant (ICRS axes). */
  directionAt(ttSeconds: number): Vec3 {
    const index = Math.floor(ttSeconds / STAR_KNOT_SECONDS);
    const w = ttSeconds / STAR_KNOT_SECONDS - index;
    return unit(add(scale(this.knot(index), 1 - w), scale(this.knot(index + 1), w)));
  }

  /** The sky-plane basis (e_f east, e_g north, s) at a TT instant. */
  basisAt(ttSeconds: number): SkyPlaneBasis {
    return skyPlaneBasis(this.directionAt(ttSeconds));
  }
}
