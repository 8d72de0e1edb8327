// Resonance locations for ring particles on circular Keplerian orbits.
import { semiMajorAxisKm } from './kepler.js';

export interface MeanMotionRatio {
  /** n_particle / n_satellite = p / q. */
  p: number;
  q: number;
  /** |p − q|. */
  order: number;
  /** 'inner' when the particle orbits inside the satellite (p > q). */
  side: 'inner' | 'outer';
}

function gcd(x: number, y: number): number {
  return y === 0 ? x : gcd(y, x % y);
}

/**
 * The mean-motion ratios p:q (coprime) with 1 ≤ |p − q| ≤ maxOrder and p, q ≤ maxInteger. First-order
 * ratios (n+1):n never exceed 2:1, so a bound on the ratio alone would list infinitely many; bounding both
 * integers by 8 keeps every ratio within 8:1, as the issue asks.
 */
export function meanMotionRatios(maxOrder = 2, maxInteger = 8): MeanMotionRatio[] {
  const ratios: MeanMotionRatio[] = [];
  for (let p = 1; p <= maxInteger; p++) {
    for (let q = 1; q <= maxInteger; q++) {
      const order = Math.abs(p - q);
      if (order === 0 || order > maxOrder || gcd(p, q) !== 1) continue;
      ratios.push({ p, q, order, side: p > q ? 'inner' : 'outer' });
    }
  }
  return ratios.sort((x, y) => y.p / y.q - x.p / x.q);
}

/** Radius where n_particle/n_satellite = p/q: from n ∝ a^(−3/2), a = a_sat (q/p)^(2/3). */
export function meanMotionResonanceKm(satelliteSemiMajorAxisKm: number, p: number, q: number): number {
  return satelliteSemiMajorAxisKm * Math.cbrt((q / p) ** 2);
}

/** Radius where the particle's orbital period is k spin periods: a = (GM (k P)² / 4π²)^(1/3). k = 1 is
 * the synchronous orbit. */
export function spinOrbitResonanceKm(gmM3PerS2: number, spinPeriodSeconds: number, k: number): number {
  return semiMajorAxisKm(gmM3PerS2, k * spinPeriodSeconds);
}
