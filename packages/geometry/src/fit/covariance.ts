// Covariance matrices of fitted parameters: the linearised (JᵀJ)⁻¹ of a weighted least-squares problem,
// the covariance of an ensemble sample with its diagonal set to the reported 1-sigma, and first-order
// propagation C' = G·C·Gᵀ to derived quantities. Shared by the limb, ring and joint limb+ring fits.

import { Matrix, SingularValueDecomposition, inverse } from 'ml-matrix';

/** Below this ratio of the smallest to the largest singular value the normal matrix counts as singular. */
const SINGULAR_RATIO = 1e-12;

/**
 * (JᵀJ)⁻¹ for J the Jacobian of the normalised residuals r/σ with respect to the free parameters (Press et
 * al., Numerical Recipes, 3rd ed., 2007, §15.5.1; §15.4.2 for the covariance of a linear least-squares
 * fit). Columns listed in `dropped` (a position angle that a round ellipse cannot see) are left out of the
 * inversion and get the given variance and no covariance. The matrix is scaled to unit diagonal before
 * the singularity test, so the test does not depend on units; `unconstrained(column)` names the parameter
 * along the null direction, or the first column without any derivative.
 */
export function normalMatrixCovariance(
  jac: Matrix,
  dropped: ReadonlyMap<number, number>,
  unconstrained: (column: number) => Error,
): Matrix {
  const k = jac.columns;
  const kept = Array.from({ length: k }, (_, i) => i).filter((i) => !dropped.has(i));
  const alpha = new Matrix(kept.length, kept.length);
  kept.forEach((ci, r) =>
    kept.forEach((cj, c) => {
      let s = 0;
      for (let row = 0; row < jac.rows; row++) s += jac.get(row, ci) * jac.get(row, cj);
      alpha.set(r, c, s);
    }),
  );
  const scale = kept.map((_, i) => Math.sqrt(alpha.get(i, i)));
  const flat = scale.findIndex((s) => !(s > 0));
  if (flat >= 0) throw unconstrained(kept[flat] as number);
  const corr = new Matrix(kept.length, kept.length);
  for (let r = 0; r < kept.length; r++)
    for (let c = 0; c < kept.length; c++)
      corr.set(r, c, alpha.get(r, c) / ((scale[r] as number) * (scale[c] as number)));
  const svd = new SingularValueDecomposition(corr);
  const sv = svd.diagonal;
  const smallest = Math.min(...sv);
  if (smallest < SINGULAR_RATIO * Math.max(...sv)) {
    const nullVector = svd.rightSingularVectors.getColumn(sv.indexOf(smallest));
    const worst = nullVector.reduce(
      (w, v, i) => (Math.abs(v) > Math.abs(nullVector[w] as number) ? i : w),
      0,
    );
    throw unconstrained(kept[worst] as number);
  }
  const corrInv = inverse(corr);
  const cov = new Matrix(k, k);
  kept.forEach((ci, r) =>
    kept.forEach((cj, c) =>
      cov.set(ci, cj, corrInv.get(r, c) / ((scale[r] as number) * (scale[c] as number))),
    ),
  );
  for (const [column, variance] of dropped) cov.set(column, column, variance);
  return cov;
}

/**
 * The covariance of sampled values with its diagonal replaced by the reported 1-sigma squared:
 * C_ij = ρ_ij·σ_i·σ_j, with ρ the sample (Pearson) correlation. The reported 1-sigma is the half-width of
 * the central 68.3 % (robust to a long tail), the correlation the ordinary moment estimate (e.g. Bevington
 * & Robinson, Data Reduction and Error Analysis, 3rd ed., §7.1). A column with σ = 0 (a parameter held
 * fixed) gets a row and column of zeros.
 */
export function sampledCovariance(columns: readonly Float64Array[], sigmas: readonly number[]): number[][] {
  const k = columns.length;
  const centred = columns.map((col) => {
    let mean = 0;
    for (let i = 0; i < col.length; i++) mean += col[i] as number;
    mean /= col.length || 1;
    return Float64Array.from(col, (v) => v - mean);
  });
  const norms = centred.map((col) => Math.sqrt(col.reduce((s, v) => s + v * v, 0)));
  const out = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      const si = sigmas[i] as number;
      const sj = sigmas[j] as number;
      if (!(si > 0 && sj > 0)) continue;
      let rho = 1;
      if (i !== j) {
        const ni = norms[i] as number;
        const nj = norms[j] as number;
        if (!(ni > 0 && nj > 0)) continue;
        const a = centred[i] as Float64Array;
        const b = centred[j] as Float64Array;
        let s = 0;
        for (let n = 0; n < a.length; n++) s += (a[n] as number) * (b[n] as number);
        rho = Math.max(-1, Math.min(1, s / (ni * nj)));
      }
      const c = rho * si * sj;
      (out[i] as number[])[j] = c;
      (out[j] as number[])[i] = c;
    }
  }
  return out;
}

/**
 * First-order propagation C' = G·C·Gᵀ, G the Jacobian of the derived quantities with respect to the
 * parameters (Taylor, An Introduction to Error Analysis, 2nd ed., 1997, §9.2, in matrix form).
 */
export function propagateCovariance(cov: readonly number[][], g: readonly number[][]): number[][] {
  const m = g.length;
  const k = cov.length;
  const gc = g.map((row) =>
    Array.from({ length: k }, (_, j) =>
      row.reduce((s, gi, i) => s + gi * ((cov[i] as number[])[j] as number), 0),
    ),
  );
  return Array.from({ length: m }, (_, r) =>
    Array.from({ length: m }, (_, c) =>
      (gc[r] as number[]).reduce((s, v, j) => s + v * ((g[c] as number[])[j] as number), 0),
    ),
  );
}

/** Rows and columns `indices` of a square matrix, in that order. */
export function subMatrix(cov: readonly number[][], indices: readonly number[]): number[][] {
  return indices.map((i) => indices.map((j) => ((cov[i] as number[])[j] as number) ?? 0));
}

/** The square roots of the diagonal. */
export function sigmasOf(cov: readonly number[][]): number[] {
  return cov.map((row, i) => Math.sqrt(Math.max(0, row[i] as number)));
}
