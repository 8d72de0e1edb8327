// Cubic spline with not-a-knot end conditions (de Boor, A Practical Guide to Splines, rev. ed. 2001,
// ch. IV): C² everywhere, reproduces any cubic exactly, error O(h⁴) up to the ends — unlike the natural
// spline, whose zero end curvature costs O(h²) near the first and last rows.

export interface CubicSpline {
  x: readonly number[];
  y: readonly number[];
  /** Second derivatives at the knots. */
  m: readonly number[];
}

/** Knots must be strictly increasing and at least 4. */
export function cubicSpline(x: readonly number[], y: readonly number[]): CubicSpline {
  const n = x.length;
  if (n < 4 || y.length !== n)
    throw new RangeError('a not-a-knot spline needs at least 4 knots and one value per knot');
  const h: number[] = [];
  for (let i = 0; i < n - 1; i++) h.push((x[i + 1] as number) - (x[i] as number));
  const at = (a: readonly number[], i: number): number => a[i] as number;
  // Unknowns M_1 … M_{n−2}: a tridiagonal system, the two end rows folded with the not-a-knot conditions
  // M_0 = ((h0+h1)M_1 − h0 M_2)/h1 and M_{n−1} = ((h_{n−3}+h_{n−2})M_{n−2} − h_{n−2}M_{n−3})/h_{n−3}.
  const k = n - 2;
  const lower = new Array<number>(k).fill(0);
  const diag = new Array<number>(k).fill(0);
  const upper = new Array<number>(k).fill(0);
  const rhs = new Array<number>(k).fill(0);
  for (let r = 0; r < k; r++) {
    const i = r + 1;
    const h0 = at(h, i - 1);
    const h1 = at(h, i);
    lower[r] = h0;
    diag[r] = 2 * (h0 + h1);
    upper[r] = h1;
    rhs[r] = 6 * ((at(y, i + 1) - at(y, i)) / h1 - (at(y, i) - at(y, i - 1)) / h0);
  }
  const ha = at(h, 0);
  const hb = at(h, 1);
  diag[0] = at(diag, 0) + (ha * (ha + hb)) / hb;
  upper[0] = at(upper, 0) - (ha * ha) / hb;
  const hy = at(h, n - 3);
  const hz = at(h, n - 2);
  diag[k - 1] = at(diag, k - 1) + (hz * (hy + hz)) / hy;
  lower[k - 1] = at(lower, k - 1) - (hz * hz) / hy;
  // Thomas algorithm; the folded rows stay diagonally dominant, so no pivoting is needed.
  for (let r = 1; r < k; r++) {
    const w = at(lower, r) / at(diag, r - 1);
    diag[r] = at(diag, r) - w * at(upper, r - 1);
    rhs[r] = at(rhs, r) - w * at(rhs, r - 1);
  }
  const inner = new Array<number>(k).fill(0);
  inner[k - 1] = at(rhs, k - 1) / at(diag, k - 1);
  for (let r = k - 2; r >= 0; r--) inner[r] = (at(rhs, r) - at(upper, r) * at(inner, r + 1)) / at(diag, r);
  const m0 = ((ha + hb) * at(inner, 0) - ha * at(inner, 1)) / hb;
  const mLast = ((hy + hz) * at(inner, k - 1) - hz * at(inner, k - 2)) / hy;
  return { x, y, m: [m0, ...inner, mLast] };
}

function interval(x: readonly number[], t: number): number {
  let lo = 0;
  let hi = x.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((x[mid] as number) <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Value and first derivative at t (extrapolates with the end cubics outside the knots). */
export function evaluateSpline(spline: CubicSpline, t: number): { value: number; derivative: number } {
  const { x, y, m } = spline;
  const i = interval(x, t);
  const x0 = x[i] as number;
  const h = (x[i + 1] as number) - x0;
  const m0 = m[i] as number;
  const m1 = m[i + 1] as number;
  const y0 = y[i] as number;
  const y1 = y[i + 1] as number;
  const a = (x0 + h - t) / h;
  const b = 1 - a;
  const value = a * y0 + b * y1 + (((a * a * a - a) * m0 + (b * b * b - b) * m1) * h * h) / 6;
  const derivative = (y1 - y0) / h + ((-(3 * a * a - 1) * m0 + (3 * b * b - 1) * m1) * h) / 6;
  return { value, derivative };
}
