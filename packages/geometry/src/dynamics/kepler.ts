// Kepler's third law for a test particle or a satellite of negligible mass: n²a³ = GM
// (Murray & Dermott, Solar System Dynamics, 1999, eq. 2.27 with m₂ ≪ m₁, from memory).
import { TAU } from '../math.js';
import { G_SI, KM_PER_M, M_PER_KM } from './constants.js';

/** Semi-major axis of an orbit of period `periodSeconds` about a body of GM `gmM3PerS2`. */
export function semiMajorAxisKm(gmM3PerS2: number, periodSeconds: number): number {
  return Math.cbrt((gmM3PerS2 * periodSeconds * periodSeconds) / (TAU * TAU)) * KM_PER_M;
}

export function orbitalPeriodSeconds(gmM3PerS2: number, semiMajorAxisKmValue: number): number {
  const aM = semiMajorAxisKmValue * M_PER_KM;
  return TAU * Math.sqrt((aM * aM * aM) / gmM3PerS2);
}

/** Mass of the primary from a satellite's orbit, neglecting the satellite's own mass (its ratio to the
 * primary's mass is the relative bias). */
export function massFromOrbitKg(semiMajorAxisKmValue: number, periodSeconds: number): number {
  const aM = semiMajorAxisKmValue * M_PER_KM;
  return (TAU * TAU * aM * aM * aM) / (G_SI * periodSeconds * periodSeconds);
}

export function sphereVolumeKm3(radiusKm: number): number {
  return (4 / 3) * Math.PI * radiusKm ** 3;
}

/** Bulk density of a sphere of the given volume-equivalent radius. */
export function bulkDensityKgM3(massKg: number, radiusKm: number): number {
  return massKg / (sphereVolumeKm3(radiusKm) * 1e9);
}
