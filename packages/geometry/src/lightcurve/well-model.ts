// The normalised light of a square well with two diffracted, smoothed edges, sampled as a camera
// samples it (each point the mean over its exposure), and the weighted sums a linear fit of the
// baseline and bottom levels needs. Points farther than the profile table's half-width (plus half an
// exposure) from both edges see exactly 1 or 0, so their sums come from prefix sums and a χ²
// evaluation only touches the points near the edges.

import { boxMean, profileAt, type EdgeProfile } from './edge-profile.js';

const MIN_QUADRATURE_NODES = 16;
const MAX_QUADRATURE_NODES = 4096;

export interface WeightedSeries {
  /** Σ w over points [0, i). */
  w: Float64Array;
  /** Σ w·y over points [0, i). */
  wy: Float64Array;
  /** Σ w·y² over all points. */
  wyyTotal: number;
  y: ArrayLike<number>;
  weights: ArrayLike<number>;
}

export function weightedSeries(y: ArrayLike<number>, weights: ArrayLike<number>): WeightedSeries {
  const n = y.length;
  const w = new Float64Array(n + 1);
  const wy = new Float64Array(n + 1);
  let wyyTotal = 0;
  for (let i = 0; i < n; i++) {
    const wi = weights[i] ?? 0;
    const yi = y[i] ?? 0;
    w[i + 1] = (w[i] ?? 0) + wi;
    wy[i + 1] = (wy[i] ?? 0) + wi * yi;
    wyyTotal += wi * yi * yi;
  }
  return { w, wy, wyyTotal, y, weights };
}

export interface WellSums {
  sw: number;
  swI: number;
  swII: number;
  swy: number;
  swyI: number;
}

/**
 * The sky-plane speed at which each edge sweeps across the station: the limb-normal component of the
 * shadow's velocity there, which is what spreads diffraction, the star's disc and the exposure over the
 * edge (docs/method.md, "Light-curve timing", edge speed).
 */
export interface EdgeSpeeds {
  disappearanceKmPerS: number;
  reappearanceKmPerS: number;
}

export class WellModel {
  /** Time from an edge beyond which a whole exposure sees the exact step (the slower edge's). */
  readonly zoneSeconds: number;
  private readonly halfExposureDKm: number;
  private readonly halfExposureRKm: number;
  private readonly quadratureNodes: number;

  constructor(
    readonly timesSeconds: ArrayLike<number>,
    readonly profile: EdgeProfile,
    readonly speeds: EdgeSpeeds,
    readonly exposureSeconds: number,
  ) {
    const slowest = Math.min(speeds.disappearanceKmPerS, speeds.reappearanceKmPerS);
    this.halfExposureDKm = (speeds.disappearanceKmPerS * exposureSeconds) / 2;
    this.halfExposureRKm = (speeds.reappearanceKmPerS * exposureSeconds) / 2;
    this.zoneSeconds = profile.halfWidthKm / slowest + exposureSeconds / 2;
    const nodes = Math.ceil(Math.max(this.halfExposureDKm, this.halfExposureRKm) / profile.stepKm);
    this.quadratureNodes = Math.min(MAX_QUADRATURE_NODES, Math.max(MIN_QUADRATURE_NODES, nodes));
  }

  /**
   * I = 1 − (1 − G_D)(1 − G_R) averaged over the exposure centred on t, G_D and G_R each at its own edge's
   * speed. Each edge's own average is exact from the cumulative table; the product is separable whenever
   * one edge is constant over the exposure, and otherwise (an event or dip not much longer than one
   * exposure) is integrated directly.
   */
  intensityAt(tSeconds: number, disappearanceSeconds: number, reappearanceSeconds: number): number {
    const vD = this.speeds.disappearanceKmPerS;
    const vR = this.speeds.reappearanceKmPerS;
    const xD = vD * (disappearanceSeconds - tSeconds);
    const xR = vR * (tSeconds - reappearanceSeconds);
    const hD = this.halfExposureDKm;
    const hR = this.halfExposureRKm;
    const reach = this.profile.halfWidthKm;
    if (this.exposureSeconds > 0 && Math.abs(xD) < reach + hD && Math.abs(xR) < reach + hR) {
      const n = this.quadratureNodes;
      let sum = 0;
      for (let k = 0; k < n; k++) {
        // The same instant of the exposure for both edges: a fraction of the way from its start.
        const shift = -1 + (2 * (k + 0.5)) / n;
        const gD = profileAt(this.profile, xD - shift * hD);
        const gR = profileAt(this.profile, xR + shift * hR);
        sum += gD + gR - gD * gR;
      }
      return sum / n;
    }
    const aD = boxMean(this.profile, xD, hD);
    const aR = boxMean(this.profile, xR, hR);
    return aD + aR - aD * aR;
  }

  /** First index in [lo, hi) whose time is ≥ t. */
  lowerBound(tSeconds: number, lo = 0, hi = this.timesSeconds.length): number {
    let a = lo;
    let b = hi;
    while (a < b) {
      const mid = (a + b) >>> 1;
      if ((this.timesSeconds[mid] ?? Infinity) < tSeconds) a = mid + 1;
      else b = mid;
    }
    return a;
  }

  /** Weighted sums of the model I over points [lo, hi) for edge times t1 (disappearance) and t2. */
  sums(t1: number, t2: number, series: WeightedSeries, lo: number, hi: number): WellSums {
    const z = this.zoneSeconds;
    const out: WellSums = { sw: 0, swI: 0, swII: 0, swy: 0, swyI: 0 };
    const addConstant = (a: number, b: number, level: 0 | 1): void => {
      if (b <= a) return;
      const w = (series.w[b] ?? 0) - (series.w[a] ?? 0);
      const wy = (series.wy[b] ?? 0) - (series.wy[a] ?? 0);
      out.sw += w;
      out.swy += wy;
      if (level === 1) {
        out.swI += w;
        out.swII += w;
        out.swyI += wy;
      }
    };
    const addExplicit = (a: number, b: number): void => {
      for (let i = a; i < b; i++) {
        const wi = series.weights[i] ?? 0;
        const yi = series.y[i] ?? 0;
        const I = this.intensityAt(this.timesSeconds[i] ?? 0, t1, t2);
        out.sw += wi;
        out.swI += wi * I;
        out.swII += wi * I * I;
        out.swy += wi * yi;
        out.swyI += wi * yi * I;
      }
    };
    const clip = (i: number): number => Math.min(hi, Math.max(lo, i));
    if (t1 <= t2) {
      const a0 = clip(this.lowerBound(t1 - z, lo, hi));
      const a1 = clip(this.lowerBound(t1 + z, lo, hi));
      const b0 = clip(this.lowerBound(t2 - z, lo, hi));
      const b1 = clip(this.lowerBound(t2 + z, lo, hi));
      addConstant(lo, a0, 1);
      if (a1 < b0) {
        addExplicit(a0, a1);
        addConstant(a1, b0, 0);
        addExplicit(b0, b1);
      } else {
        addExplicit(a0, b1);
      }
      addConstant(b1, hi, 1);
    } else {
      // Reappearance before disappearance is a well that never closes: the light is 1 away from the
      // two edge zones.
      const a0 = clip(this.lowerBound(t2 - z, lo, hi));
      const a1 = clip(this.lowerBound(t1 + z, lo, hi));
      addConstant(lo, a0, 1);
      addExplicit(a0, a1);
      addConstant(a1, hi, 1);
    }
    return out;
  }
}
