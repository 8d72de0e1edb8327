import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { CHI2_MAP_LEVELS, contourSegments, profileGrid, type ProfileSource } from '../../src/fit/chi2-map.js';
import { levenbergMarquardt, sumOfSquares } from '../../src/fit/levenberg-marquardt.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { expectClose } from '../expect-close.js';

describe('CHI2_MAP_LEVELS', () => {
  it('CHI2_MAP_LEVELS are the Δχ² of 68.3, 95.4 and 99.7 % for two parameters of interest', () => {
    // Press et al., Numerical Recipes, 3rd ed., §15.6.5, table of Δχ² as a function of confidence level and
    // degrees of freedom, column ν = 2: 2.30, 6.18, 11.8 (Avni, ApJ 210 (1976) 642, Table 1, the same).
    const table = [2.3, 6.18, 11.8];
    CHI2_MAP_LEVELS.forEach((l, k) => {
      expect(l.sigma).toBe(k + 1);
      expectClose(l.deltaChi2, table[k] as number, 0.05);
    });
    expectClose(CHI2_MAP_LEVELS[1]?.deltaChi2 ?? 0, 6.18, 0.005);
  });
});

describe('contourSegments()', () => {
  it('contourSegments() of r² on a fine grid lie on the circle of the level, to the interpolation error', () => {
    // Linear interpolation of f = x² + y² along an edge of length h is off by at most h²/4 in f, i.e.
    // h²/(8r) in radius (common practice, no source).
    const xs = Array.from({ length: 81 }, (_, i) => -2 + (4 * i) / 80);
    const values = xs.map((y) => xs.map((x) => x * x + y * y));
    const segments = contourSegments(values, xs, xs, 1);
    expect(segments.length).toBeGreaterThan(40);
    const h = 4 / 80;
    for (const [x1, y1, x2, y2] of segments) {
      expectClose(Math.hypot(x1, y1), 1, (h * h) / 8);
      expectClose(Math.hypot(x2, y2), 1, (h * h) / 8);
    }
  });

  it('contourSegments() splits a saddle cell by the mean of its corners and skips cells with a missing corner', () => {
    // Corners 00 = 1, 10 = −1, 11 = 2, 01 = −1 at level 0: the mean 0.25 is on the side of 00 and 11, so the
    // cuts isolate 10 and 01 (Lorensen & Cline's ambiguity resolved by the cell centre, common practice).
    const s = contourSegments(
      [
        [1, -1],
        [-1, 2],
      ],
      [0, 1],
      [0, 1],
      0,
    );
    expect(s).toEqual([
      [0.5, 0, 1, 1 / 3],
      [1 / 3, 1, 0, 0.5],
    ]);
    expect(
      contourSegments(
        [
          [1, null],
          [-1, 2],
        ],
        [0, 1],
        [0, 1],
        0,
      ),
    ).toEqual([]);
  });
});

describe('profileGrid()', () => {
  // A linear model r = (A θ − b)/σ in four parameters: its χ² is exactly quadratic, and the profile over
  // two of them is Δχ² = (θ₂ − θ̂₂)ᵀ C₂⁻¹ (θ₂ − θ̂₂), C₂ their 2 × 2 block of C = (AᵀA)⁻¹ (Press et al.,
  // Numerical Recipes, 3rd ed., §15.6.5: the other parameters minimised away leave the marginal covariance).
  const rows = 30;
  const normal = gaussian(mulberry32(14));
  const truth = [1.5, -2, 0.7, 3];
  const a = Array.from({ length: rows }, (_, i) => [1, i / 10, Math.sin(i), (i / 10) ** 2 + normal() * 0.3]);
  const sigma = Array.from({ length: rows }, (_, i) => 0.5 + (i % 3) * 0.2);
  const b = a.map(
    (row, i) => row.reduce((s, v, j) => s + v * (truth[j] as number), 0) + (sigma[i] as number) * normal(),
  );
  const residuals = (theta: Float64Array): Float64Array =>
    Float64Array.from(
      a,
      (row, i) =>
        (row.reduce((s, v, j) => s + v * (theta[j] as number), 0) - (b[i] as number)) / (sigma[i] as number),
    );
  // Written with ml-matrix, independently of the minimiser: C = (AᵀWA)⁻¹, θ̂ = C AᵀW b.
  const aw = new Matrix(a.map((row, i) => row.map((v) => v / (sigma[i] as number))));
  const bw = Matrix.columnVector(b.map((v, i) => v / (sigma[i] as number)));
  const cov = inverse(aw.transpose().mmul(aw));
  const thetaHat = cov.mmul(aw.transpose()).mmul(bw).getColumn(0);
  const source: ProfileSource = {
    minimise: (held, start) => {
      const free = [0, 1, 2, 3].filter((k) => !held.has(k));
      const toFull = (x: Float64Array): Float64Array => {
        const full = new Float64Array(start);
        free.forEach((k, i) => (full[k] = x[i] as number));
        return full;
      };
      const r = levenbergMarquardt(
        {
          residuals: (x) => residuals(toFull(x)),
          stepSizes: new Float64Array(free.length).fill(1e-4),
          admissible: (x) => x,
        },
        Float64Array.from(free, (k) => start[k] as number),
      );
      return { full: toFull(r.x), chi2: r.chi2, clear: true };
    },
  };
  const chi2Min = sumOfSquares(residuals(Float64Array.from(thetaHat)));
  const [ix, iy] = [1, 3];
  const sx = Math.sqrt(cov.get(ix, ix));
  const sy = Math.sqrt(cov.get(iy, iy));
  const c2 = inverse(
    new Matrix([
      [cov.get(ix, ix), cov.get(ix, iy)],
      [cov.get(iy, ix), cov.get(iy, iy)],
    ]),
  );
  const quadratic = (x: number, y: number): number => {
    const dx = x - (thetaHat[ix] as number);
    const dy = y - (thetaHat[iy] as number);
    return c2.get(0, 0) * dx * dx + 2 * c2.get(0, 1) * dx * dy + c2.get(1, 1) * dy * dy;
  };
  const steps = 41;
  const xs = Array.from(
    { length: steps },
    (_, k) => (thetaHat[ix] as number) + sx * (-4 + (8 * k) / (steps - 1)),
  );
  const ys = Array.from(
    { length: steps },
    (_, k) => (thetaHat[iy] as number) + sy * (-4 + (8 * k) / (steps - 1)),
  );
  const grid = profileGrid(source, Float64Array.from(thetaHat), ix, iy, xs, ys);
  const delta = grid.chi2.map((row) => row.map((c) => (c as number) - chi2Min));

  it('profileGrid() gives the exact profile Δχ² of a linear model at every grid point', () => {
    expect(grid.chi2.flat().every((c) => c !== null)).toBe(true);
    delta.forEach((row, j) =>
      row.forEach((d, i) => expectClose(d, quadratic(xs[i] as number, ys[j] as number), 1e-6 * (1 + d))),
    );
  });

  it('profileGrid() contours are the covariance ellipses, and the 1σ one projects to √2.30 σ on each axis', () => {
    const hx = (8 * sx) / (steps - 1);
    const hy = (8 * sy) / (steps - 1);
    // Linear interpolation of a quadratic along an edge of length h errs by at most f''h²/8, f'' = 2·C₂⁻¹
    // along that edge (common practice, no source).
    const interpolation = Math.max(c2.get(0, 0) * hx * hx, c2.get(1, 1) * hy * hy) / 4;
    for (const level of CHI2_MAP_LEVELS) {
      const segments = contourSegments(delta, xs, ys, level.deltaChi2);
      expect(segments.length).toBeGreaterThan(20);
      // On the ellipse quadratic = Δχ², to the linear interpolation's error along one cell edge.
      for (const [x1, y1, x2, y2] of segments) {
        expectClose(quadratic(x1, y1), level.deltaChi2, interpolation);
        expectClose(quadratic(x2, y2), level.deltaChi2, interpolation);
      }
      // The ellipse's extent along x is ±√Δχ²·σx whatever the correlation (NR3 §15.6.5, Fig. 15.6.4).
      const along = segments.flatMap(([x1, , x2]) => [x1, x2]);
      const half = (Math.max(...along) - Math.min(...along)) / 2;
      expectClose(half / (Math.sqrt(level.deltaChi2) * sx), 1, hx / sx / 2);
    }
  });
});
