// A deterministic starting ellipse from the points alone: the direct least-squares ellipse fit of
// Fitzgibbon, Pilu & Fisher (1999) in the numerically stable form of Halíř & Flusser, "Numerically stable
// direct least squares fitting of ellipses" (WSCG 1998), §3. Not weighted; the refinement weights.

import { EigenvalueDecomposition, Matrix, inverse } from 'ml-matrix';
import { RAD, wrap } from '../math.js';
import type { LimbEllipse, SkyPointKm } from '../types.js';

export function algebraicEllipse(points: readonly SkyPointKm[]): LimbEllipse | null {
  if (points.length < 5) return null;
  // Centred and scaled coordinates keep the scatter matrices well conditioned (Halíř & Flusser §4).
  let mf = 0;
  let mg = 0;
  for (const p of points) {
    mf += p.fKm;
    mg += p.gKm;
  }
  mf /= points.length;
  mg /= points.length;
  let scale = 0;
  for (const p of points) scale = Math.max(scale, Math.abs(p.fKm - mf), Math.abs(p.gKm - mg));
  if (scale === 0) return null;
  const d1 = new Matrix(points.length, 3);
  const d2 = new Matrix(points.length, 3);
  points.forEach((p, i) => {
    const x = (p.fKm - mf) / scale;
    const y = (p.gKm - mg) / scale;
    d1.setRow(i, [x * x, x * y, y * y]);
    d2.setRow(i, [x, y, 1]);
  });
  const s1 = d1.transpose().mmul(d1);
  const s2 = d1.transpose().mmul(d2);
  const s3 = d2.transpose().mmul(d2);
  let t: Matrix;
  try {
    t = inverse(s3).mmul(s2.transpose()).mul(-1);
  } catch {
    return null;
  }
  const m = s1.add(s2.mmul(t));
  // Premultiplying by the inverse of the constraint matrix C1 = [[0,0,2],[0,−1,0],[2,0,0]].
  const reduced = new Matrix([
    m.getRow(2).map((v) => v / 2),
    m.getRow(1).map((v) => -v),
    m.getRow(0).map((v) => v / 2),
  ]);
  const eig = new EigenvalueDecomposition(reduced);
  const vectors = eig.eigenvectorMatrix;
  let conic: number[] | null = null;
  for (let j = 0; j < 3; j++) {
    const [a, b, c] = vectors.getColumn(j) as [number, number, number];
    if (eig.imaginaryEigenvalues[j] === 0 && 4 * a * c - b * b > 0) conic = [a, b, c];
  }
  if (!conic) return null;
  const a1 = Matrix.columnVector(conic);
  const a2 = t.mmul(a1).getColumn(0);
  const [A, B, C] = conic as [number, number, number];
  const [D, E, F] = a2 as [number, number, number];
  return conicToEllipse(A, B, C, D, E, F, mf, mg, scale);
}

/** Centre, semi-axes and pole angle of A x² + B xy + C y² + D x + E y + F = 0 (x east, y north). */
function conicToEllipse(
  A: number,
  B: number,
  C: number,
  D: number,
  E: number,
  F: number,
  mf: number,
  mg: number,
  scale: number,
): LimbEllipse | null {
  const den = B * B - 4 * A * C;
  if (den >= 0) return null;
  const x0 = (2 * C * D - B * E) / den;
  const y0 = (2 * A * E - B * D) / den;
  const f0 = A * x0 * x0 + B * x0 * y0 + C * y0 * y0 + D * x0 + E * y0 + F;
  // Eigenvalues of the quadratic form [[A, B/2], [B/2, C]]; the larger one belongs to the shorter axis.
  const mean = (A + C) / 2;
  const half = Math.hypot((A - C) / 2, B / 2);
  const big = mean + half;
  const small = mean - half;
  const semiMinor2 = -f0 / big;
  const semiMajor2 = -f0 / small;
  if (!(semiMinor2 > 0 && semiMajor2 > 0)) return null;
  // Eigenvector of the larger eigenvalue: (B/2, big − A), or (big − C, B/2) when that one vanishes.
  let vx = B / 2;
  let vy = big - A;
  if (Math.hypot(vx, vy) < 1e-12 * Math.max(Math.abs(A), Math.abs(C))) {
    vx = big - C;
    vy = B / 2;
  }
  const semiMajorKm = Math.sqrt(semiMajor2) * scale;
  const semiMinorKm = Math.sqrt(semiMinor2) * scale;
  return {
    centerFKm: mf + x0 * scale,
    centerGKm: mg + y0 * scale,
    equatorialRadiusKm: semiMajorKm,
    oblateness: 1 - semiMinorKm / semiMajorKm,
    positionAngleDeg: wrap(Math.atan2(vx, vy) * RAD, 180),
  };
}
