// The event file ("limbus-event/1"): what observers report, as one JSON document. docs/file-formats.md,
// "Event file", describes every field. The schema applies the defaults; `validateEventFile` adds the
// checks that need more than one field (station references, duplicate ids) and returns every problem.

import { z } from 'zod';

import {
  buildEphemeris,
  GeometryInputError,
  LIMB_PARAMETERS,
  predictionWindow,
  RING_CENTER_SOURCES,
  type EventInput,
  type PredictionSettings,
} from '@limbus/geometry';

import { bodyDesignationSchema, bodyNameSchema } from './bodies.js';
import { parseUtcTime, parseZonelessTime } from './iso-time.js';
import { predictionSettingsSchema } from './prediction.js';
import {
  angularDiameterMasSchema,
  fileParallaxMasSchema,
  fileProperMotionMasPerYearSchema,
  fileStationHeightMSchema,
} from './physical-ranges.js';
import { formatPath, plainErrorMap, problemsFromIssues, type PathSegment, type Problem } from './problems.js';
import {
  EVENT_SIZE_LIMITS,
  eventSizeMessage,
  lineText,
  replaceControlCharacters,
  TEXT_LIMITS,
} from './text.js';

export const EVENT_FORMAT = 'limbus-event/1';

const finite = () => z.number();

/**
 * A UTC time of a chord, ring event or report. Any number of decimals is read, up to the width of the
 * column that stores it (TEXT_LIMITS.utcTime: 19 decimals, far below any clock's resolution).
 */
export const utcTimeSchema = z
  .string()
  .max(
    TEXT_LIMITS.utcTime,
    `at most ${TEXT_LIMITS.utcTime} characters (a time keeps at most ${TEXT_LIMITS.utcTime - 21} decimals)`,
  )
  .refine((s) => parseUtcTime(s) !== null, {
    message: 'not an ISO 8601 UTC time (expected e.g. "2028-03-14T02:11:04.25Z", ending in Z)',
  });

const zonelessTime = z.string().refine((s) => parseZonelessTime(s) !== null, {
  message:
    'not an ISO 8601 time without zone (expected e.g. "2028-03-14T02:10:00"; the scale is ephemeris.timeScale)',
});

const sigmaSeconds = finite().positive('sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)');

const timedMark = z.strictObject({ time: utcTimeSchema, sigmaSeconds });

const latDeg = finite().min(-90, 'latitude must be within ±90°').max(90, 'latitude must be within ±90°');
const lonDeg = finite()
  .min(-180, 'longitude must be within ±180° (east positive)')
  .max(180, 'longitude must be within ±180° (east positive)');
const decDeg = finite()
  .min(-90, 'declination must be within ±90°')
  .max(90, 'declination must be within ±90°');
const raDeg = finite()
  .min(0, 'right ascension must be within 0–360°')
  .max(360, 'right ascension must be within 0–360°');

/** A station id or ring label: one line, at most as long as its database column. */
const label = (what: string) =>
  lineText(what === 'ring label' ? TEXT_LIMITS.ringLabel : TEXT_LIMITS.stationCode, what);

/**
 * Whether time b is not after time a. Zod runs these object-level checks even when a time inside failed
 * its own check; a time that does not parse is reported there, so the order is then not judged.
 */
function notAfter(a: string, b: string): boolean {
  const aSeconds = parseUtcTime(a)?.orderSeconds;
  const bSeconds = parseUtcTime(b)?.orderSeconds;
  return aSeconds !== undefined && bSeconds !== undefined && bSeconds <= aSeconds;
}

/** Said at `chords[i]` of a positive chord with neither edge (geometry's projectEvent says the same). */
export const POSITIVE_CHORD_NEEDS_AN_EDGE = 'a positive chord needs a disappearance, a reappearance or both';

/**
 * A positive chord gives both edges, or only one (a camera started late, a cloud): one limb point, its
 * velocity at that edge's corrected time, its own time standing in for the chord's mid-time.
 */
const positiveChord = z
  .strictObject({
    station: label('station'),
    type: z.literal('positive'),
    disappearance: timedMark.optional(),
    reappearance: timedMark.optional(),
    timeOffsetSeconds: finite().default(0),
  })
  .superRefine((chord, ctx) => {
    if (chord.disappearance === undefined && chord.reappearance === undefined)
      ctx.addIssue({ code: 'custom', path: [], message: POSITIVE_CHORD_NEEDS_AN_EDGE });
    if (
      chord.disappearance !== undefined &&
      chord.reappearance !== undefined &&
      notAfter(chord.disappearance.time, chord.reappearance.time)
    )
      ctx.addIssue({
        code: 'custom',
        path: ['reappearance', 'time'],
        message: `reappearance must come after disappearance (${chord.disappearance.time})`,
      });
  });

const negativeChord = z
  .strictObject({
    station: label('station'),
    type: z.literal('negative'),
    start: utcTimeSchema,
    end: utcTimeSchema,
    timeOffsetSeconds: finite().default(0),
  })
  .superRefine((chord, ctx) => {
    if (notAfter(chord.start, chord.end))
      ctx.addIssue({ code: 'custom', path: ['end'], message: `end must come after start (${chord.start})` });
  });

/** A dip's apparent opacity from its light curve, 1-sigma, and whether it is only a lower limit. */
const dipOpacity = z.strictObject({
  value: finite()
    .gt(0, 'apparentOpacity.value is a fraction of the star light, above 0')
    .max(1, 'apparentOpacity.value is a fraction of the star light, at most 1'),
  sigma: finite().nonnegative('apparentOpacity.sigma must be 0 or more (a 1-σ uncertainty)'),
  lowerLimit: z.boolean().default(false),
});

const ringEvent = z
  .strictObject({
    station: label('station'),
    ring: label('ring label'),
    start: timedMark,
    end: timedMark,
    apparentOpacity: dipOpacity.optional(),
  })
  .superRefine((ring, ctx) => {
    if (notAfter(ring.start.time, ring.end.time))
      ctx.addIssue({
        code: 'custom',
        path: ['end', 'time'],
        message: `end must come after start (${ring.start.time})`,
      });
  });

const ephemerisRow = z.strictObject({
  time: zonelessTime,
  raDeg,
  decDeg,
  distanceKm: finite().positive('distanceKm must be greater than zero'),
});

const ephemeris = z
  .strictObject({
    timeScale: z.enum(['UTC', 'TT', 'TDB']),
    rows: z
      .array(ephemerisRow)
      .min(4, 'at least 4 rows are needed (the position is interpolated by a cubic spline)'),
  })
  .superRefine((eph, ctx) => {
    for (let i = 1; i < eph.rows.length; i++) {
      const previous = parseZonelessTime(eph.rows[i - 1]?.time ?? '')?.orderSeconds;
      const current = parseZonelessTime(eph.rows[i]?.time ?? '')?.orderSeconds;
      if (previous !== undefined && current !== undefined && current <= previous)
        ctx.addIssue({
          code: 'custom',
          path: ['rows', i, 'time'],
          message: 'rows must be in increasing time order (this row is not after the one before)',
        });
    }
  });

const fixedShape = Object.fromEntries(LIMB_PARAMETERS.map((name) => [name, finite().optional()])) as Record<
  (typeof LIMB_PARAMETERS)[number],
  z.ZodOptional<z.ZodNumber>
>;

const fixedParameters = z
  .strictObject(fixedShape, {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `unknown parameter; the parameters that can be fixed are ${LIMB_PARAMETERS.join(', ')}`
        : undefined,
  })
  .superRefine((fixed, ctx) => {
    if (fixed.equatorialRadiusKm !== undefined && !(fixed.equatorialRadiusKm > 0))
      ctx.addIssue({ code: 'custom', path: ['equatorialRadiusKm'], message: 'must be greater than zero' });
    if (fixed.oblateness !== undefined && !(fixed.oblateness >= 0 && fixed.oblateness < 1))
      ctx.addIssue({ code: 'custom', path: ['oblateness'], message: 'must be in [0, 1)' });
  });

const fitOptions = z.strictObject({
  limb: z
    .strictObject({
      fixed: fixedParameters.prefault({}),
      modelErrorKm: finite().min(0, 'modelErrorKm must not be negative').default(0),
      fitTimeOffsets: z.array(label('station')).default([]),
    })
    .prefault({}),
  ring: z.strictObject({ centerFrom: z.enum(RING_CENTER_SOURCES).default('limb') }).prefault({}),
  seed: z.int('seed must be a whole number').optional(),
});

export const eventFileSchema = z.strictObject({
  format: z.literal(EVENT_FORMAT),
  title: lineText(TEXT_LIMITS.eventTitle, 'title'),
  /** The body the event observes; optional, read when the file is imported into a team. */
  body: z.strictObject({ name: bodyNameSchema, designation: bodyDesignationSchema.optional() }).optional(),
  star: z.strictObject({
    raDeg,
    decDeg,
    catalogEpochJyear: finite().default(2016.0),
    pmRaCosDecMasPerYear: fileProperMotionMasPerYearSchema('pmRaCosDecMasPerYear').default(0),
    pmDecMasPerYear: fileProperMotionMasPerYearSchema('pmDecMasPerYear').default(0),
    parallaxMas: fileParallaxMasSchema.default(0),
    angularDiameterMas: angularDiameterMasSchema.optional(),
  }),
  ephemeris,
  earthRotation: z
    .strictObject({
      dut1Seconds: finite()
        .min(-0.9, 'dut1Seconds is UT1 − UTC, kept within ±0.9 s by leap seconds')
        .max(0.9, 'dut1Seconds is UT1 − UTC, kept within ±0.9 s by leap seconds')
        .default(0),
    })
    .prefault({}),
  stations: z.array(
    z.strictObject({ id: label('station id'), latDeg, lonDeg, heightM: fileStationHeightMSchema }),
  ),
  chords: z
    .array(z.discriminatedUnion('type', [positiveChord, negativeChord]))
    .min(1, 'at least one chord is needed'),
  ringEvents: z.array(ringEvent).default([]),
  fit: fitOptions.prefault({}),
  /** What `limbus predict` needs (prediction.ts); a file without it still solves. */
  prediction: predictionSettingsSchema.optional(),
});

export type EventFile = z.output<typeof eventFileSchema>;

/**
 * The same file read for `limbus predict`: an event planned before it happens has no chords yet, so the
 * list may be absent or empty; the `prediction` section is then required (`validatePredictionEventFile`).
 * Solve keeps its own rule, "at least one chord is needed", in `eventFileSchema`.
 */
const predictionEventSchema = eventFileSchema.extend({
  chords: z.array(eventFileSchema.shape.chords.element).default([]),
});

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function arrayAt(value: unknown, key: string): unknown[] {
  if (!isRecord(value)) return [];
  const v = value[key];
  return Array.isArray(v) ? v : [];
}

/**
 * Station references and duplicate ids, read from the raw document so that they are reported even
 * when some other part of the file fails the schema.
 */
function crossReferenceProblems(json: unknown): Problem[] {
  const problems: Problem[] = [];
  const firstIndexOf = new Map<string, number>();
  arrayAt(json, 'stations').forEach((station, i) => {
    if (!isRecord(station) || typeof station.id !== 'string') return;
    const first = firstIndexOf.get(station.id);
    if (first === undefined) firstIndexOf.set(station.id, i);
    else
      problems.push({
        path: formatPath(['stations', i, 'id']),
        message: `duplicate station id "${station.id}" (also stations[${first}])`,
      });
  });
  const known = [...firstIndexOf.keys()];
  const unknownStation = (id: string) =>
    known.length === 0
      ? `unknown station "${id}" (the stations list is empty)`
      : `unknown station "${id}"; stations are ${known.map((k) => `"${k}"`).join(', ')}`;
  const checkReference = (path: PathSegment[], id: unknown) => {
    if (typeof id === 'string' && id.trim() !== '' && !firstIndexOf.has(id))
      problems.push({ path: formatPath(path), message: unknownStation(id) });
  };
  for (const list of ['chords', 'ringEvents'])
    arrayAt(json, list).forEach((item, i) => {
      if (isRecord(item)) checkReference([list, i, 'station'], item.station);
    });
  const fit = isRecord(json) ? json.fit : undefined;
  const limb = isRecord(fit) ? fit.limb : undefined;
  const seen = new Set<string>();
  arrayAt(limb, 'fitTimeOffsets').forEach((id, i) => {
    const path: PathSegment[] = ['fit', 'limb', 'fitTimeOffsets', i];
    checkReference(path, id);
    if (typeof id !== 'string') return;
    if (seen.has(id)) problems.push({ path: formatPath(path), message: `station "${id}" is listed twice` });
    seen.add(id);
  });
  return problems;
}

export type EventValidation =
  | { ok: true; event: EventInput; body: EventFile['body']; prediction: PredictionSettings | undefined }
  | { ok: false; problems: Problem[] };

export type PredictionEventValidation =
  | { ok: true; event: EventInput; body: EventFile['body']; prediction: PredictionSettings }
  | { ok: false; problems: Problem[] };

/**
 * `prediction.from` and `prediction.to` against the ephemeris rows (and the number of path times they
 * give), by the geometry's own rule (`predictionWindow`), located at `prediction.from`, `prediction.to` or
 * `prediction.stepSeconds`. Read from the raw document, so they are reported even when another part of the
 * file fails; the API checks stored settings against an event's ephemeris with the same function.
 */
export function predictionSpanProblems(json: unknown): Problem[] {
  if (!isRecord(json) || json.prediction === undefined) return [];
  const ephemeris = eventFileSchema.shape.ephemeris.safeParse(json.ephemeris);
  const section = predictionSettingsSchema.safeParse(json.prediction);
  if (!ephemeris.success || !section.success) return [];
  try {
    predictionWindow(buildEphemeris(ephemeris.data.rows, ephemeris.data.timeScale), section.data);
  } catch (error) {
    if (error instanceof GeometryInputError && error.path.startsWith('prediction.'))
      return [{ path: error.path, message: error.detail }];
    // Anything else about the rows is the ephemeris' own problem, reported there.
  }
  return [];
}

/** The size limits of one event (EVENT_SIZE_LIMITS), checked before the rows are parsed one by one. */
function sizeProblems(json: unknown): Problem[] {
  const parts = Object.keys(EVENT_SIZE_LIMITS) as Array<keyof typeof EVENT_SIZE_LIMITS>;
  return parts
    .filter((part) => arrayAt(json, part).length > EVENT_SIZE_LIMITS[part])
    .map((part) => ({ path: part, message: eventSizeMessage(part, arrayAt(json, part).length) }));
}

/** Every string of a JSON value with its control characters replaced (see `replaceControlCharacters`). */
function withoutControlCharacters(value: unknown): unknown {
  if (typeof value === 'string') return replaceControlCharacters(value);
  if (Array.isArray(value)) return value.map(withoutControlCharacters);
  if (isRecord(value))
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, withoutControlCharacters(v)]));
  return value;
}

/**
 * Validates an event file and applies its defaults; on failure lists every problem found, by JSON path.
 * With `stored`, the file is one the server validated when it stored it (a fit's frozen input): a text
 * rule or a size limit that came later must not make it unreadable, so control characters are replaced
 * by U+FFFD and the size limits are not applied.
 */
export function validateEventFile(json: unknown, options: { stored?: boolean } = {}): EventValidation {
  return validateEventDocument(json, options, 'solve');
}

/**
 * Validates an event file for `limbus predict`: as `validateEventFile`, except that `chords` may be
 * absent or empty and the `prediction` section is required.
 */
export function validatePredictionEventFile(
  json: unknown,
  options: { stored?: boolean } = {},
): PredictionEventValidation {
  const validation = validateEventDocument(json, options, 'predict');
  if (!validation.ok) return validation;
  const { prediction } = validation;
  if (prediction === undefined)
    return { ok: false, problems: [{ path: 'prediction', message: MISSING_PREDICTION }] };
  return { ...validation, prediction };
}

const MISSING_PREDICTION =
  'missing; predict needs the prediction section, at least { "bodyRadiusKm": … } (docs/file-formats.md)';

function validateEventDocument(
  json: unknown,
  options: { stored?: boolean },
  purpose: 'solve' | 'predict',
): EventValidation {
  if (options.stored) json = withoutControlCharacters(json);
  else {
    const tooLarge = sizeProblems(json);
    // An oversized file is refused before its rows are parsed: that is where the time would go.
    if (tooLarge.length > 0) return { ok: false, problems: tooLarge };
  }
  const schema = purpose === 'predict' ? predictionEventSchema : eventFileSchema;
  const parsed = schema.safeParse(json, { error: plainErrorMap });
  const problems = [
    ...(parsed.success ? [] : problemsFromIssues(parsed.error.issues)),
    ...crossReferenceProblems(json),
    ...predictionSpanProblems(json),
  ];
  if (purpose === 'predict' && isRecord(json) && json.prediction === undefined)
    problems.push({ path: 'prediction', message: MISSING_PREDICTION });
  if (problems.length > 0 || !parsed.success) return { ok: false, problems };
  // This assignment is the compile-time proof that the schema's output fits geometry's EventInput.
  const { body, prediction, ...rest } = parsed.data;
  const event: EventInput = rest;
  return { ok: true, event, body, prediction };
}
