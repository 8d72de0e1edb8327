import { MAS_PER_RAD } from '../math.js';

/** Linear diameter of the star's disc projected at the body's distance (small-angle). */
export function starDiameterKmFromMas(angularDiameterMas: number, distanceKm: number): number {
  return (angularDiameterMas / MAS_PER_RAD) * distanceKm;
}
