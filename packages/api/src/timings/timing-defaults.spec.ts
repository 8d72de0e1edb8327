import { readFileSync } from 'node:fs';
import path from 'node:path';
import { type EventInput, projectEvent } from '@limbus/geometry';
import { describe, expect, it } from 'vitest';
import { ValidationError } from '../common/domain-errors';
import { timingDefaultsOf } from './timing-defaults';

// The invented example event of docs/examples.
const EXAMPLE = JSON.parse(
  readFileSync(path.resolve(__dirname, '../../../../docs/examples/event-example.json'), 'utf8'),
) as EventInput;

const NO_TIMES = { disappearance: null, reappearance: null };

describe('timingDefaultsOf', () => {
  const chord = EXAMPLE.chords.find((c) => c.type === 'positive');
  if (chord?.type !== 'positive') throw new Error('the example has a positive chord');

  it("takes the speed at the report's own times, equal to the projection's velocity of that chord", () => {
    const defaults = timingDefaultsOf(EXAMPLE, chord.station, chord, 0.5);
    const projected = projectEvent(EXAMPLE).chords.find((c) => c.station === chord.station);
    const v = projected?.velocityKmPerS ?? { f: Number.NaN, g: Number.NaN };
    expect(defaults.atFrom).toBe('report');
    expect(Date.parse(defaults.atUtc)).toBe(
      (Date.parse(chord.disappearance.time) + Date.parse(chord.reappearance.time)) / 2,
    );
    expect(defaults.speedKmPerS).toBeCloseTo(Math.hypot(v.f, v.g), 6);
    expect(defaults.exposureSeconds).toBe(0.5);
  });

  it("without the report's times, falls back to the positive chords' mean mid-time, then to the ephemeris", () => {
    expect(timingDefaultsOf(EXAMPLE, chord.station, NO_TIMES, null).atFrom).toBe('chords');
    const bare = { ...EXAMPLE, chords: [], ringEvents: [] };
    const fromEphemeris = timingDefaultsOf(bare, chord.station, NO_TIMES, null);
    expect(fromEphemeris.atFrom).toBe('ephemeris');
    expect(fromEphemeris.distanceKm).toBeGreaterThan(0);
    expect(fromEphemeris.exposureSeconds).toBeNull();
  });

  it('names the event part to fix when the instant lies outside the ephemeris', () => {
    const late = { ...chord.disappearance, time: '2031-01-01T00:00:00Z' };
    try {
      timingDefaultsOf(EXAMPLE, chord.station, { disappearance: late, reappearance: null }, null);
      expect.unreachable('outside the ephemeris span');
    } catch (error) {
      expect(error).toBeInstanceOf(ValidationError);
      expect((error as ValidationError).issues[0]?.path).toBe('event.ephemeris');
    }
  });
});
