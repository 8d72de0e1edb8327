// Roche limits: the distance inside which a satellite of density ρ_m held by self-gravity alone is torn
// apart by the tide of a primary of radius R and bulk density ρ_M, d = k·R·(ρ_M/ρ_m)^(1/3).
import { ROCHE_FLUID_COEFFICIENT, ROCHE_RIGID_COEFFICIENT } from './constants.js';

export function rocheLimitKm(
  coefficient: number,
  bodyRadiusKm: number,
  bodyDensityKgM3: number,
  particleDensityKgM3: number,
): number {
  return coefficient * bodyRadiusKm * Math.cbrt(bodyDensityKgM3 / particleDensityKgM3);
}

export function rocheFluidKm(
  bodyRadiusKm: number,
  bodyDensityKgM3: number,
  particleDensityKgM3: number,
): number {
  return rocheLimitKm(ROCHE_FLUID_COEFFICIENT, bodyRadiusKm, bodyDensityKgM3, particleDensityKgM3);
}

export function rocheRigidKm(
  bodyRadiusKm: number,
  bodyDensityKgM3: number,
  particleDensityKgM3: number,
): number {
  return rocheLimitKm(ROCHE_RIGID_COEFFICIENT, bodyRadiusKm, bodyDensityKgM3, particleDensityKgM3);
}
