import { describe, expect, it } from 'vitest';

import { fresnel, straightEdgeIntensity } from '../../src/lightcurve/fresnel.js';
import { expectClose } from '../expect-close.js';
import { directFresnel } from './synthetic.js';

// Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 7.7, C(x) and S(x) to 7 decimals.
// The values are quoted from memory, so each is also checked against direct Simpson quadrature of
// ∫₀ˣ cos(πt²/2) dt and ∫₀ˣ sin(πt²/2) dt (test/lightcurve/synthetic.ts) below.
const TABLE_7_7: Array<[x: number, c: number, s: number]> = [
  [0.5, 0.4923442, 0.0647324],
  [1.0, 0.7798934, 0.4382591],
  [1.5, 0.4452612, 0.697505],
  [2.0, 0.4882534, 0.3434157],
  [2.5, 0.457413, 0.6191818],
  [3.0, 0.6057208, 0.496313],
  [5.0, 0.5636312, 0.4991914],
];

describe('fresnel()', () => {
  it.each(TABLE_7_7)('fresnel(%s) matches Abramowitz & Stegun Table 7.7', (x, c, s) => {
    const value = fresnel(x);
    expectClose(value.c, c, 6e-8);
    expectClose(value.s, s, 6e-8);
  });

  it.each(TABLE_7_7)('fresnel(%s): the table value itself agrees with direct quadrature', (x, c, s) => {
    const direct = directFresnel(x);
    expectClose(direct.c, c, 6e-8);
    expectClose(direct.s, s, 6e-8);
  });

  // The quadrature's own accumulated Simpson error reaches ~1e-9 by x = 30, hence 1e-8.
  it('fresnel() agrees with direct quadrature to 1e-8 from 0 to 30, on both sides of the series/fraction switch', () => {
    for (let x = 0.013; x < 30; x += 0.0937) {
      const value = fresnel(x);
      const direct = directFresnel(x);
      expectClose(value.c, direct.c, 1e-8);
      expectClose(value.s, direct.s, 1e-8);
    }
    for (const x of [1.4999999, 1.5, 1.5000001]) {
      expectClose(fresnel(x).c, directFresnel(x).c, 1e-9);
      expectClose(fresnel(x).s, directFresnel(x).s, 1e-9);
    }
  });

  it('fresnel() is odd, zero at zero, and tends to ½ with the asymptotic 1/(πx) envelope', () => {
    expect(fresnel(0)).toEqual({ c: 0, s: 0 });
    const a = fresnel(2.7);
    const b = fresnel(-2.7);
    expect(b.c).toBe(-a.c);
    expect(b.s).toBe(-a.s);
    // A&S 7.3.9–7.3.10 with the leading terms of 7.3.27–7.3.28, f ≈ 1/(πx), g ≈ 1/(π²x³):
    // C(x) = ½ + f·sin(πx²/2) − g·cos(πx²/2), S(x) = ½ − f·cos(πx²/2) − g·sin(πx²/2).
    const x = 200.3;
    const f = 1 / (Math.PI * x);
    const g = 1 / (Math.PI ** 2 * x ** 3);
    const phase = (Math.PI / 2) * x * x;
    expectClose(fresnel(x).c, 0.5 + f * Math.sin(phase) - g * Math.cos(phase), 1e-10);
    expectClose(fresnel(x).s, 0.5 - f * Math.cos(phase) - g * Math.sin(phase), 1e-10);
  });
});

describe('straightEdgeIntensity()', () => {
  // Born & Wolf, Principles of Optics, ch. 8 (Fresnel diffraction at a straight edge): a quarter of the
  // unobstructed intensity at the geometric shadow's edge, ~1.37 at the first bright fringe (u ≈ 1.22),
  // tending to 1 on the lit side and 0 deep in the shadow. The fringe figures are from memory.
  it('straightEdgeIntensity() is ¼ at the edge, peaks near 1.37 at u ≈ 1.22, and has the right limits', () => {
    expect(straightEdgeIntensity(0)).toBe(0.25);
    let peakU = 0;
    let peak = 0;
    for (let u = 0.5; u < 2; u += 1e-4) {
      const i = straightEdgeIntensity(u);
      if (i > peak) {
        peak = i;
        peakU = u;
      }
    }
    expectClose(peakU, 1.217, 0.005);
    expectClose(peak, 1.3704, 0.0005);
    expectClose(straightEdgeIntensity(1e4), 1, 1e-4);
    expectClose(straightEdgeIntensity(-1e4), 0, 1e-8);
  });
});
