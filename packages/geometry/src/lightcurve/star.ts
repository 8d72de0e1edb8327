import { MAS_PER_RAD } from '../math.js';

/** Linear diameter of the star's disc projected at the body's distance (small-angle). */
export function starDiameterKmFromMas(angularDiameterMas: number, distanceKm: number): number {
  return (angularDiameterMas / MAS_PER_RAD) * distanceKm;
}

/**
 * Limb-darkened angular diameter of a dwarf or subgiant star from its V and K magnitudes, by the
 * surface-brightness relation of Kervella et al. 2004, A&A 426, 297 (the (V−K) relation for dwarfs and
 * subgiants): log10 θ_LD = 0.0755 (V−K) + 0.5170 − 0.2 K, θ in mas. Coefficients from memory.
 * Interstellar reddening is not corrected; for giants the relation does not hold.
 */
export function starAngularDiameterMasFromVK(vMag: number, kMag: number): number {
  return 10 ** (0.0755 * (vMag - kMag) + 0.517 - 0.2 * kMag);
}
