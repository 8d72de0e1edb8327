import { describe, expect, it } from 'vitest';
import { mulberry32 } from '../../src/fit/prng.js';
import {
  type CoverageGap,
  coverageGaps,
  suggestOffsets,
  worstDistanceKm,
} from '../../src/placement/coverage-gaps.js';
import { expectClose } from '../expect-close.js';

/** The largest distance from any offset of the span to its nearest chord, by dense sampling (5 m). */
function sampledWorstDistanceKm(span: { fromKm: number; toKm: number }, chordsKm: number[]): number {
  let worst = 0;
  const steps = Math.round((span.toKm - span.fromKm) * 200);
  for (let i = 0; i <= steps; i++) {
    const x = span.fromKm + i / 200;
    worst = Math.max(worst, Math.min(...chordsKm.map((c) => Math.abs(c - x))));
  }
  return worst;
}

/** Every way of giving `sites` sites to the gaps: the best minimax an exhaustive search finds. */
function exhaustiveWorstKm(gaps: CoverageGap[], sites: number): number {
  let best = Number.POSITIVE_INFINITY;
  const walk = (i: number, left: number, worst: number) => {
    if (i === gaps.length - 1) {
      best = Math.min(best, Math.max(worst, worstDistanceKm(gaps[i] as CoverageGap, left)));
      return;
    }
    for (let k = 0; k <= left; k++)
      walk(i + 1, left - k, Math.max(worst, worstDistanceKm(gaps[i] as CoverageGap, k)));
  };
  walk(0, sites, 0);
  return best;
}

describe('placement: coverage gaps', () => {
  const body = { fromKm: -365, toKm: 365 };

  it('coverageGaps() splits the span at the chords inside it, once per offset, edges marked open', () => {
    // Worked by hand from the definition: chords at −100, 40 (twice) and 500 (outside) in ±365 km.
    const gaps = coverageGaps(body, [40, -100, 40, 500]);
    expect(gaps).toEqual([
      { fromKm: -365, toKm: -100, widthKm: 265, openAt: 'from' },
      { fromKm: -100, toKm: 40, widthKm: 140, openAt: 'none' },
      { fromKm: 40, toKm: 365, widthKm: 325, openAt: 'to' },
    ]);
    expect(coverageGaps(body, [])).toEqual([{ fromKm: -365, toKm: 365, widthKm: 730, openAt: 'both' }]);
    expect(() => coverageGaps({ fromKm: 1, toKm: 1 }, [])).toThrow(/lower to a higher/);
    expect(() => coverageGaps(body, [Number.NaN])).toThrow(/not a number/);
  });

  it('suggestOffsets() spreads three sites over an empty body at ±2R/3 and 0, a sixth of the span from each chord', () => {
    // By hand: a 730 km span with k = 3 sites has its worst point at 730 / (2·3) = 121.67 km, the sites
    // at −365 + 121.67, +2·121.67, +2·121.67.
    const result = suggestOffsets(body, [], 3);
    expect(result.suggestions).toHaveLength(3);
    expectClose(result.suggestions[0]?.crossTrackKm ?? Number.NaN, -243.333, 1e-3);
    expectClose(result.suggestions[1]?.crossTrackKm ?? Number.NaN, 0, 1e-9);
    expectClose(result.suggestions[2]?.crossTrackKm ?? Number.NaN, 243.333, 1e-3);
    expectClose(result.worstDistanceKmAfter, 121.667, 1e-3);
    expect(result.worstDistanceKmBefore).toBe(Number.POSITIVE_INFINITY);
    expectClose(result.largestGapKmAfter, 243.333, 1e-3);
    expectClose(
      sampledWorstDistanceKm(
        body,
        result.suggestions.map((s) => s.crossTrackKm),
      ),
      121.667,
      3e-3,
    );
  });

  it('suggestOffsets() closes the widest gap first, and leaves no site on the limb', () => {
    // Chords at −300 and 300: the middle gap (600 km, worst 300 km) outranks the edge gaps (65 km each).
    const result = suggestOffsets(body, [-300, 300], 1);
    expect(result.suggestions.map((s) => s.crossTrackKm)).toEqual([0]);
    expect(result.suggestions[0]?.gap).toMatchObject({ fromKm: -300, toKm: 300, openAt: 'none' });
    expect(result.largestGapKmBefore).toBe(600);
    expect(result.largestGapKmAfter).toBe(300);
    // An edge gap alone: a chord at 0 leaves two 365 km edge gaps, each worst 365 km; two sites go one
    // each, 365/3 = 121.67 km in from each limb (a gap open at one end: w / (2k + 1)).
    const edges = suggestOffsets(body, [0], 2);
    expect(edges.suggestions.map((s) => Math.round(s.crossTrackKm * 1000) / 1000)).toEqual([
      -243.333, 243.333,
    ]);
  });

  it('suggestOffsets() reaches the minimax an exhaustive search finds, and the sampled worst distance agrees', () => {
    const random = mulberry32(20261204);
    for (let trial = 0; trial < 40; trial++) {
      const chords = Array.from({ length: Math.floor(random() * 6) }, () => -400 + 800 * random());
      const sites = 1 + Math.floor(random() * 5);
      const result = suggestOffsets(body, chords, sites);
      expect(result.suggestions).toHaveLength(sites);
      expectClose(result.worstDistanceKmAfter, exhaustiveWorstKm(result.gapsBefore, sites), 1e-9);
      const all = [
        ...chords.filter((c) => c > body.fromKm && c < body.toKm),
        ...result.suggestions.map((s) => s.crossTrackKm),
      ];
      expectClose(sampledWorstDistanceKm(body, all), result.worstDistanceKmAfter, 3e-3);
    }
  });

  it('suggestOffsets() refuses a negative or fractional number of sites', () => {
    expect(() => suggestOffsets(body, [], -1)).toThrow(/whole number/);
    expect(() => suggestOffsets(body, [], 1.5)).toThrow(/whole number/);
    expect(suggestOffsets(body, [10], 0).suggestions).toEqual([]);
  });
});
