// Levenberg–Marquardt minimisation of a sum of squared residuals, after Press, Teukolsky, Vetterling &
// Flannery, Numerical Recipes, 3rd ed. (2007), §15.5.2: the normal matrix's diagonal is scaled by (1 + λ),
// λ falls by 10 after an accepted step and rises by 10 after a rejected one.

import { Matrix, solve } from 'ml-matrix';

export interface LeastSquaresProblem {
  /** Residuals (already divided by their sigmas) at x. */
  residuals(x: Float64Array): Float64Array;
  /** Finite-difference step for each parameter. */
  stepSizes: Float64Array;
  /** Maps x to an equivalent admissible point, or null when x has no admissible meaning. */
  admissible(x: Float64Array): Float64Array | null;
}

export interface LeastSquaresResult {
  x: Float64Array;
  chi2: number;
  iterations: number;
}

export function sumOfSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += (r[i] as number) * (r[i] as number);
  return s;
}

/** Central-difference Jacobian J[i][j] = ∂r_i/∂x_j, as rows of residuals. */
export function jacobian(problem: LeastSquaresProblem, x: Float64Array): Matrix {
  const k = x.length;
  const base = problem.residuals(x);
  const jac = new Matrix(base.length, k);
  const xp = new Float64Array(x);
  for (let j = 0; j < k; j++) {
    const h = problem.stepSizes[j] as number;
    xp[j] = (x[j] as number) + h;
    const rp = problem.residuals(xp);
    xp[j] = (x[j] as number) - h;
    const rm = problem.residuals(xp);
    xp[j] = x[j] as number;
    for (let i = 0; i < base.length; i++) jac.set(i, j, ((rp[i] as number) - (rm[i] as number)) / (2 * h));
  }
  return jac;
}

export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  start: Float64Array,
  maxIterations = 200,
): LeastSquaresResult {
  let x = problem.admissible(start) ?? start;
  let r = problem.residuals(x);
  let chi2 = sumOfSquares(r);
  let lambda = 1e-3;
  let iterations = 0;
  let quietSteps = 0;
  const k = x.length;
  while (iterations < maxIterations && k > 0) {
    iterations++;
    const jac = jacobian(problem, x);
    const jt = jac.transpose();
    const alpha = jt.mmul(jac);
    const beta = jt.mmul(Matrix.columnVector(Array.from(r))).mul(-1);
    let accepted = false;
    while (!accepted && lambda < 1e12) {
      const damped = alpha.clone();
      for (let j = 0; j < k; j++) {
        const d = alpha.get(j, j);
        damped.set(j, j, d * (1 + lambda) + (d === 0 ? 1e-12 : 0));
      }
      const step = solve(damped, beta).getColumn(0);
      const trial = new Float64Array(k);
      for (let j = 0; j < k; j++) trial[j] = (x[j] as number) + (step[j] as number);
      const candidate = problem.admissible(trial);
      const rTrial = candidate ? problem.residuals(candidate) : null;
      const chi2Trial = rTrial ? sumOfSquares(rTrial) : Infinity;
      if (candidate && rTrial && Number.isFinite(chi2Trial) && chi2Trial <= chi2) {
        const gain = chi2 - chi2Trial;
        x = candidate;
        r = rTrial;
        // A step that gains almost nothing counts towards convergence (NR3 §15.5.2 stops after a few).
        quietSteps = gain <= 1e-10 * Math.max(chi2, 1e-300) + 1e-14 ? quietSteps + 1 : 0;
        chi2 = chi2Trial;
        lambda = Math.max(lambda / 10, 1e-12);
        accepted = true;
      } else {
        lambda *= 10;
      }
    }
    if (!accepted || quietSteps >= 3) break;
  }
  return { x, chi2, iterations };
}
