// Resonance locations for ring particles on circular Keplerian orbits: a particle whose mean motion n is
// p/q of a satellite's n_s lies at a = a_s (q/p)^(2/3), from Kepler's third law n²a³ = GM (Murray &
// Dermott, Solar System Dynamics, 1999, eq. 2.27, and §8.4 for the nominal location of a p:q resonance,
// from memory); one whose orbital period is k spin periods lies at a = (GM (kP)²/4π²)^(1/3).
import { semiMajorAxisKm } from './kepler.js';

/** The k:1 resonances (and 1:k outside the satellite) are always listed up to this k, whatever their order. */
export const K_TO_ONE_MAX = 8;

export interface MeanMotionRatio {
  /** n_particle / n_satellite = p / q. */
  p: number;
  q: number;
  /** |p − q|. */
  order: number;
  /** 'inner' when the particle orbits inside the satellite (p > q). */
  side: 'inner' | 'outer';
}

export function gcd(x: number, y: number): number {
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

/**
 * The context's list: meanMotionRatios(maxOrder, maxInteger), the k:1 and 1:k ratios for k = 2…8 (a ring
 * near an inner 6:1 resonance is third- to seventh-order and missed by an order bound), and every p:q the
 * user named, each once. `named` marks those the user asked for.
 */
export function contextResonanceRatios(
  maxOrder = 2,
  maxInteger = 8,
  named: ReadonlyArray<{ p: number; q: number }> = [],
): Array<MeanMotionRatio & { named: boolean }> {
  const byLabel = new Map<string, MeanMotionRatio & { named: boolean }>();
  const add = (p: number, q: number, isNamed: boolean): void => {
    const label = `${p}:${q}`;
    const known = byLabel.get(label);
    if (known) known.named ||= isNamed;
    else
      byLabel.set(label, { p, q, order: Math.abs(p - q), side: p > q ? 'inner' : 'outer', named: isNamed });
  };
  for (const r of meanMotionRatios(maxOrder, maxInteger)) add(r.p, r.q, false);
  for (let k = 2; k <= K_TO_ONE_MAX; k++) {
    add(k, 1, false);
    add(1, k, false);
  }
  for (const r of named) add(r.p, r.q, true);
  return [...byLabel.values()].sort((x, y) => y.p / y.q - x.p / x.q);
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
