// Matched box searches on a sampled light curve. A square well seen with white noise is detected best by
// the box whose mean departs most from its surroundings in units of its own standard error; the search
// slides every width of a geometric ladder over every position with prefix sums, O(N) per width, then
// moves each end of the best box one sample at a time to undo the ladder's rounding.

const WIDTH_RATIO = 1.15;

export interface Box {
  /** First sample inside the box. */
  lo: number;
  /** One past the last sample inside the box. */
  hi: number;
  /** Contrast of the box in standard errors. */
  significance: number;
}

export function widthLadder(maxWidth: number): number[] {
  const widths: number[] = [];
  for (let w = 1; w <= maxWidth; w = Math.max(w + 1, Math.floor(w * WIDTH_RATIO))) widths.push(w);
  return widths;
}

function prefix(
  values: ArrayLike<number>,
  weights: ArrayLike<number>,
): { w: Float64Array; wy: Float64Array } {
  const n = values.length;
  const w = new Float64Array(n + 1);
  const wy = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    w[i + 1] = (w[i] ?? 0) + (weights[i] ?? 0);
    wy[i + 1] = (wy[i] ?? 0) + (weights[i] ?? 0) * (values[i] ?? 0);
  }
  return { w, wy };
}

function refineEnds(score: (lo: number, hi: number) => number, box: Box, n: number, reach: number): Box {
  let { lo, hi, significance } = box;
  for (let pass = 0; pass < 3; pass++) {
    const before = significance;
    for (let a = Math.max(0, lo - reach); a <= Math.min(hi - 1, lo + reach); a++) {
      const s = score(a, hi);
      if (s > significance) {
        significance = s;
        lo = a;
      }
    }
    for (let b = Math.max(lo + 1, hi - reach); b <= Math.min(n, hi + reach); b++) {
      const s = score(lo, b);
      if (s > significance) {
        significance = s;
        hi = b;
      }
    }
    if (significance === before) break;
  }
  return { lo, hi, significance };
}

/**
 * The box of samples whose weighted mean lies furthest below the weighted mean of all the others
 * (a square well of unknown depth): significance = (mean_out − mean_in)/√(1/W_in + 1/W_out), with W the
 * sums of weights (1/σ² per sample). Null when there are fewer than two samples.
 */
export function strongestStep(flux: ArrayLike<number>, weights: ArrayLike<number>): Box | null {
  const n = flux.length;
  if (n < 2) return null;
  const { w, wy } = prefix(flux, weights);
  const wTotal = w[n] ?? 0;
  const yTotal = wy[n] ?? 0;
  const score = (lo: number, hi: number): number => {
    const wIn = (w[hi] ?? 0) - (w[lo] ?? 0);
    const wOut = wTotal - wIn;
    if (wIn <= 0 || wOut <= 0) return -Infinity;
    const yIn = (wy[hi] ?? 0) - (wy[lo] ?? 0);
    return ((yTotal - yIn) / wOut - yIn / wIn) / Math.sqrt(1 / wIn + 1 / wOut);
  };
  let best: Box | null = null;
  for (const width of widthLadder(n - 1)) {
    for (let lo = 0; lo + width <= n; lo++) {
      const s = score(lo, lo + width);
      if (best === null || s > best.significance) best = { lo, hi: lo + width, significance: s };
    }
  }
  if (best === null) return null;
  return refineEnds(score, best, n, Math.ceil((best.hi - best.lo) * (WIDTH_RATIO - 1)) + 2);
}

/**
 * The box of at most maxWidth samples, none of them blocked, whose weighted residual sum is most
 * negative: significance = −Σ w·r / √(Σ w). Null when no box is allowed.
 */
export function strongestResidualBox(
  residuals: ArrayLike<number>,
  weights: ArrayLike<number>,
  blocked: Uint8Array,
  maxWidth: number,
): Box | null {
  const n = residuals.length;
  const { w, wy } = prefix(residuals, weights);
  const blockedBefore = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) blockedBefore[i + 1] = (blockedBefore[i] ?? 0) + (blocked[i] ?? 0);
  const score = (lo: number, hi: number): number => {
    if ((blockedBefore[hi] ?? 0) - (blockedBefore[lo] ?? 0) > 0 || hi - lo > maxWidth) return -Infinity;
    const wIn = (w[hi] ?? 0) - (w[lo] ?? 0);
    if (wIn <= 0) return -Infinity;
    return -((wy[hi] ?? 0) - (wy[lo] ?? 0)) / Math.sqrt(wIn);
  };
  let best: Box | null = null;
  for (const width of widthLadder(Math.min(maxWidth, n))) {
    for (let lo = 0; lo + width <= n; lo++) {
      const s = score(lo, lo + width);
      if (s > (best?.significance ?? -Infinity)) best = { lo, hi: lo + width, significance: s };
    }
  }
  if (best === null) return null;
  return refineEnds(score, best, n, Math.ceil((best.hi - best.lo) * (WIDTH_RATIO - 1)) + 2);
}
