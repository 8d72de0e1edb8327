import { AstroTime, EquatorFromVector, IdentityMatrix, Pivot, RotateVector, Vector } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { skyPlaneBasis } from '../../src/astro/star.js';
import { fromRaDec } from '../../src/astro/vec3.js';
import { ringPolesWithUncertainty } from '../../src/fit/pole-uncertainty.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { DEG } from '../../src/math.js';
import { expectClose } from '../expect-close.js';

const STAR = { raDeg: 250, decDeg: -21 };
const EPOCH = new AstroTime(0);

/**
 * The pole by astronomy-engine's rotations, not by our ring-pole code: the pole is the point 90° + B from
 * the star at position angle P, i.e. (−sin B, cos B·sin P, cos B·cos P) in axes (towards the star, east,
 * north); Pivot about y by −δ then about z by α turns those axes into the equatorial ones (checked below).
 */
function referencePole(bDeg: number, pDeg: number): { raDeg: number; decDeg: number } {
  const rotation = Pivot(Pivot(IdentityMatrix(), 1, -STAR.decDeg), 2, STAR.raDeg);
  const b = bDeg * DEG;
  const p = pDeg * DEG;
  const local = new Vector(-Math.sin(b), Math.cos(b) * Math.sin(p), Math.cos(b) * Math.cos(p), EPOCH);
  const eq = EquatorFromVector(RotateVector(rotation, local));
  return { raDeg: eq.ra * 15, decDeg: eq.dec };
}

function wrapDeg(d: number): number {
  return (((d % 360) + 540) % 360) - 180;
}

describe('ringPolesWithUncertainty()', () => {
  it('referencePole() (astronomy-engine) puts B = −90° on the star, B = 0°, P = 0° north and P = 90° east', () => {
    const star = referencePole(-90, 0);
    expectClose(wrapDeg(star.raDeg - STAR.raDeg), 0, 1e-9);
    expectClose(star.decDeg, STAR.decDeg, 1e-9);
    // North of a star at Dec −21°: Dec 69° on the same meridian; east: on the equator 90° further in RA.
    const north = referencePole(0, 0);
    expectClose(wrapDeg(north.raDeg - STAR.raDeg), 0, 1e-9);
    expectClose(north.decDeg, 90 + STAR.decDeg, 1e-9);
    const east = referencePole(0, 90);
    expectClose(wrapDeg(east.raDeg - (STAR.raDeg + 90)), 0, 1e-9);
    expectClose(east.decDeg, 0, 1e-9);
  });

  it('ringPolesWithUncertainty() matches astronomy-engine poles and a Monte Carlo spread of them', () => {
    const basis = skyPlaneBasis(fromRaDec(STAR.raDeg * DEG, STAR.decDeg * DEG));
    const bDeg = 31;
    const pDeg = 68;
    // (|B|, P) covariance in deg²: σB = 0.05°, σP = 0.08°, correlation 0.4.
    const cov = [
      [0.05 ** 2, 0.4 * 0.05 * 0.08],
      [0.4 * 0.05 * 0.08, 0.08 ** 2],
    ] as const;
    const poles = ringPolesWithUncertainty(basis, bDeg, pDeg, cov);
    const normal = gaussian(mulberry32(5));
    const n = 8000;
    for (const k of [0, 1] as const) {
      const sign = k === 0 ? 1 : -1;
      const ref = referencePole(sign * bDeg, pDeg);
      expectClose(wrapDeg(poles[k].raDeg - ref.raDeg), 0, 1e-9);
      expectClose(poles[k].decDeg, ref.decDeg, 1e-9);
      // Monte Carlo through the reference construction: with σ ≈ 0.1° the pole is linear in (B, P) to
      // ~10⁻³ of σ, so the spread's only error is sampling: 1/√(2n) ≈ 0.8 % on σ, 1/√n ≈ 0.011 on ρ.
      const ra: number[] = [];
      const dec: number[] = [];
      for (let i = 0; i < n; i++) {
        const z1 = normal();
        const z2 = normal();
        const db = 0.05 * z1;
        const dp = 0.08 * (0.4 * z1 + Math.sqrt(1 - 0.16) * z2);
        const q = referencePole(sign * (bDeg + db), pDeg + dp);
        ra.push(wrapDeg(q.raDeg - ref.raDeg));
        dec.push(q.decDeg - ref.decDeg);
      }
      const mean = (v: number[]) => v.reduce((s, x) => s + x, 0) / v.length;
      const mr = mean(ra);
      const md = mean(dec);
      const sr = Math.sqrt(mean(ra.map((x) => (x - mr) ** 2)));
      const sd = Math.sqrt(mean(dec.map((x) => (x - md) ** 2)));
      const rho = mean(ra.map((x, i) => (x - mr) * (dec[i]! - md))) / (sr * sd);
      const u = poles[k].uncertainty!;
      expectClose(u.raDeg, sr, 0.04 * sr);
      expectClose(u.decDeg, sd, 0.04 * sd);
      expectClose(u.correlation, rho, 0.05);
    }
  });

  it('ringPolesWithUncertainty() gives zero sigma for a zero covariance', () => {
    const basis = skyPlaneBasis(fromRaDec(STAR.raDeg * DEG, STAR.decDeg * DEG));
    const poles = ringPolesWithUncertainty(basis, 40, 10, [
      [0, 0],
      [0, 0],
    ]);
    expect(poles[0].uncertainty).toEqual({ raDeg: 0, decDeg: 0, correlation: 0 });
  });
});
