import { describe, expect, it } from 'vitest';

import type { Prediction } from '@limbus/geometry';

import {
  PREDICTION_FORMAT,
  validateEventFile,
  validatePredictionDocument,
  validatePredictionEventFile,
  validatePredictionSettings,
} from '../src/index.js';
import { validEventJson } from './event-fixture.js';

type Json = Record<string, unknown>;

/** The base fixture (rows 02:00–02:30 TDB, two stations) with a prediction section. */
function withPrediction(prediction: unknown, change: (doc: Json) => void = () => {}): Json {
  const doc = { ...validEventJson(), prediction };
  change(doc);
  return doc;
}

function predictProblems(json: unknown): string[] {
  const result = validatePredictionEventFile(json);
  if (result.ok) throw new Error('expected the event file to be refused for predict');
  return result.problems.map((p) => `${p.path}: ${p.message}`);
}

describe('the prediction section', () => {
  it('validateEventFile() keeps a file without prediction valid, and applies the defaults of one with it', () => {
    const without = validateEventFile(validEventJson());
    expect(without.ok && without.prediction).toBe(undefined);
    const result = validateEventFile(withPrediction({ bodyRadiusKm: 555 }));
    if (!result.ok) throw new Error(JSON.stringify(result.problems));
    expect(result.prediction).toEqual({
      bodyRadiusKm: 555,
      uncertaintyMas: { raCosDec: 0, dec: 0 },
      offsetMas: { raCosDec: 0, dec: 0 },
      rings: [],
      stepSeconds: 10,
    });
    // The event handed to the geometry does not carry the section.
    expect('prediction' in result.event).toBe(false);
  });

  it('validatePredictionEventFile() keeps every value given', () => {
    const section = {
      bodyRadiusKm: 555,
      uncertaintyMas: { raCosDec: 8, dec: 12 },
      offsetMas: { raCosDec: -3.5, dec: 4 },
      rings: [{ ring: 'R1', radiusKm: 4100 }],
      stepSeconds: 2.5,
      from: '2028-03-14T02:00:00Z',
      to: '2028-03-14T02:20:00.5Z',
    };
    const result = validatePredictionEventFile(withPrediction(section));
    if (!result.ok) throw new Error(JSON.stringify(result.problems));
    expect(result.prediction).toEqual(section);
  });

  it('validatePredictionEventFile() accepts an event with no chords or an empty list; solve still needs one', () => {
    const absent = withPrediction({ bodyRadiusKm: 555 }, (doc) => delete doc.chords);
    const empty = withPrediction({ bodyRadiusKm: 555 }, (doc) => (doc.chords = []));
    for (const doc of [absent, empty]) {
      const result = validatePredictionEventFile(doc);
      expect(result.ok && result.event.chords).toEqual([]);
    }
    const solve = validateEventFile(empty);
    expect(solve.ok ? [] : solve.problems).toEqual([
      { path: 'chords', message: 'at least one chord is needed' },
    ]);
  });

  it('validatePredictionEventFile() refuses an event without the prediction section, naming it', () => {
    expect(predictProblems(validEventJson())).toEqual([
      'prediction: missing; predict needs the prediction section, at least { "bodyRadiusKm": … } (docs/file-formats.md)',
    ]);
  });

  it('validatePredictionEventFile() still checks the chords it is given', () => {
    const doc = withPrediction({ bodyRadiusKm: 555 }, (d) => ((d.chords as Json[])[1]!.station = 'hilltop'));
    expect(predictProblems(doc)).toContain(
      'chords[1].station: unknown station "hilltop"; stations are "north-ridge", "salt-flat"',
    );
  });

  it('validatePredictionEventFile() refuses unknown keys inside prediction, naming each key', () => {
    const doc = withPrediction({
      bodyRadiusKm: 555,
      bodyRadius: 555,
      uncertaintyMas: { raCosDec: 8, decl: 12, dec: 12 },
      rings: [{ ring: 'R1', radiusKm: 4100, widthKm: 3 }],
    });
    expect(predictProblems(doc).sort()).toEqual([
      'prediction.bodyRadius: unknown field (check the spelling)',
      'prediction.rings[0].widthKm: unknown field (check the spelling)',
      'prediction.uncertaintyMas.decl: unknown field (check the spelling)',
    ]);
  });

  it('validatePredictionEventFile() refuses a missing or non-positive radius, negative σ, a step outside 1–600 s', () => {
    expect(predictProblems(withPrediction({}))).toEqual([
      'prediction.bodyRadiusKm: missing; a number is required',
    ]);
    expect(
      predictProblems(
        withPrediction({
          bodyRadiusKm: 0,
          uncertaintyMas: { raCosDec: -1, dec: 0 },
          rings: [{ ring: 'R1', radiusKm: -5 }],
          stepSeconds: 0.5,
        }),
      ),
    ).toEqual([
      'prediction.bodyRadiusKm: bodyRadiusKm must be greater than zero',
      'prediction.uncertaintyMas.raCosDec: must not be negative (a 1-σ in mas)',
      'prediction.rings[0].radiusKm: radiusKm must be greater than zero',
      'prediction.stepSeconds: stepSeconds must be at least 1',
    ]);
    expect(predictProblems(withPrediction({ bodyRadiusKm: 5, stepSeconds: 601 }))).toEqual([
      'prediction.stepSeconds: stepSeconds must be at most 600',
    ]);
  });

  it('validatePredictionEventFile() refuses from ≥ to, and a ring listed twice', () => {
    const doc = withPrediction({
      bodyRadiusKm: 555,
      from: '2028-03-14T02:20:00Z',
      to: '2028-03-14T02:20:00Z',
      rings: [
        { ring: 'R1', radiusKm: 4100 },
        { ring: 'R1', radiusKm: 4200 },
      ],
    });
    expect(predictProblems(doc)).toEqual([
      'prediction.to: to must come after from (2028-03-14T02:20:00Z)',
      'prediction.rings[1].ring: ring "R1" is listed twice (also rings[0])',
    ]);
  });

  it('validateEventFile() and validatePredictionEventFile() refuse from or to outside the ephemeris rows', () => {
    // Rows 02:00–02:30 TDB = 01:58:50.816–02:28:50.816 UTC (TT − UTC = 69.184 s, IERS Bulletin C; TDB − TT
    // < 2 ms): 01:58:00 UTC is before the first row, 02:29:00 UTC after the last.
    const span = 'outside the ephemeris span 2028-03-14T02:00:00 – 02:30:00 TDB';
    const early = withPrediction({ bodyRadiusKm: 555, from: '2028-03-14T01:58:00Z' });
    expect(predictProblems(early)).toEqual([`prediction.from: ${span}`]);
    const solve = validateEventFile(early);
    expect(solve.ok ? [] : solve.problems).toEqual([{ path: 'prediction.from', message: span }]);
    const late = withPrediction({
      bodyRadiusKm: 555,
      from: '2028-03-14T02:00:00Z',
      to: '2028-03-14T02:29:00Z',
    });
    expect(predictProblems(late)).toEqual([`prediction.to: ${span}`]);
    // Inside by a second at each end.
    const inside = withPrediction({
      bodyRadiusKm: 555,
      from: '2028-03-14T01:58:51Z',
      to: '2028-03-14T02:28:50Z',
    });
    expect(validatePredictionEventFile(inside).ok).toBe(true);
  });

  it('validatePredictionSettings() checks a section alone, under the path prefix asked for', () => {
    const result = validatePredictionSettings({ bodyRadiusKm: -1, extra: 1 }, ['settings']);
    expect(result.ok ? [] : result.problems.map((p) => `${p.path}: ${p.message}`)).toEqual([
      'settings.bodyRadiusKm: bodyRadiusKm must be greater than zero',
      'settings.extra: unknown field (check the spelling)',
    ]);
  });
});

function sampleDocument(): Prediction {
  const point = { timeUtc: '2028-03-14T02:10:00.000Z', latDeg: -24.6, lonDeg: -70.4 };
  return {
    format: 'limbus-prediction/1',
    closestApproach: { timeUtc: '2028-03-14T02:06:14.585Z', distanceKm: 2966.4, speedKmPerS: 22.2 },
    centralLine: [point],
    limits: { left: [point], right: [] },
    rings: [{ ring: 'R1', left: [point], right: [] }],
    stations: [
      {
        station: 'north-ridge',
        closestTimeUtc: '2028-03-14T02:10:00.000Z',
        distanceKm: 0.4,
        crossTrackKm: -0.4,
        sigmaCrossTrackKm: 356.8,
        disappearanceUtc: '2028-03-14T02:09:35.175Z',
        reappearanceUtc: '2028-03-14T02:10:24.824Z',
        rings: [{ ring: 'R1', window: ['2028-03-14T02:06:56.589Z', '2028-03-14T02:13:03.368Z'] }],
        starAltitudeDeg: 24.1,
        sunAltitudeDeg: -42.6,
      },
    ],
  };
}

describe('validatePredictionDocument()', () => {
  it('validatePredictionDocument() accepts a document and keeps it as it was', () => {
    const result = validatePredictionDocument(sampleDocument());
    expect(result.ok && result.prediction).toEqual(sampleDocument());
    expect(PREDICTION_FORMAT).toBe('limbus-prediction/1');
  });

  it('validatePredictionDocument() refuses a wrong format, a half window and a missing altitude, by path', () => {
    const doc = sampleDocument() as unknown as Json & { stations: Json[] };
    doc.format = 'limbus-prediction/2';
    doc.stations[0]!.rings = [{ ring: 'R1', window: ['2028-03-14T02:06:56.589Z'] }];
    delete doc.stations[0]!.sunAltitudeDeg;
    const result = validatePredictionDocument(doc);
    expect(result.ok ? [] : result.problems.map((p) => p.path)).toEqual([
      'format',
      'stations[0].rings[0].window',
      'stations[0].sunAltitudeDeg',
    ]);
  });
});
