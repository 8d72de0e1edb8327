// Ring poles. A circular ring of radius R seen at opening angle B projects to an ellipse of semi-axes R
// and R·|sin B|, the semi-minor axis along the projected pole at position angle P (north through east).
// The pole is then p = sin B·(−s) + cos B·(sin P e_f + cos P e_g), the inverse of Meeus, Astronomical
// Algorithms, 2nd ed., ch. 45 (sin B = p·(−s): the observer's latitude above the ring plane; P the
// position angle of the projected pole). |B| and P fix the projected ellipse; the sign of B does not,
// hence two poles, mirror images through the sky plane.
import { RAD, asin, wrap } from '../math.js';
import type { SkyPlaneBasis } from './star.js';
import { dot, toRaDec, type Vec3 } from './vec3.js';

export interface RaDecDeg {
  raDeg: number;
  decDeg: number;
}

export function ringPoleVector(
  basis: SkyPlaneBasis,
  openingAngleRad: number,
  positionAngleRad: number,
): Vec3 {
  const sinB = Math.sin(openingAngleRad);
  const cosB = Math.cos(openingAngleRad);
  const sinP = Math.sin(positionAngleRad);
  const cosP = Math.cos(positionAngleRad);
  const { s, eF, eG } = basis;
  return [
    -sinB * s[0] + cosB * (sinP * eF[0] + cosP * eG[0]),
    -sinB * s[1] + cosB * (sinP * eF[1] + cosP * eG[1]),
    -sinB * s[2] + cosB * (sinP * eF[2] + cosP * eG[2]),
  ];
}

/** B and P (radians, P in [0, 2π)) of a unit pole vector seen along s. */
export function ringAnglesFromPole(
  basis: SkyPlaneBasis,
  pole: Vec3,
): { openingAngleRad: number; positionAngleRad: number } {
  return {
    openingAngleRad: asin(-dot(pole, basis.s)),
    positionAngleRad: wrap(Math.atan2(dot(pole, basis.eF), dot(pole, basis.eG)), 2 * Math.PI),
  };
}

function raDecDeg(v: Vec3): RaDecDeg {
  const { raRad, decRad } = toRaDec(v);
  return { raDeg: wrap(raRad * RAD, 360), decDeg: decRad * RAD };
}

/** poles[0] for B = +|B|, poles[1] for B = −|B|, as ICRS RA in [0, 360) and Dec, degrees. */
export function ringPoles(
  basis: SkyPlaneBasis,
  openingAngleDeg: number,
  positionAngleDeg: number,
): [RaDecDeg, RaDecDeg] {
  const b = Math.abs(openingAngleDeg) / RAD;
  const p = positionAngleDeg / RAD;
  return [raDecDeg(ringPoleVector(basis, b, p)), raDecDeg(ringPoleVector(basis, -b, p))];
}
