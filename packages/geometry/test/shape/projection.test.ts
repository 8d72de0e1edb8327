import { describe, expect, it } from 'vitest';
import { DEG } from '../../src/math.js';
import { bodyToEquatorial, projectEllipsoid, skyBasis } from '../../src/shape/index.js';
import { seededNormal } from '../dynamics/random.js';
import { expectClose } from '../expect-close.js';

type V = [number, number, number];

/** Support function of the silhouette in sky direction (cos t, sin t) of (f, g), by brute force over a
 * dense grid of surface points of the ellipsoid: the independent, numerical silhouette. */
function sampledSupportKm(
  axes: { aKm: number; bKm: number; cKm: number },
  m: number[],
  basis: { f: V; g: V },
  directions: number[],
): number[] {
  const best = directions.map(() => -Infinity);
  const nTheta = 500;
  const nPhi = 1000;
  const dirs = directions.map((t) => [Math.cos(t), Math.sin(t)] as const);
  for (let i = 0; i <= nTheta; i++) {
    const theta = (Math.PI * i) / nTheta;
    for (let j = 0; j < nPhi; j++) {
      const phi = (2 * Math.PI * j) / nPhi;
      const xb = axes.aKm * Math.sin(theta) * Math.cos(phi);
      const yb = axes.bKm * Math.sin(theta) * Math.sin(phi);
      const zb = axes.cKm * Math.cos(theta);
      const x = m[0]! * xb + m[1]! * yb + m[2]! * zb;
      const y = m[3]! * xb + m[4]! * yb + m[5]! * zb;
      const z = m[6]! * xb + m[7]! * yb + m[8]! * zb;
      const f = x * basis.f[0] + y * basis.f[1] + z * basis.f[2];
      const g = x * basis.g[0] + y * basis.g[1] + z * basis.g[2];
      for (let k = 0; k < dirs.length; k++) {
        const d = dirs[k]!;
        const h = f * d[0] + g * d[1];
        if (h > best[k]!) best[k] = h;
      }
    }
  }
  return best;
}

describe('projectEllipsoid()', () => {
  it('projectEllipsoid() matches a numerical silhouette sampled from the surface', () => {
    const normal = seededNormal(7);
    const axes = { aKm: 640, bKm: 510, cKm: 395 };
    const directions = Array.from({ length: 24 }, (_, k) => (Math.PI * k) / 12);
    for (let trial = 0; trial < 4; trial++) {
      const m = bodyToEquatorial(normal() * 2, normal(), normal() * 3);
      const basis = skyBasis(normal() * 2, 0.5 * normal());
      const apparent = projectEllipsoid(axes, m, basis);
      const sampled = sampledSupportKm(axes, m, basis, directions);
      // The support function of uᵀKu = 1 in direction d is √(dᵀK⁻¹d).
      const { ff, fg, gg } = apparent.conic;
      const det = ff * gg - fg * fg;
      directions.forEach((t, k) => {
        const [c, s] = [Math.cos(t), Math.sin(t)];
        const support = Math.sqrt((gg * c * c - 2 * fg * c * s + ff * s * s) / det);
        // A 500 × 1000 grid misses the true extreme point by at most ~(π/1000)²/2 of the radius ≈ 3 m.
        expectClose(sampled[k]!, support, 0.01);
        expect(sampled[k]!).toBeLessThanOrEqual(support + 1e-9);
      });
      expect(apparent.semiMajorKm).toBeLessThanOrEqual(640 + 1e-9);
      expect(apparent.semiMinorKm).toBeGreaterThanOrEqual(395 - 1e-9);
    }
  });

  it('projectEllipsoid() gives a spheroid the apparent polar radius √(a²cos²θ + c²sin²θ) along the projected pole', () => {
    // Apparent figure of an oblate spheroid at aspect angle θ between spin axis and line of sight
    // (common practice, no source); the apparent semi-minor axis lies along the projected spin axis.
    const poleRa = 75 * DEG;
    const poleDec = -20 * DEG;
    const starRa = 110 * DEG;
    const starDec = 15 * DEG;
    const basis = skyBasis(starRa, starDec);
    const m = bodyToEquatorial(poleRa, poleDec, 1.234);
    const pole = [m[2], m[5], m[8]] as V;
    const cosTheta = pole[0] * basis.s[0] + pole[1] * basis.s[1] + pole[2] * basis.s[2];
    const apparent = projectEllipsoid({ aKm: 700, bKm: 700, cKm: 450 }, m, basis);
    expectClose(apparent.semiMajorKm, 700, 1e-9);
    expectClose(
      apparent.semiMinorKm,
      Math.sqrt(700 ** 2 * cosTheta ** 2 + 450 ** 2 * (1 - cosTheta ** 2)),
      1e-9,
    );
    const pf = pole[0] * basis.f[0] + pole[1] * basis.f[1] + pole[2] * basis.f[2];
    const pg = pole[0] * basis.g[0] + pole[1] * basis.g[1] + pole[2] * basis.g[2];
    let poleAngle = Math.atan2(pf, pg);
    if (poleAngle < 0) poleAngle += Math.PI;
    expectClose(apparent.positionAngleRad, poleAngle, 1e-12);
  });

  it('bodyToEquatorial() puts the spin axis at the pole and body x at the node at W = 0', () => {
    // Archinal et al. 2018, Fig. 1: the node Q of the body's equator lies at right ascension α₀ + 90°.
    const m = bodyToEquatorial(30 * DEG, 60 * DEG, 0);
    expectClose(m[2], Math.cos(60 * DEG) * Math.cos(30 * DEG), 1e-15);
    expectClose(m[5], Math.cos(60 * DEG) * Math.sin(30 * DEG), 1e-15);
    expectClose(m[8], Math.sin(60 * DEG), 1e-15);
    expectClose(m[0], Math.cos(120 * DEG), 1e-15);
    expectClose(m[3], Math.sin(120 * DEG), 1e-15);
    expectClose(m[6], 0, 1e-15);
  });
});
