// Hill radius in the Sun's field, r_H = a (m / 3M☉)^(1/3) (Murray & Dermott, Solar System Dynamics, 1999,
// eq. 3.75, from memory), taking a as the present heliocentric distance: a circular-orbit approximation
// that is off by the orbit's eccentricity for bodies far from a circle.
import { AU_KM } from '../math.js';
import { GM_SUN_SI } from './constants.js';

export function hillRadiusKm(gmBodyM3PerS2: number, heliocentricDistanceAu: number): number {
  return heliocentricDistanceAu * AU_KM * Math.cbrt(gmBodyM3PerS2 / (3 * GM_SUN_SI));
}
