import { describe, expect, it } from 'vitest';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { contactTimeSigma } from '../../src/placement/contact-time-sigma.js';
import { expectClose } from '../expect-close.js';

/**
 * The two times a track p(t) = p0 + v·t meets the circle |p − δ| = R, found by bisection on the distance
 * itself (no decomposition into along- and cross-track parts): an independent check of the formula.
 */
function contactsByBisection(
  p0: { f: number; g: number },
  v: { f: number; g: number },
  delta: { f: number; g: number },
  radiusKm: number,
): [number, number] | null {
  const distance = (t: number) => Math.hypot(p0.f + v.f * t - delta.f, p0.g + v.g * t - delta.g);
  const speed2 = v.f * v.f + v.g * v.g;
  const tMin = -((p0.f - delta.f) * v.f + (p0.g - delta.g) * v.g) / speed2;
  if (distance(tMin) >= radiusKm) return null;
  const root = (inside: number, outside: number) => {
    for (let i = 0; i < 200; i++) {
      const mid = (inside + outside) / 2;
      if (distance(mid) < radiusKm) inside = mid;
      else outside = mid;
    }
    return (inside + outside) / 2;
  };
  return [root(tMin, tMin - 1e6), root(tMin, tMin + 1e6)];
}

function standardDeviation(values: number[]): number {
  const mean = values.reduce((s, x) => s + x, 0) / values.length;
  return Math.sqrt(values.reduce((s, x) => s + (x - mean) ** 2, 0) / (values.length - 1));
}

describe('placement: contact-time sigma', () => {
  it('contactTimeSigma() on the centre line is the along-track shift alone: σ/|v| for both contacts', () => {
    // By hand: d = 0, v along e_f at 20 km/s, σ_f = 10 km: δt = δf/|v|, σ = 0.5 s; σ_g moves the track
    // sideways, which at d = 0 changes the chord's length only to second order.
    const s = contactTimeSigma({
      crossTrackKm: 0,
      radiusKm: 365,
      velocityKmPerS: { f: 20, g: 0 },
      sigmaFKm: 10,
      sigmaGKm: 30,
    });
    expectClose(s.firstSeconds, 0.5, 1e-12);
    expectClose(s.lastSeconds, 0.5, 1e-12);
    expectClose(s.alongTrackSeconds, 0.5, 1e-12);
  });

  it('contactTimeSigma() agrees with contact times solved by bisection for random shifts of the body', () => {
    const normal = gaussian(mulberry32(12));
    const cases = [
      { crossTrackKm: 200, radiusKm: 365, velocityKmPerS: { f: -18.3, g: 6.1 }, sigmaFKm: 6, sigmaGKm: 11 },
      { crossTrackKm: -310, radiusKm: 365, velocityKmPerS: { f: 4.2, g: -21 }, sigmaFKm: 9, sigmaGKm: 3 },
      { crossTrackKm: 800, radiusKm: 1100, velocityKmPerS: { f: 23, g: 0.5 }, sigmaFKm: 12, sigmaGKm: 12 },
    ];
    for (const c of cases) {
      const speed = Math.hypot(c.velocityKmPerS.f, c.velocityKmPerS.g);
      const n = { f: -c.velocityKmPerS.g / speed, g: c.velocityKmPerS.f / speed };
      const p0 = { f: c.crossTrackKm * n.f, g: c.crossTrackKm * n.g };
      const first: number[] = [];
      const last: number[] = [];
      for (let i = 0; i < 4000; i++) {
        const delta = { f: c.sigmaFKm * normal(), g: c.sigmaGKm * normal() };
        const contacts = contactsByBisection(p0, c.velocityKmPerS, delta, c.radiusKm);
        if (!contacts) throw new Error('a 1σ-scale shift took the station off the circle');
        first.push(contacts[0]);
        last.push(contacts[1]);
      }
      const s = contactTimeSigma(c);
      // 4000 draws give the standard deviation to about 1/√(2·4000) ≈ 1.1 % (1σ); allow 5 % plus the
      // second-order terms the formula leaves out.
      expectClose(standardDeviation(first), s.firstSeconds, 0.05 * s.firstSeconds + 0.01);
      expectClose(standardDeviation(last), s.lastSeconds, 0.05 * s.lastSeconds + 0.01);
    }
  });

  it('contactTimeSigma() refuses a track that misses the circle or a station at rest', () => {
    const base = { radiusKm: 365, velocityKmPerS: { f: 20, g: 0 }, sigmaFKm: 5, sigmaGKm: 5 };
    expect(() => contactTimeSigma({ ...base, crossTrackKm: 365 })).toThrow(/does not cross/);
    expect(() => contactTimeSigma({ ...base, crossTrackKm: 0, velocityKmPerS: { f: 0, g: 0 } })).toThrow(
      /does not move/,
    );
  });
});
