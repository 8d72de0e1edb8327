// The sky-plane quantities of a prediction at an instant (docs/method.md, "Prediction"): the body shifted
// by the stated offset,
//   B' = B + D·(Δα*·e_f + Δδ·e_g),  D = |B|, offsets in radians,
// and any Earth-fixed point's (f, g) = ((O − B')·e_f, (O − B')·e_g) with its rate. The star, ephemeris and
// Earth orientation are the solve's own (astro/star.ts, astro/ephemeris.ts, astro/station.ts); only the
// basis is taken at each instant (predict/star-track.ts). Rates hold the basis fixed at the instant: its
// own turn (proper motion and parallax, < 3e-14 rad/s) adds < 2e-4 km/s at 41 au.
import { buildEphemeris, type Ephemeris } from '../astro/ephemeris.js';
import type { SkyPlaneBasis } from '../astro/star.js';
import { EarthOrientation } from '../astro/station.js';
import { dot, type Vec3 } from '../astro/vec3.js';
import { MAS_PER_RAD } from '../math.js';
import { ttSecondsToUtcIso } from '../time/scales.js';
import { GeometryInputError, type EventInput } from '../types.js';
import { StarTrack } from './star-track.js';
import type { MasPair } from './types.js';

/** A point's place on the sky plane and its rate. */
export interface SkyState {
  fKm: number;
  gKm: number;
  vfKmPerS: number;
  vgKmPerS: number;
}

export interface ShiftedBody {
  basis: SkyPlaneBasis;
  /** B'·e_f and B'·e_g, km, and their rates, km/s. */
  fKm: number;
  gKm: number;
  vfKmPerS: number;
  vgKmPerS: number;
  /** |B|, the ephemeris distance (unshifted), km. */
  distanceKm: number;
}

/** Body states kept for reuse; beyond this (a very long window) they are computed each time. */
const MAX_KEPT_STATES = 100_000;

/** Below this the shadow has no direction of motion, km/s (a real body moves ≥ 0.01 km/s on the sky plane). */
const MIN_SPEED_KM_PER_S = 1e-9;

export class PredictionSky {
  readonly ephemeris: Ephemeris;
  private readonly orientation: EarthOrientation;
  private readonly star: StarTrack;
  private readonly offsetFRad: number;
  private readonly offsetGRad: number;
  private readonly bodies = new Map<number, ShiftedBody>();

  constructor(event: Pick<EventInput, 'star' | 'ephemeris' | 'earthRotation'>, offsetMas: MasPair) {
    this.ephemeris = buildEphemeris(event.ephemeris.rows, event.ephemeris.timeScale);
    this.orientation = new EarthOrientation(event.earthRotation.dut1Seconds);
    this.star = new StarTrack(event.star);
    this.offsetFRad = offsetMas.raCosDec / MAS_PER_RAD;
    this.offsetGRad = offsetMas.dec / MAS_PER_RAD;
  }

  basis(ttSeconds: number): SkyPlaneBasis {
    return this.star.basisAt(ttSeconds);
  }

  /**
   * B' on the sky plane at a TT instant. Every station's scan samples the same instants (the window's scan
   * grid), so states are kept by instant: most of a many-station prediction's body states are then reused.
   */
  body(ttSeconds: number): ShiftedBody {
    const kept = this.bodies.get(ttSeconds);
    if (kept) return kept;
    const body = this.shiftedBody(ttSeconds);
    if (this.bodies.size < MAX_KEPT_STATES) this.bodies.set(ttSeconds, body);
    return body;
  }

  private shiftedBody(ttSeconds: number): ShiftedBody {
    const basis = this.star.basisAt(ttSeconds);
    const { positionKm: b, velocityKmPerS: bDot } = this.ephemeris.stateAt(ttSeconds);
    const distanceKm = Math.hypot(b[0], b[1], b[2]);
    const distanceRate = dot(b, bDot) / distanceKm;
    return {
      basis,
      fKm: dot(b, basis.eF) + distanceKm * this.offsetFRad,
      gKm: dot(b, basis.eG) + distanceKm * this.offsetGRad,
      vfKmPerS: dot(bDot, basis.eF) + distanceRate * this.offsetFRad,
      vgKmPerS: dot(bDot, basis.eG) + distanceRate * this.offsetGRad,
      distanceKm,
    };
  }

  /** The geocentre's (f, g) = −(B'·e_f, B'·e_g); its rate is the shadow-centre velocity v_c. */
  geocentre(ttSeconds: number): SkyState {
    const b = this.body(ttSeconds);
    return { fKm: -b.fKm, gKm: -b.gKm, vfKmPerS: -b.vfKmPerS, vgKmPerS: -b.vgKmPerS };
  }

  /** The left normal n = (−v_g, v_f)/|v_c| of the shadow-centre velocity v_c = −d/dt (B'·e_f, B'·e_g). */
  leftNormal(body: ShiftedBody, ttSeconds: number): { fKm: number; gKm: number } {
    const vf = -body.vfKmPerS;
    const vg = -body.vgKmPerS;
    const speed = Math.hypot(vf, vg);
    if (!(speed > MIN_SPEED_KM_PER_S))
      throw new GeometryInputError(
        'ephemeris.rows',
        `the body does not move on the sky plane at ${ttSecondsToUtcIso(ttSeconds)}: the shadow path has no direction`,
      );
    return { fKm: -vg / speed, gKm: vf / speed };
  }

  /** (f, g) of an Earth-fixed point (km, ITRS axes) and its rate. */
  observer(earthFixedKm: Vec3, ttSeconds: number): SkyState {
    const b = this.body(ttSeconds);
    const o = this.orientation.celestialState(earthFixedKm, ttSeconds);
    return {
      fKm: dot(o.positionKm, b.basis.eF) - b.fKm,
      gKm: dot(o.positionKm, b.basis.eG) - b.gKm,
      vfKmPerS: dot(o.velocityKmPerS, b.basis.eF) - b.vfKmPerS,
      vgKmPerS: dot(o.velocityKmPerS, b.basis.eG) - b.vgKmPerS,
    };
  }

  /** An Earth-fixed vector in celestial (J2000) axes at a TT instant. */
  toCelestial(earthFixed: Vec3, ttSeconds: number): Vec3 {
    return this.orientation.celestialState(earthFixed, ttSeconds).positionKm;
  }

  /**
   * The rotation celestial → Earth-fixed at a TT instant, as a function. The Earth orientation is a
   * rotation, so its inverse is its transpose: the rows are the celestial images of the Earth-fixed axes.
   */
  toEarthFixed(ttSeconds: number): (celestial: Vec3) => Vec3 {
    const x = this.toCelestial([1, 0, 0], ttSeconds);
    const y = this.toCelestial([0, 1, 0], ttSeconds);
    const z = this.toCelestial([0, 0, 1], ttSeconds);
    return (v) => [dot(x, v), dot(y, v), dot(z, v)];
  }
}
