// Small one- and two-dimensional minimisers for χ² surfaces in edge times. The surfaces are smooth
// where diffraction, the star or the exposure spread an edge over several samples, but can be flat
// between samples when none does, so each 1-D search scans a grid before refining by golden section
// (Press et al., Numerical Recipes, 3rd ed., §10.2) rather than trusting derivatives.

const GOLDEN = (3 - Math.sqrt(5)) / 2;
const PARABOLA_ROUNDS = 1;

export interface Minimum1d {
  x: number;
  fx: number;
}

/** Golden-section search for a minimum of f inside [a, b], to an absolute tolerance in x. */
export function goldenSection(f: (x: number) => number, a: number, b: number, tolerance: number): Minimum1d {
  let lo = Math.min(a, b);
  let hi = Math.max(a, b);
  let x1 = lo + GOLDEN * (hi - lo);
  let x2 = hi - GOLDEN * (hi - lo);
  let f1 = f(x1);
  let f2 = f(x2);
  while (hi - lo > tolerance) {
    if (f1 <= f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = lo + GOLDEN * (hi - lo);
      f1 = f(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = hi - GOLDEN * (hi - lo);
      f2 = f(x2);
    }
  }
  return f1 <= f2 ? { x: x1, fx: f1 } : { x: x2, fx: f2 };
}

/** Scans [lo, hi] at `intervals` equal steps, then refines around the best node. */
export function scanThenRefine(
  f: (x: number) => number,
  lo: number,
  hi: number,
  intervals: number,
  tolerance: number,
): Minimum1d {
  const step = (hi - lo) / intervals;
  let best = { x: lo, fx: f(lo) };
  for (let k = 1; k <= intervals; k++) {
    const x = lo + k * step;
    const fx = f(x);
    if (fx < best.fx) best = { x, fx };
  }
  const refined = goldenSection(f, Math.max(lo, best.x - step), Math.min(hi, best.x + step), tolerance);
  return refined.fx <= best.fx ? refined : best;
}

export interface Minimum2d {
  x: number;
  y: number;
  fxy: number;
}

export interface Minimize2dOptions {
  /** Half-width of the first scan around each starting coordinate. */
  span: number;
  tolerance: number;
  bounds: { lo: number; hi: number };
  maxRounds?: number;
}

/**
 * Alternating 1-D minimisation. The two edge times of a well are nearly independent for long events,
 * where it converges in two rounds; short dips couple them and take a few more.
 */
export function minimizeAlternating(
  f: (x: number, y: number) => number,
  x0: number,
  y0: number,
  options: Minimize2dOptions,
): Minimum2d {
  const { tolerance, bounds } = options;
  const maxRounds = options.maxRounds ?? 40;
  let x = x0;
  let y = y0;
  let fxy = f(x, y);
  let span = options.span;
  for (let round = 0; round < maxRounds; round++) {
    const mx = scanThenRefine(
      (t) => f(t, y),
      Math.max(bounds.lo, x - span),
      Math.min(bounds.hi, x + span),
      20,
      tolerance,
    );
    const my = scanThenRefine(
      (t) => f(mx.x, t),
      Math.max(bounds.lo, y - span),
      Math.min(bounds.hi, y + span),
      20,
      tolerance,
    );
    const moved = Math.max(Math.abs(mx.x - x), Math.abs(my.x - y));
    if (my.fx <= fxy) {
      x = mx.x;
      y = my.x;
      fxy = my.fx;
    }
    if (moved <= tolerance) break;
    span = Math.max(4 * moved, 20 * tolerance, span / 4);
  }
  return { x, y, fxy };
}

/**
 * Distance from the minimum x* at which the profile g rises to g(x*) + 1 in the direction `direction`
 * (+1 or −1). Stops at `limit` (the data's end) and returns the distance to it if g never rises that far.
 * Beyond the first crossing it scans `lookFurther` more for a further stretch below g(x*) + 1 and, if it
 * finds one, returns the outer crossing of that. The scan may use a cheaper `screen` that is never below g
 * (χ² with the profiled-out parameters held, rather than re-minimised): where it is under the target, g is.
 */
export function profileHalfWidth(
  g: (x: number) => number,
  xStar: number,
  gStar: number,
  direction: 1 | -1,
  firstStep: number,
  limit: number,
  tolerance: number,
  lookFurther = 0,
  screen: (x: number) => number = g,
): number {
  const target = gStar + 1;
  const maxDistance = Math.abs(limit - xStar);
  const excess = (d: number): number => g(xStar + direction * d) - target;
  let inside = 0;
  let excessInside = gStar - target;
  let step = Math.min(firstStep, maxDistance);
  let excessStep = excess(step);
  while (excessStep < 0) {
    inside = step;
    excessInside = excessStep;
    if (step >= maxDistance) return maxDistance;
    step = Math.min(2 * step, maxDistance);
    excessStep = excess(step);
  }
  let outside = step;
  let excessOutside = excessStep;
  // Illinois (modified regula falsi): the profile is nearly quadratic, so a few secant steps find the
  // crossing where bisection would take a dozen evaluations of a re-minimised χ².
  const bisect = (): void => {
    let kept = 0;
    for (let k = 0; k < 60 && outside - inside > tolerance; k++) {
      let mid = (inside * excessOutside - outside * excessInside) / (excessOutside - excessInside);
      if (!(mid > inside && mid < outside)) mid = (inside + outside) / 2;
      const e = excess(mid);
      if (Math.abs(e) < 1e-9) {
        inside = mid;
        outside = mid;
        return;
      }
      if (e < 0) {
        inside = mid;
        excessInside = e;
        if (kept === -1) excessOutside /= 2;
        kept = -1;
      } else {
        outside = mid;
        excessOutside = e;
        if (kept === 1) excessInside /= 2;
        kept = 1;
      }
    }
  };
  bisect();
  const firstCrossing = (inside + outside) / 2;
  // A fringe or a dead gap between exposures can make χ² dip below the target again further out; the
  // half-width is that of the whole region below it, so look on for another lobe.
  if (lookFurther > 0) {
    const scanStep = Math.max(lookFurther / 32, tolerance);
    let last = outside;
    for (let d = outside + scanStep; d <= Math.min(maxDistance, outside + lookFurther); d += scanStep) {
      if (screen(xStar + direction * d) < target) {
        last = d;
      } else if (last > outside) {
        break;
      }
    }
    if (last > outside) {
      inside = last;
      excessInside = excess(last);
      outside = Math.min(maxDistance, last + scanStep);
      excessOutside = excess(outside);
      if (excessOutside < 0) return outside;
      // The screen is an upper bound only up to the inner minimiser's accuracy; trust the profile itself.
      if (excessInside >= 0) return firstCrossing;
      bisect();
    }
  }
  return (inside + outside) / 2;
}

/**
 * PARABOLA_ROUNDS rounds of a three-point parabola around a warm start, keeping the lowest point seen. For a
 * minimum already known to lie within a few steps of the start; where the stencil is not convex the
 * round keeps its best node.
 */
export function parabolicMinimum(
  f: (x: number) => number,
  start: number,
  step: number,
  bounds: { lo: number; hi: number },
): Minimum1d {
  const clampX = (x: number): number => Math.min(bounds.hi, Math.max(bounds.lo, x));
  const x0Start = clampX(start);
  let best: Minimum1d = { x: x0Start, fx: f(x0Start) };
  let h = step;
  for (let round = 0; round < PARABOLA_ROUNDS; round++) {
    const x0 = best.x;
    const f0 = best.fx;
    const xm = x0 - h;
    const xp = x0 + h;
    if (xm < bounds.lo || xp > bounds.hi) break;
    const fm = f(xm);
    const fp = f(xp);
    const curvature = fm + fp - 2 * f0;
    if (fm < best.fx) best = { x: xm, fx: fm };
    if (fp < best.fx) best = { x: xp, fx: fp };
    if (curvature > 0) {
      const vertex = clampX(x0 + (h * (fm - fp)) / (2 * curvature));
      const fv = f(vertex);
      if (fv < best.fx) best = { x: vertex, fx: fv };
    }
    h /= 4;
  }
  return best;
}
