import { describe, expect, it } from 'vitest';
import {
  carlsonRD,
  equilibriumDensityKgM3,
  indexSymbols,
  jacobiEllipsoid,
  maclaurinOmega2,
} from '../../src/shape/index.js';
import { G_SI } from '../../src/dynamics/index.js';
import { expectClose } from '../expect-close.js';

describe('carlsonRD()', () => {
  it("carlsonRD() reproduces Carlson's check values", () => {
    // B. C. Carlson, Numerical Algorithms 10 (1995) 13–26, §3 check values (from memory).
    expectClose(carlsonRD(0, 2, 1), 1.7972103521034, 1e-12);
    expectClose(carlsonRD(2, 3, 4), 0.16510527294261, 1e-13);
  });

  it('carlsonRD() equals 1/z^(3/2) at x = y = z', () => {
    // R_D(z, z, z) = (3/2)∫ dt/(t+z)^(5/2) = z^(−3/2), directly from the definition.
    expectClose(carlsonRD(4, 4, 4), 1 / 8, 1e-15);
  });
});

describe('indexSymbols()', () => {
  it('indexSymbols() sum to 2 and are 2/3 each for a sphere', () => {
    // Chandrasekhar, Ellipsoidal Figures of Equilibrium, 1969, ch. 3, §21, eq. (107): ΣA_i = 2.
    const A = indexSymbols(1, 0.7, 0.4);
    expectClose(A.a1 + A.a2 + A.a3, 2, 1e-14);
    const S = indexSymbols(3, 3, 3);
    expectClose(S.a1, 2 / 3, 1e-14);
    expectClose(S.a3, 2 / 3, 1e-14);
  });
});

describe('Maclaurin spheroids', () => {
  it('maclaurinOmega2() agrees with the index-symbol form 2A₁ − 2A₃c²/a²', () => {
    // Chandrasekhar 1969, ch. 5, §32: Ω² = 2(A₁ − A₃ a₃²/a₁²) in units of πGρ.
    for (const e of [0.05, 0.3, 0.6, 0.8127, 0.95]) {
      const c = Math.sqrt(1 - e * e);
      const A = indexSymbols(1, 1, c);
      expectClose(maclaurinOmega2(e), 2 * A.a1 - 2 * A.a3 * c * c, 1e-12);
    }
  });

  it('maclaurinOmega2() peaks at 0.449331 near e = 0.92995 and is 0.374230 at the Jacobi bifurcation', () => {
    // Chandrasekhar 1969, ch. 5, Table I: maximum Ω²/(πGρ) = 0.449331 at e = 0.92995; bifurcation of the
    // Jacobi sequence at e = 0.81267, Ω²/(πGρ) = 0.374230 (from memory).
    expectClose(maclaurinOmega2(0.92995), 0.449331, 2e-6);
    expect(maclaurinOmega2(0.92995)).toBeGreaterThan(maclaurinOmega2(0.925));
    expect(maclaurinOmega2(0.92995)).toBeGreaterThan(maclaurinOmega2(0.935));
    expectClose(maclaurinOmega2(0.81267), 0.37423, 1e-5);
  });

  it('maclaurinOmega2() joins its small-e series smoothly', () => {
    // Either side of the switch at e = 0.1 the two forms must agree to the series' next term.
    const below = maclaurinOmega2(0.1 - 1e-12);
    const above = maclaurinOmega2(0.1 + 1e-12);
    expectClose(below / above, 1, 1e-10);
    // Leading term 8e²/15 (the Maclaurin formula's expansion for slow rotation).
    expectClose(maclaurinOmega2(1e-4) / 1e-8, 8 / 15, 1e-9);
  });
});

describe('Jacobi ellipsoids', () => {
  it('jacobiEllipsoid() meets the Maclaurin sequence at the bifurcation', () => {
    // Chandrasekhar 1969, ch. 6, Table IV, first row: a₂/a₁ = 1, a₃/a₁ = 0.582724, Ω²/(πGρ) = 0.374230
    // (from memory); a₃/a₁ = √(1 − 0.81267²).
    const j = jacobiEllipsoid(1 - 1e-7);
    expectClose(j.cOverA, 0.582724, 2e-6);
    expectClose(j.omega2, 0.37423, 2e-6);
  });

  it('jacobiEllipsoid() reproduces the point where the pear-shaped sequence branches off', () => {
    // Chandrasekhar 1969, ch. 6, §39, Table IV: a₂/a₁ = 0.432232, a₃/a₁ = 0.345069, Ω²/(πGρ) = 0.284030
    // (from memory).
    const j = jacobiEllipsoid(0.432232);
    expectClose(j.cOverA, 0.345069, 2e-6);
    expectClose(j.omega2, 0.28403, 2e-6);
  });

  it('jacobiEllipsoid() rejects a ratio outside (0, 1)', () => {
    expect(() => jacobiEllipsoid(1)).toThrow(RangeError);
    expect(() => jacobiEllipsoid(0)).toThrow(RangeError);
  });
});

describe('equilibriumDensityKgM3()', () => {
  it('equilibriumDensityKgM3() inverts Ω² = q·πGρ', () => {
    const periodS = 6 * 3600;
    const q = maclaurinOmega2(0.7);
    const rho = equilibriumDensityKgM3(q, periodS);
    expectClose((2 * Math.PI) / periodS / Math.sqrt(q * Math.PI * G_SI * rho), 1, 1e-14);
  });
});
