// Root of a smooth function on a bracket where it changes sign: Newton's method kept inside the bracket,
// falling back to bisection when a Newton step would leave it or not halve the error (Press et al.,
// Numerical Recipes, 3rd ed., §9.4, "rtsafe"). The prediction's functions come with their derivative
// (positions with their rates), so a root to 1 µs takes a handful of evaluations.

/** Value and derivative at x. */
export type ValueAndSlope = (x: number) => [number, number];

/** The x in [lo, hi] where f changes sign, to `tolerance`; f(lo) and f(hi) must differ in sign. */
export function safeNewton(f: ValueAndSlope, lo: number, hi: number, tolerance: number): number {
  const [fLo] = f(lo);
  const [fHi] = f(hi);
  if (fLo === 0) return lo;
  if (fHi === 0) return hi;
  // Orient the bracket so that f(below) < 0 < f(above).
  let below = fLo < 0 ? lo : hi;
  let above = fLo < 0 ? hi : lo;
  let x = (lo + hi) / 2;
  let stepBefore = Math.abs(hi - lo);
  let step = stepBefore;
  let [value, slope] = f(x);
  for (let i = 0; i < 200; i++) {
    const leavesBracket = ((x - above) * slope - value) * ((x - below) * slope - value) > 0;
    const tooSlow = Math.abs(2 * value) > Math.abs(stepBefore * slope);
    stepBefore = step;
    if (leavesBracket || tooSlow) {
      step = (above - below) / 2;
      x = below + step;
    } else {
      step = value / slope;
      x -= step;
    }
    if (Math.abs(step) < tolerance) return x;
    [value, slope] = f(x);
    if (value === 0) return x;
    if (value < 0) below = x;
    else above = x;
  }
  return x;
}
