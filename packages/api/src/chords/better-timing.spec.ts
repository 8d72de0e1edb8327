import { describe, expect, it } from 'vitest';
import { betterTimingReplaced, type IncomingChord, type StandingChord } from './better-timing';

const mark = (time: string, sigmaSeconds: number) => ({ time, sigmaSeconds });

const timed: StandingChord = {
  id: 'chord-1',
  station: 'tarrow-knoll',
  type: 'positive',
  source: 'timing',
  timingId: 'timing-1',
  disappearance: mark('2028-03-14T02:14:02.061Z', 0.005),
  reappearance: mark('2028-03-14T02:14:18.357Z', 0.005),
};

const typed: IncomingChord = {
  type: 'positive',
  disappearance: mark('2028-03-14T02:14:02.1Z', 0.5),
  reappearance: mark('2028-03-14T02:14:18.4Z', 0.5),
  timingId: null,
  what: 'the report',
  times: "the report's typed times",
};

describe('betterTimingReplaced', () => {
  it('betterTimingReplaced() refuses typed times over a timed chord and says what both hold', () => {
    const replaced = betterTimingReplaced(timed, typed);
    expect(replaced?.message).toBe(
      "the chord of tarrow-knoll holds times from a light-curve timing (σ 0.005 s); the report's typed times have σ 0.5 s",
    );
    expect(replaced?.detail).toEqual({
      chordId: 'chord-1',
      station: 'tarrow-knoll',
      source: 'timing',
      timingId: 'timing-1',
      current: { disappearance: timed.disappearance, reappearance: timed.reappearance },
      incoming: { disappearance: typed.disappearance, reappearance: typed.reappearance },
    });
  });

  it('betterTimingReplaced() refuses another timing over a timed chord, even a more precise one', () => {
    const other = {
      ...typed,
      timingId: 'timing-2',
      what: 'this timing',
      times: "this timing's times",
      disappearance: mark('2028-03-14T02:14:02.062Z', 0.001),
      reappearance: mark('2028-03-14T02:14:18.356Z', 0.002),
    };
    expect(betterTimingReplaced(timed, other)?.message).toBe(
      "the chord of tarrow-knoll holds times from a light-curve timing (σ 0.005 s); this timing's times have σ 0.001 s at disappearance and 0.002 s at reappearance",
    );
  });

  it('betterTimingReplaced() quotes one σ when both edges round to the same two digits', () => {
    const fitted = { ...timed, disappearance: mark(timed.disappearance?.time ?? '', 0.002114) };
    expect(
      betterTimingReplaced({ ...fitted, reappearance: mark('2028-03-14T02:14:18.357Z', 0.002086) }, typed)
        ?.message,
    ).toBe(
      "the chord of tarrow-knoll holds times from a light-curve timing (σ 0.0021 s); the report's typed times have σ 0.5 s",
    );
  });

  it('betterTimingReplaced() lets the same timing be accepted again, since nothing is replaced', () => {
    expect(
      betterTimingReplaced(timed, {
        ...typed,
        timingId: 'timing-1',
        disappearance: timed.disappearance,
        reappearance: timed.reappearance,
      }),
    ).toBeNull();
  });

  it('betterTimingReplaced() refuses a larger σ at either edge of an untimed chord, and allows an equal or smaller one', () => {
    const imported: StandingChord = {
      ...timed,
      source: 'import',
      timingId: null,
      disappearance: mark('2028-03-14T02:14:02.059Z', 0.04),
      reappearance: mark('2028-03-14T02:14:18.359Z', 0.04),
    };
    const incoming = (dSigma: number, rSigma: number): IncomingChord => ({
      ...typed,
      disappearance: mark('2028-03-14T02:14:02.1Z', dSigma),
      reappearance: mark('2028-03-14T02:14:18.4Z', rSigma),
    });
    expect(betterTimingReplaced(imported, incoming(0.04, 0.05))?.message).toBe(
      "the chord of tarrow-knoll holds imported times with σ 0.04 s; the report's typed times have σ 0.04 s at disappearance and 0.05 s at reappearance",
    );
    expect(betterTimingReplaced(imported, incoming(0.5, 0.01))).not.toBeNull();
    expect(betterTimingReplaced(imported, incoming(0.04, 0.04))).toBeNull();
    expect(betterTimingReplaced(imported, incoming(0.01, 0.02))).toBeNull();
  });

  it('betterTimingReplaced() refuses turning a timed chord negative or removing it, but not an untimed one', () => {
    expect(
      betterTimingReplaced(timed, { ...typed, type: 'negative', disappearance: null, reappearance: null })
        ?.message,
    ).toBe(
      'the chord of tarrow-knoll holds times from a light-curve timing (σ 0.005 s); the report would make it a negative chord',
    );
    expect(
      betterTimingReplaced(timed, {
        ...typed,
        type: null,
        disappearance: null,
        reappearance: null,
        what: 'the corrected report',
      })?.message,
    ).toBe(
      'the chord of tarrow-knoll holds times from a light-curve timing (σ 0.005 s); the corrected report would remove it',
    );
    const reported: StandingChord = { ...timed, source: 'report', timingId: null };
    expect(
      betterTimingReplaced(reported, { ...typed, type: 'negative', disappearance: null, reappearance: null }),
    ).toBeNull();
  });
});
