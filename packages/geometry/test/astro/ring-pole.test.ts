import { describe, it } from 'vitest';
import { ringAnglesFromPole, ringPoleVector, ringPoles } from '../../src/astro/ring-pole.js';
import { skyPlaneBasis } from '../../src/astro/star.js';
import { dot, fromRaDec, norm, type Vec3 } from '../../src/astro/vec3.js';
import { DEG, RAD } from '../../src/math.js';
import { expectClose } from '../expect-close.js';

/** Ecliptic (λ, β) → equatorial unit vector with obliquity ε (Meeus, Astronomical Algorithms, eq. 13.3–13.4). */
function fromEcliptic(lambdaDeg: number, betaDeg: number, epsilonDeg: number): Vec3 {
  const l = lambdaDeg * DEG;
  const b = betaDeg * DEG;
  const e = epsilonDeg * DEG;
  const x = Math.cos(b) * Math.cos(l);
  const y = Math.cos(b) * Math.sin(l);
  const z = Math.sin(b);
  return [x, y * Math.cos(e) - z * Math.sin(e), y * Math.sin(e) + z * Math.cos(e)];
}

describe('ring poles', () => {
  it('ringAnglesFromPole() reproduces B = 16.442° and P = 6.741° of Meeus Example 45.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 45.a, JDE 2448972.50068 (the example's planet is not
    // named here). Printed results: B = 16.442°, P = 6.741°. Inputs:
    // - ring plane, eq. 45.1: i = 28.075216° − 0.012998° T + 0.000004° T², Ω = 169.508470° + 1.394681° T + 0.000412° T²;
    // - the Earth's heliocentric l0 = 84.285703°, b0 = 0.000197°, R = 0.98412316 au (the example's step 2;
    //   from memory, equal to the values public ports of the book print for that JDE);
    // - the planet's heliocentric l = 319.193396°, b = −1.075279°, r = 9.867827 au at that JDE from the
    //   book's truncated VSOP87 (as tabulated in the AA+ port's tests), moved back by the light time with a
    //   mean motion of 0.03337°/day (Kepler's third law; the 0.002° shift is known to ~1e-4°);
    // - the pole at λ0 = Ω − 90°, β0 = 90° − i (step 11), equatorial with the mean obliquity of eq. 22.2,
    //   ε0 = 23.440207°. Nutation (Δε ≤ 0.003°, Δψ added to both λ's) and the 0.006° aberration of step 12 are
    //   left out: they move P by < 0.005°, and B (computed by Meeus from geometric λ, β) not at all.
    const t = (2_448_972.50068 - 2_451_545) / 36_525;
    const iDeg = 28.075216 - 0.012998 * t + 0.000004 * t * t;
    const omegaDeg = 169.50847 + 1.394681 * t + 0.000412 * t * t;
    const [l0, b0, bigR] = [84.285703 * DEG, 0.000197 * DEG, 0.98412316];
    let delta = 9;
    let geocentric: Vec3 = [0, 0, 0];
    for (let k = 0; k < 3; k++) {
      const tauDays = 0.0057755183 * delta;
      const l = (319.193396 - 0.03337 * tauDays) * DEG;
      const b = -1.075279 * DEG;
      const r = 9.867827;
      geocentric = [
        r * Math.cos(b) * Math.cos(l) - bigR * Math.cos(b0) * Math.cos(l0),
        r * Math.cos(b) * Math.sin(l) - bigR * Math.cos(b0) * Math.sin(l0),
        r * Math.sin(b) - bigR * Math.sin(b0),
      ];
      delta = norm(geocentric);
    }
    const lambda = Math.atan2(geocentric[1], geocentric[0]) * RAD;
    const beta = Math.asin(geocentric[2] / delta) * RAD;
    const epsilonDeg = 23.440207;
    const basis = skyPlaneBasis(fromEcliptic(lambda, beta, epsilonDeg));
    const angles = ringAnglesFromPole(basis, fromEcliptic(omegaDeg - 90, 90 - iDeg, epsilonDeg));
    expectClose(angles.openingAngleRad * RAD, 16.442, 0.002);
    expectClose(angles.positionAngleRad * RAD, 6.741, 0.006);
    // And back: the pole rebuilt from the printed B and P lies within 0.01° of the ring plane's pole.
    const rebuilt = ringPoleVector(basis, 16.442 * DEG, 6.741 * DEG);
    const pole = fromEcliptic(omegaDeg - 90, 90 - iDeg, epsilonDeg);
    expectClose(Math.acos(Math.min(1, dot(rebuilt, pole))) * RAD, 0, 0.01);
  });

  it('ringPoleVector() inverts B and P as written with the formulas of Meeus Example 45.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 45.a (JDE 2448972.50068): ring plane from eq. 45.1,
    // i = 28.075216° − 0.012998° T, Ω = 169.508470° + 1.394681° T; pole at λ0 = Ω − 90°, β0 = 90° − i
    // (step 11). B from step 6, sin B = sin i cos β sin(λ − Ω) − cos i sin β, and P from step 15,
    // tan P = cos δ0 sin(α0 − α) / (sin δ0 cos δ − cos δ0 sin δ cos(α0 − α)), written out here separately
    // from src/astro/ring-pole.ts, for an invented body direction (λ, β), to 1e-12.
    const t = (2_448_972.50068 - 2_451_545) / 36_525;
    const iDeg = 28.075216 - 0.012998 * t;
    const omegaDeg = 169.50847 + 1.394681 * t;
    const epsilonDeg = 23.4393;
    const [lambda, beta] = [316.2, -1.8];
    const sinB =
      Math.sin(iDeg * DEG) * Math.cos(beta * DEG) * Math.sin((lambda - omegaDeg) * DEG) -
      Math.cos(iDeg * DEG) * Math.sin(beta * DEG);
    const pole = fromEcliptic(omegaDeg - 90, 90 - iDeg, epsilonDeg);
    const s = fromEcliptic(lambda, beta, epsilonDeg);
    const a0 = Math.atan2(pole[1], pole[0]);
    const d0 = Math.asin(pole[2]);
    const a = Math.atan2(s[1], s[0]);
    const d = Math.asin(s[2]);
    const p = Math.atan2(
      Math.cos(d0) * Math.sin(a0 - a),
      Math.sin(d0) * Math.cos(d) - Math.cos(d0) * Math.sin(d) * Math.cos(a0 - a),
    );
    // The observer looks along s towards the body; Meeus' B and P are seen from the Earth, as here.
    const basis = skyPlaneBasis(s);
    const rebuilt = ringPoleVector(basis, Math.asin(sinB), p);
    for (let k = 0; k < 3; k++) expectClose(rebuilt[k]!, pole[k]!, 1e-12);
    const angles = ringAnglesFromPole(basis, pole);
    expectClose(angles.openingAngleRad, Math.asin(sinB), 1e-12);
    expectClose(angles.positionAngleRad, p < 0 ? p + 2 * Math.PI : p, 1e-12);
  });

  it('ringPoles() returns the pole and its mirror through the sky plane, RA in [0, 360)', () => {
    const basis = skyPlaneBasis(fromRaDec(355 * DEG, -10 * DEG));
    const [north, south] = ringPoles(basis, -35, 120);
    const n = fromRaDec(north.raDeg * DEG, north.decDeg * DEG);
    const m = fromRaDec(south.raDeg * DEG, south.decDeg * DEG);
    expectClose(norm(n), 1, 1e-15);
    // B = +35° for poles[0] whatever sign was passed, −35° for poles[1].
    expectClose(Math.asin(-dot(n, basis.s)) * RAD, 35, 1e-9);
    expectClose(Math.asin(-dot(m, basis.s)) * RAD, -35, 1e-9);
    // Same projected direction: both at P = 120°.
    expectClose(ringAnglesFromPole(basis, n).positionAngleRad * RAD, 120, 1e-9);
    expectClose(ringAnglesFromPole(basis, m).positionAngleRad * RAD, 120, 1e-9);
    for (const pole of [north, south]) {
      if (pole.raDeg < 0 || pole.raDeg >= 360) throw new Error(`RA ${pole.raDeg} outside [0, 360)`);
    }
  });

  it('ringPoles() puts an edge-on ring’s poles in the sky plane at P and a face-on ring’s pole at the observer', () => {
    const s = fromRaDec(80 * DEG, 22 * DEG);
    const basis = skyPlaneBasis(s);
    const [edge] = ringPoles(basis, 0, 90);
    const e = fromRaDec(edge.raDeg * DEG, edge.decDeg * DEG);
    // P = 90° is due east: the pole is e_f itself.
    for (let k = 0; k < 3; k++) expectClose(e[k]!, basis.eF[k]!, 1e-12);
    const [face] = ringPoles(basis, 90, 0);
    const f = fromRaDec(face.raDeg * DEG, face.decDeg * DEG);
    for (let k = 0; k < 3; k++) expectClose(f[k]!, -s[k]!, 1e-12);
  });
});
