import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { normalMatrixCovariance, propagateCovariance, sampledCovariance } from '../../src/fit/covariance.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { expectClose } from '../expect-close.js';

describe('normalMatrixCovariance()', () => {
  it('normalMatrixCovariance() gives the straight-line fit covariance of the textbook formulas', () => {
    // y = a + b·x with per-point σ: Press et al., Numerical Recipes, 3rd ed., §15.2, eqs. 15.2.4–15.2.9
    // (from memory): S = Σ1/σ², Sx = Σx/σ², Sxx = Σx²/σ², Δ = S·Sxx − Sx², σa² = Sxx/Δ, σb² = S/Δ,
    // Cov(a, b) = −Sx/Δ.
    const xs = [0.5, 1.7, 2.2, 3.9, 5.1, 6.6];
    const sigmas = [0.3, 0.2, 0.5, 0.25, 0.4, 0.1];
    // The Jacobian of the normalised residuals (y − a − b·x)/σ with respect to (a, b).
    const jac = new Matrix(xs.map((x, i) => [-1 / sigmas[i]!, -x / sigmas[i]!]));
    const cov = normalMatrixCovariance(jac, new Map(), () => new Error('singular'));
    let s = 0;
    let sx = 0;
    let sxx = 0;
    xs.forEach((x, i) => {
      const w = 1 / sigmas[i]! ** 2;
      s += w;
      sx += w * x;
      sxx += w * x * x;
    });
    const delta = s * sxx - sx * sx;
    expectClose(cov.get(0, 0), sxx / delta, 1e-12 * (sxx / delta));
    expectClose(cov.get(1, 1), s / delta, 1e-12 * (s / delta));
    expectClose(cov.get(0, 1), -sx / delta, 1e-12 * Math.abs(sx / delta));
    expectClose(cov.get(1, 0), -sx / delta, 1e-12 * Math.abs(sx / delta));
  });

  it('normalMatrixCovariance() gives a dropped column its stated variance and no covariance', () => {
    const jac = new Matrix([
      [1, 0, 0],
      [1, 2, 0],
      [0, 1, 0],
    ]);
    const cov = normalMatrixCovariance(jac, new Map([[2, 9]]), () => new Error('singular'));
    expect(cov.get(2, 2)).toBe(9);
    expect([cov.get(0, 2), cov.get(1, 2), cov.get(2, 0), cov.get(2, 1)]).toEqual([0, 0, 0, 0]);
    // The kept 2 × 2 block is the inverse of JᵀJ = [[2, 2], [2, 5]]: (1/6)·[[5, −2], [−2, 2]] (by hand).
    expectClose(cov.get(0, 0), 5 / 6, 1e-14);
    expectClose(cov.get(0, 1), -2 / 6, 1e-14);
    expectClose(cov.get(1, 1), 2 / 6, 1e-14);
  });

  it('normalMatrixCovariance() names the parameter along a null direction', () => {
    // Columns 0 and 1 always move together: the data fix their sum only.
    const jac = new Matrix([
      [1, 1, 0],
      [2, 2, 1],
      [3, 3, -1],
    ]);
    expect(() => normalMatrixCovariance(jac, new Map(), (c) => new Error(`column ${c}`))).toThrow(
      /column [01]/,
    );
    const flat = new Matrix([
      [1, 0],
      [2, 0],
    ]);
    expect(() => normalMatrixCovariance(flat, new Map(), (c) => new Error(`column ${c}`))).toThrow(
      'column 1',
    );
  });
});

describe('sampledCovariance()', () => {
  it('sampledCovariance() recovers the correlation of a bivariate normal sample, scaled by the given sigmas', () => {
    // x = z₁, y = ρ·z₁ + √(1 − ρ²)·z₂ has correlation ρ (the usual construction; common practice, no
    // source). With n = 20 000 the sample correlation's spread is (1 − ρ²)/√n ≈ 0.0045 (Bevington &
    // Robinson, 3rd ed., §11.2, from memory); tolerance 0.02.
    const normal = gaussian(mulberry32(11));
    const rho = -0.6;
    const n = 20_000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const z1 = normal();
      const z2 = normal();
      x[i] = 3 + 2 * z1;
      y[i] = -1 + 5 * (rho * z1 + Math.sqrt(1 - rho * rho) * z2);
    }
    const cov = sampledCovariance([x, y], [2, 5]);
    expect(cov[0]![0]).toBe(4);
    expect(cov[1]![1]).toBe(25);
    expectClose(cov[0]![1]! / 10, rho, 0.02);
    expect(cov[1]![0]).toBe(cov[0]![1]);
  });

  it('sampledCovariance() gives a parameter with σ = 0 a row and column of zeros', () => {
    const cov = sampledCovariance([Float64Array.from([1, 2, 3]), Float64Array.from([5, 5, 5])], [1, 0]);
    expect(cov).toEqual([
      [1, 0],
      [0, 0],
    ]);
  });
});

describe('propagateCovariance()', () => {
  it('propagateCovariance() gives the variance of a sum and of a product to first order', () => {
    // Taylor, An Introduction to Error Analysis, 2nd ed., 1997, eq. 9.9 (from memory):
    // σq² = Σ (∂q/∂xᵢ)(∂q/∂xⱼ) σᵢⱼ. For q = x + y: σx² + σy² + 2σxy; for q = x·y at (x, y):
    // y²σx² + x²σy² + 2xyσxy.
    const cov = [
      [4, -1.5],
      [-1.5, 9],
    ];
    expectClose(propagateCovariance(cov, [[1, 1]])[0]![0]!, 4 + 9 - 3, 1e-12);
    const x = 2;
    const y = -3;
    expectClose(propagateCovariance(cov, [[y, x]])[0]![0]!, y * y * 4 + x * x * 9 + 2 * x * y * -1.5, 1e-12);
  });
});
