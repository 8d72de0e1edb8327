import { describe, expect, expectTypeOf, it } from 'vitest';

import type { EventInput } from '@limbus/geometry';

import { EVENT_SIZE_LIMITS, validateEventFile, type EventFile } from '../src/index.js';
import { validEventJson } from './event-fixture.js';

type Json = Record<string, unknown>;

/** The problems of a document that must fail, as "path: message" lines. */
function problemLines(json: unknown): string[] {
  const result = validateEventFile(json);
  if (result.ok) throw new Error('expected the event file to be refused');
  return result.problems.map((p) => `${p.path}: ${p.message}`);
}

function withChange(change: (doc: Json) => void): Json {
  const doc = validEventJson();
  change(doc);
  return doc;
}

const chords = (doc: Json) => doc.chords as Json[];
const stations = (doc: Json) => doc.stations as Json[];
const positive = (doc: Json) => chords(doc)[0] as Json & { disappearance: Json; reappearance: Json };

describe('validateEventFile()', () => {
  it('validateEventFile() accepts the base fixture and applies every default', () => {
    const result = validateEventFile(validEventJson());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { event } = result;
    expect(event.star).toEqual({
      raDeg: 101.25,
      decDeg: 18.5,
      catalogEpochJyear: 2016.0,
      pmRaCosDecMasPerYear: 0,
      pmDecMasPerYear: 0,
      parallaxMas: 0,
    });
    expect(event.earthRotation).toEqual({ dut1Seconds: 0 });
    expect(event.ringEvents).toEqual([]);
    expect(event.fit).toEqual({
      limb: { fixed: {}, modelErrorKm: 0, fitTimeOffsets: [] },
      ring: { centerFrom: 'limb' },
    });
    expect(event.chords.map((c) => c.timeOffsetSeconds)).toEqual([0, 0]);
  });

  it('validateEventFile() keeps values that are given instead of the defaults', () => {
    const result = validateEventFile(
      withChange((doc) => {
        doc.fit = {
          limb: { fixed: { oblateness: 0 }, modelErrorKm: 2.5 },
          ring: { centerFrom: 'free' },
          seed: 7,
        };
        doc.earthRotation = { dut1Seconds: -0.21 };
        positive(doc).timeOffsetSeconds = 0.4;
      }),
    );
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.event.fit).toEqual({
      limb: { fixed: { oblateness: 0 }, modelErrorKm: 2.5, fitTimeOffsets: [] },
      ring: { centerFrom: 'free' },
      seed: 7,
    });
    expect(result.event.earthRotation.dut1Seconds).toBe(-0.21);
    expect(result.event.chords[0]?.timeOffsetSeconds).toBe(0.4);
  });

  it('validateEventFile() names a missing field and a wrong-typed field by path', () => {
    const lines = problemLines(
      withChange((doc) => {
        delete (doc.star as Json).raDeg;
        stations(doc)[1] = { ...stations(doc)[1], latDeg: '37.9' };
      }),
    );
    expect(lines).toEqual([
      'star.raDeg: missing; a number is required',
      'stations[1].latDeg: expected a number, got the text "37.9"',
    ]);
  });

  it('validateEventFile() refuses latitude outside ±90 and longitude outside ±180', () => {
    const lines = problemLines(
      withChange((doc) => {
        stations(doc)[0] = { ...stations(doc)[0], latDeg: 90.5 };
        stations(doc)[1] = { ...stations(doc)[1], lonDeg: -180.01 };
      }),
    );
    expect(lines).toEqual([
      'stations[0].latDeg: latitude must be within ±90°',
      'stations[1].lonDeg: longitude must be within ±180° (east positive)',
    ]);
  });

  it('validateEventFile() accepts the boundary values ±90 and ±180 themselves', () => {
    const result = validateEventFile(
      withChange((doc) => {
        stations(doc)[0] = { ...stations(doc)[0], latDeg: -90, lonDeg: 180 };
      }),
    );
    expect(result.ok).toBe(true);
  });

  it('validateEventFile() refuses a reappearance before (or at) the disappearance', () => {
    const before = problemLines(
      withChange((doc) => {
        positive(doc).reappearance = { time: '2028-03-14T02:14:03.209Z', sigmaSeconds: 0.05 };
      }),
    );
    expect(before).toEqual([
      'chords[0].reappearance.time: reappearance must come after disappearance (2028-03-14T02:14:03.210Z)',
    ]);
    const equal = problemLines(
      withChange((doc) => {
        positive(doc).reappearance = { time: '2028-03-14T02:14:03.21Z', sigmaSeconds: 0.05 };
      }),
    );
    expect(equal).toHaveLength(1);
  });

  it('validateEventFile() accepts a positive chord with one edge and leaves the other out', () => {
    for (const missing of ['disappearance', 'reappearance'] as const) {
      const result = validateEventFile(
        withChange((doc) => {
          delete (positive(doc) as Json)[missing];
        }),
      );
      if (!result.ok) throw new Error(result.problems.map((p) => `${p.path}: ${p.message}`).join('; '));
      const chord = result.event.chords[0];
      if (chord?.type !== 'positive') throw new Error('the first chord is positive');
      expect(missing in chord).toBe(false);
      expect(chord[missing === 'disappearance' ? 'reappearance' : 'disappearance']).toBeDefined();
    }
  });

  it('validateEventFile() refuses a positive chord with neither edge, naming the chord', () => {
    const lines = problemLines(
      withChange((doc) => {
        const chord: Json = positive(doc);
        delete chord.disappearance;
        delete chord.reappearance;
      }),
    );
    expect(lines).toEqual(['chords[0]: a positive chord needs a disappearance, a reappearance or both']);
  });

  it("validateEventFile() reads a ring dip's apparent opacity and refuses one outside (0, 1]", () => {
    const dip = {
      station: 'north-ridge',
      ring: 'R1',
      start: { time: '2028-03-14T02:13:31.100Z', sigmaSeconds: 0.04 },
      end: { time: '2028-03-14T02:13:31.900Z', sigmaSeconds: 0.04 },
    };
    const result = validateEventFile(
      withChange((doc) => {
        doc.ringEvents = [{ ...dip, apparentOpacity: { value: 0.35, sigma: 0.02 } }];
      }),
    );
    if (!result.ok) throw new Error(result.problems.map((p) => `${p.path}: ${p.message}`).join('; '));
    expect(result.event.ringEvents[0]?.apparentOpacity).toEqual({
      value: 0.35,
      sigma: 0.02,
      lowerLimit: false,
    });
    const lines = problemLines(
      withChange((doc) => {
        doc.ringEvents = [
          { ...dip, apparentOpacity: { value: 0, sigma: 0.02 } },
          { ...dip, apparentOpacity: { value: 1.2, sigma: -1 } },
        ];
      }),
    );
    expect(lines).toEqual([
      'ringEvents[0].apparentOpacity.value: apparentOpacity.value is a fraction of the star light, above 0',
      'ringEvents[1].apparentOpacity.value: apparentOpacity.value is a fraction of the star light, at most 1',
      'ringEvents[1].apparentOpacity.sigma: apparentOpacity.sigma must be 0 or more (a 1-σ uncertainty)',
    ]);
  });

  it('validateEventFile() orders sub-millisecond times correctly', () => {
    const result = validateEventFile(
      withChange((doc) => {
        positive(doc).disappearance = { time: '2028-03-14T02:14:03.2100001Z', sigmaSeconds: 0.05 };
        positive(doc).reappearance = { time: '2028-03-14T02:14:03.2100002Z', sigmaSeconds: 0.05 };
      }),
    );
    expect(result.ok).toBe(true);
  });

  it('validateEventFile() refuses a negative chord whose end is before its start', () => {
    const lines = problemLines(
      withChange((doc) => {
        chords(doc)[1] = { ...chords(doc)[1], end: '2028-03-14T02:09:59Z' };
      }),
    );
    expect(lines).toEqual(['chords[1].end: end must come after start (2028-03-14T02:10:00Z)']);
  });

  it('validateEventFile() refuses chords, ring events and fitTimeOffsets naming an unknown station', () => {
    const lines = problemLines(
      withChange((doc) => {
        chords(doc)[1] = { ...chords(doc)[1], station: 'salt-flats' };
        doc.ringEvents = [
          {
            station: 'lighthouse',
            ring: 'R1',
            start: { time: '2028-03-14T02:12:00Z', sigmaSeconds: 0.1 },
            end: { time: '2028-03-14T02:12:00.4Z', sigmaSeconds: 0.1 },
          },
        ];
        doc.fit = { limb: { fitTimeOffsets: ['north-ridge', 'ridge'] } };
      }),
    );
    expect(lines).toEqual([
      'chords[1].station: unknown station "salt-flats"; stations are "north-ridge", "salt-flat"',
      'ringEvents[0].station: unknown station "lighthouse"; stations are "north-ridge", "salt-flat"',
      'fit.limb.fitTimeOffsets[1]: unknown station "ridge"; stations are "north-ridge", "salt-flat"',
    ]);
  });

  it('validateEventFile() refuses duplicate station ids, naming the first one', () => {
    const lines = problemLines(
      withChange((doc) => {
        stations(doc).push({ id: 'north-ridge', latDeg: 1, lonDeg: 2, heightM: 3 });
      }),
    );
    expect(lines).toEqual(['stations[2].id: duplicate station id "north-ridge" (also stations[0])']);
  });

  it('validateEventFile() refuses zero and negative sigma', () => {
    const lines = problemLines(
      withChange((doc) => {
        positive(doc).disappearance = { time: '2028-03-14T02:14:03.210Z', sigmaSeconds: 0 };
        positive(doc).reappearance = { time: '2028-03-14T02:14:41.870Z', sigmaSeconds: -0.1 };
      }),
    );
    expect(lines).toEqual([
      'chords[0].disappearance.sigmaSeconds: sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)',
      'chords[0].reappearance.sigmaSeconds: sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)',
    ]);
  });

  it('validateEventFile() refuses an empty chord list', () => {
    expect(problemLines(withChange((doc) => (doc.chords = [])))).toEqual([
      'chords: at least one chord is needed',
    ]);
  });

  it('validateEventFile() refuses malformed chord times, including times without Z and impossible dates', () => {
    const lines = problemLines(
      withChange((doc) => {
        positive(doc).disappearance = { time: '2028-03-14 02:14:03Z', sigmaSeconds: 0.05 };
        positive(doc).reappearance = { time: '2028-03-14T02:14:41.870', sigmaSeconds: 0.05 };
        chords(doc)[1] = { ...chords(doc)[1], start: '2028-02-30T02:10:00Z' };
      }),
    );
    const message = 'not an ISO 8601 UTC time (expected e.g. "2028-03-14T02:11:04.25Z", ending in Z)';
    expect(lines).toEqual([
      `chords[0].disappearance.time: ${message}`,
      `chords[0].reappearance.time: ${message}`,
      `chords[1].start: ${message}`,
    ]);
  });

  it('validateEventFile() refuses an ephemeris time with a zone, and rows out of order', () => {
    const lines = problemLines(
      withChange((doc) => {
        const rows = (doc.ephemeris as { rows: Json[] }).rows;
        rows[0] = { ...rows[0], time: '2028-03-14T02:00:00Z' };
      }),
    );
    expect(lines).toEqual([
      'ephemeris.rows[0].time: not an ISO 8601 time without zone (expected e.g. "2028-03-14T02:10:00"; the scale is ephemeris.timeScale)',
    ]);
    const disorder = problemLines(
      withChange((doc) => {
        const rows = (doc.ephemeris as { rows: Json[] }).rows;
        rows.push({ ...rows[3] });
      }),
    );
    expect(disorder).toEqual([
      'ephemeris.rows[4].time: rows must be in increasing time order (this row is not after the one before)',
    ]);
  });

  it('validateEventFile() refuses an ephemeris of fewer than 4 rows', () => {
    const lines = problemLines(
      withChange((doc) => {
        const rows = (doc.ephemeris as { rows: Json[] }).rows;
        rows.splice(1, 1);
      }),
    );
    expect(lines).toEqual([
      'ephemeris.rows: at least 4 rows are needed (the position is interpolated by a cubic spline)',
    ]);
  });

  it('validateEventFile() refuses a wrong format tag and a wrong time scale', () => {
    const lines = problemLines(
      withChange((doc) => {
        doc.format = 'limbus-event/2';
        (doc.ephemeris as Json).timeScale = 'UT1';
      }),
    );
    expect(lines).toEqual([
      'format: expected "limbus-event/1", got the text "limbus-event/2"',
      'ephemeris.timeScale: expected one of "UTC", "TT" or "TDB", got the text "UT1"',
    ]);
  });

  it('validateEventFile() refuses unknown fixed-parameter names and unknown fields', () => {
    const lines = problemLines(
      withChange((doc) => {
        doc.fit = { limb: { fixed: { radiusKm: 120, oblateness: 1.2 } } };
        positive(doc).timeOffsetSecond = 0.2;
      }),
    );
    expect(lines).toEqual([
      'chords[0].timeOffsetSecond: unknown field (check the spelling)',
      'fit.limb.fixed.radiusKm: unknown parameter; the parameters that can be fixed are centerFKm, centerGKm, equatorialRadiusKm, oblateness, positionAngleDeg',
      'fit.limb.fixed.oblateness: must be in [0, 1)',
    ]);
  });

  it('validateEventFile() checks the value of a fixed parameter once its names are right', () => {
    const lines = problemLines(withChange((doc) => (doc.fit = { limb: { fixed: { oblateness: 1.2 } } })));
    expect(lines).toEqual(['fit.limb.fixed.oblateness: must be in [0, 1)']);
  });

  it('validateEventFile() refuses a chord type that is neither positive nor negative', () => {
    const lines = problemLines(withChange((doc) => (chords(doc)[1] = { ...chords(doc)[1], type: 'miss' })));
    expect(lines).toEqual(['chords[1].type: expected "positive" or "negative", got the text "miss"']);
  });

  it('validateEventFile() lists every problem of a file with many, not only the first', () => {
    const lines = problemLines(
      withChange((doc) => {
        doc.format = 'event';
        stations(doc)[0] = { ...stations(doc)[0], latDeg: 95 };
        chords(doc)[1] = { ...chords(doc)[1], station: 'nowhere' };
        positive(doc).disappearance = { time: 'soon', sigmaSeconds: 0 };
      }),
    );
    expect(lines.map((l) => l.split(':')[0])).toEqual([
      'format',
      'stations[0].latDeg',
      'chords[0].disappearance.time',
      'chords[0].disappearance.sigmaSeconds',
      'chords[1].station',
    ]);
  });

  it('validateEventFile() refuses a document that is not an object', () => {
    expect(problemLines([1, 2])).toEqual(['(top level): expected an object, got a list']);
  });

  it('validateEventFile() output type is assignable to geometry EventInput', () => {
    expectTypeOf<EventFile>().toExtend<EventInput>();
    expectTypeOf<EventInput>().toExtend<EventFile>();
  });
});

describe('validateEventFile() size limits and stored files', () => {
  it('validateEventFile() refuses more than EVENT_SIZE_LIMITS stations, chords or ring events, naming the list', () => {
    const doc = withChange((d) => {
      d.chords = Array.from({ length: EVENT_SIZE_LIMITS.chords + 1 }, () => chords(d)[0]);
      d.ringEvents = Array.from({ length: EVENT_SIZE_LIMITS.ringEvents + 1 }, () => ({}));
    });
    expect(problemLines(doc)).toEqual([
      'chords: an event holds at most 2000 chords; this would make 2001',
      'ringEvents: an event holds at most 5000 ring events; this would make 5001',
    ]);
    const atLimit = withChange((d) => {
      d.chords = Array.from({ length: EVENT_SIZE_LIMITS.chords }, () => chords(d)[0]);
    });
    expect(validateEventFile(atLimit).ok).toBe(true);
  });

  it('validateEventFile(json, { stored: true }) reads a stored file with control characters and beyond the limits', () => {
    const doc = withChange((d) => {
      d.title = 'Quillon\u0000\u001b';
      d.chords = Array.from({ length: EVENT_SIZE_LIMITS.chords + 1 }, () => chords(d)[0]);
    });
    expect(validateEventFile(doc).ok).toBe(false);
    const stored = validateEventFile(doc, { stored: true });
    if (!stored.ok) throw new Error(JSON.stringify(stored.problems));
    expect(stored.event.title).toBe('Quillon\uFFFD\uFFFD');
    expect(stored.event.chords).toHaveLength(EVENT_SIZE_LIMITS.chords + 1);
  });
});
