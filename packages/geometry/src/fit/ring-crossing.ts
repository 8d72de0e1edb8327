// One dip of a fitted ring as the solution reports it: its radial width in the ring plane with a 1-sigma,
// and, when its light curve gave an apparent opacity p, what it says about the ring there (docs/method.md,
// "Ring dips"):
//   apparent optical depth τ = −ln(1 − p) (PDS4 Rings data dictionary, "normal_optical_depth": τ = −ln T),
//   normal optical depth τ_N = τ·|sin B|, B the ring's opening angle (same source: observed optical depth
//     times the sine of the ring elevation),
//   apparent equivalent width p·L and depth τ·L, L = |v|·(end − start) the dip's length along the track,
//   normal equivalent width p·W_r·|sin B| and depth τ_N·W_r, W_r the radial width (equivalent depth =
//     width × mean optical depth: Ellis et al., Planetary Ring Systems, Springer 2007; the |sin B| form of
//     the equivalent width: Elliot & Nicholson 1984, "The rings of Uranus", from memory).
// Every 1-sigma is first order (Taylor, An Introduction to Error Analysis, 2nd ed., §9.2) from the dip's
// two timing sigmas, the ring's covariance of (centre, B, P) and the opacity's sigma, taken as independent
// of each other; the derivatives are central differences.

import { DEG } from '../math.js';
import type { RingDip } from '../project.js';
import type { Measured, RingCrossing, RingCrossingDip, RingSolution, SkyPointKm } from '../types.js';
import { propagateCovariance } from './covariance.js';
import { ringPlaneRadiusKm } from './ring-fit.js';

/** Above this opacity a dip counts as opaque (its optical depth is not finite to double precision). */
const OPAQUE = 1 - 1e-9;

type Ring = Pick<RingSolution, 'centerFKm' | 'centerGKm' | 'openingAngleDeg' | 'positionAngleDeg'>;

/**
 * The crossing of `ring` by one dip; `ringCovariance` in the order centerFKm, centerGKm, radiusKm,
 * openingAngleDeg, positionAngleDeg (the radius plays no part).
 */
export function ringCrossing(
  dip: RingDip,
  midPoint: SkyPointKm & { station: string },
  ring: Ring,
  ringCovariance: readonly number[][],
): RingCrossing {
  const v = dip.velocity;
  const speed = Math.hypot(v.f, v.g);
  const opacity = dip.apparentOpacity;
  // Base variables: shifts of the start and end times (s), centre f, g (km), B, P (deg), opacity.
  const base = [0, 0, ring.centerFKm, ring.centerGKm, ring.openingAngleDeg, ring.positionAngleDeg];
  const rc = (i: number, j: number): number => ringCovariance[i]?.[j] ?? 0;
  const ringIndex = [0, 1, 3, 4];
  const cov: number[][] = Array.from({ length: 7 }, () => new Array<number>(7).fill(0));
  (cov[0] as number[])[0] = dip.startSigmaSeconds ** 2;
  (cov[1] as number[])[1] = dip.endSigmaSeconds ** 2;
  ringIndex.forEach((ri, a) => ringIndex.forEach((rj, b) => ((cov[2 + a] as number[])[2 + b] = rc(ri, rj))));
  (cov[6] as number[])[6] = (opacity?.sigma ?? 0) ** 2;
  const x0 = [...base, opacity?.value ?? 0];

  const radialWidth = (x: readonly number[]): number => {
    const [ts, te, fc, gc, b, p] = x as [number, number, number, number, number, number];
    const centre = { fKm: fc, gKm: gc };
    const start = { fKm: dip.start.fKm + v.f * ts, gKm: dip.start.gKm + v.g * ts };
    const end = { fKm: dip.end.fKm + v.f * te, gKm: dip.end.gKm + v.g * te };
    return Math.abs(ringPlaneRadiusKm(end, centre, b, p) - ringPlaneRadiusKm(start, centre, b, p));
  };
  const trackLength = (x: readonly number[]): number =>
    speed * (dip.durationSeconds + (x[1] as number) - (x[0] as number));
  const sinB = (x: readonly number[]): number => Math.abs(Math.sin((x[4] as number) * DEG));
  const tau = (x: readonly number[]): number => -Math.log(1 - Math.min(x[6] as number, OPAQUE));

  const quantities: Array<(x: readonly number[]) => number> = [radialWidth];
  const opaque = opacity !== undefined && opacity.value >= OPAQUE;
  if (opacity !== undefined) {
    quantities.push(
      (x) => x[6] as number,
      (x) => (x[6] as number) * trackLength(x),
      (x) => (x[6] as number) * radialWidth(x) * sinB(x),
    );
    if (!opaque)
      quantities.push(
        tau,
        (x) => tau(x) * sinB(x),
        (x) => tau(x) * trackLength(x),
        (x) => tau(x) * sinB(x) * radialWidth(x),
      );
  }
  const values = quantities.map((q) => q(x0));
  const sigmas = firstOrderSigmas(quantities, x0, cov);
  const m = (k: number): Measured => ({ value: values[k] as number, sigma: sigmas[k] as number });
  const crossing: RingCrossing = {
    ...midPoint,
    radialWidthKm: values[0] as number,
    radialWidthKmSigma: sigmas[0] as number,
  };
  if (opacity === undefined) return crossing;
  const dipProducts: RingCrossingDip = {
    lowerLimit: opacity.lowerLimit,
    apparentOpacity: m(1),
    equivalentWidthKm: m(2),
    normalEquivalentWidthKm: m(3),
    apparentOpticalDepth: opaque ? null : m(4),
    normalOpticalDepth: opaque ? null : m(5),
    equivalentDepthKm: opaque ? null : m(6),
    normalEquivalentDepthKm: opaque ? null : m(7),
  };
  return { ...crossing, dip: dipProducts };
}

/** √diag(G·C·Gᵀ), G by central differences with steps of 10⁻³ of each variable's own 1-sigma. */
function firstOrderSigmas(
  quantities: ReadonlyArray<(x: readonly number[]) => number>,
  x0: readonly number[],
  cov: readonly number[][],
): number[] {
  const steps = x0.map((_, i) => 1e-3 * Math.sqrt(Math.max(0, cov[i]?.[i] ?? 0)));
  const g = quantities.map((q) =>
    x0.map((_, i) => {
      const h = steps[i] as number;
      if (!(h > 0)) return 0;
      const up = [...x0];
      const down = [...x0];
      up[i] = (up[i] as number) + h;
      down[i] = (down[i] as number) - h;
      return (q(up) - q(down)) / (2 * h);
    }),
  );
  return propagateCovariance(cov, g).map((row, k) => Math.sqrt(Math.max(0, row[k] ?? 0)));
}
