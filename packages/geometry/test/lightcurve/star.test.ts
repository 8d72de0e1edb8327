import { describe, expect, it } from 'vitest';
import { starAngularDiameterMasFromVK, starDiameterKmFromMas } from '../../src/lightcurve/star.js';
import { expectClose } from '../expect-close.js';

describe('starAngularDiameterMasFromVK()', () => {
  it('follows the Kervella et al. 2004 (V−K) relation term by term', () => {
    // log θ = 0.0755 (V−K) + 0.5170 − 0.2 K (Kervella et al. 2004, A&A 426, 297; coefficients from memory):
    // at V = K = 0 the diameter is 10^0.517 mas, and each magnitude of K alone divides it by 10^0.2.
    expectClose(starAngularDiameterMasFromVK(0, 0), 10 ** 0.517, 1e-12);
    expectClose(starAngularDiameterMasFromVK(5, 5) / starAngularDiameterMasFromVK(0, 0), 10 ** -1, 1e-12);
    expectClose(starAngularDiameterMasFromVK(1, 0) / starAngularDiameterMasFromVK(0, 0), 10 ** 0.0755, 1e-12);
  });

  it('gives the Sun seen from 10 pc within 5 %', () => {
    // Independent check: the Sun at 10 pc has θ = 2 R☉ / 10 pc, with R☉ = 695 700 km (IAU 2015 Resolution B3)
    // and 1 pc = 3.085 677 6e13 km; its absolute magnitude M_V = 4.81 and colour V−K = 1.56 are from memory.
    const thetaMas = ((2 * 695_700) / (10 * 3.0856776e13)) * (180 / Math.PI) * 3.6e6;
    const vMag = 4.81;
    const kMag = vMag - 1.56;
    const estimate = starAngularDiameterMasFromVK(vMag, kMag);
    expect(Math.abs(estimate / thetaMas - 1)).toBeLessThan(0.05);
  });

  it('projects to kilometres at the body through starDiameterKmFromMas()', () => {
    // 1 mas at 1 AU is 0.7253 km (small-angle: 149 597 870.7 km × 4.8481e-9).
    expectClose(starDiameterKmFromMas(1, 149_597_870.7), 0.72528, 1e-4);
  });
});
