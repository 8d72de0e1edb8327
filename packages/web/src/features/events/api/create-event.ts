import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { createEventPayloadSchema } from '@limbus/schema';
import { createBodyPayloadSchema } from '@limbus/schema/bodies';
import { parseDeclination, parseRightAscension } from '@limbus/schema/angles';
import { lineText, TEXT_LIMITS } from '@limbus/schema/text';
import { z } from 'zod';
import { eventsQueryKey } from './get-events';
import { apiRequest } from '@/lib/api-client';
import { parseUtcInput } from '@/lib/utc-text';

const ZONELESS = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?$/;

const rowSchema = z.object({
  time: z.string().regex(ZONELESS, 'time must look like 2028-03-14T02:10:00 (no zone; the scale is chosen)'),
  raDeg: z
    .number({ error: 'RA must be a number' })
    .min(0, 'RA must be within 0–360°')
    .max(360, 'RA must be within 0–360°'),
  decDeg: z
    .number({ error: 'Dec must be a number' })
    .min(-90, 'Dec must be within ±90°')
    .max(90, 'Dec must be within ±90°'),
  distanceKm: z.number({ error: 'distance must be a number' }).positive('distance must be greater than zero'),
});

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, `${what} must be a number`);

// The event file's limits (docs/file-formats.md, "Event file"); stations and chords are added afterwards.
// RA, Dec and the event time arrive here already read from what was typed (see createEventPayloadOf).
export const createEventInputSchema = z.object({
  teamId: z.string().min(1).optional(),
  bodyId: z.string().min(1).optional(),
  newBody: createBodyPayloadSchema.optional(),
  title: lineText(TEXT_LIMITS.eventTitle, 'title'),
  eventTimeUtc: z.string().optional(),
  star: z.object({
    raDeg: z.number(),
    decDeg: z.number(),
    catalogEpochJyear: finite('the catalogue epoch'),
    pmRaCosDecMasPerYear: finite('μα*'),
    pmDecMasPerYear: finite('μδ'),
    parallaxMas: finite('the parallax'),
    angularDiameterMas: finite('the angular diameter')
      .min(0, 'the angular diameter must not be negative')
      .optional(),
  }),
  ephemeris: z.object({
    timeScale: z.enum(['UTC', 'TT', 'TDB']),
    rows: z
      .array(rowSchema)
      .min(4, 'at least 4 rows are needed (the position is interpolated by a cubic spline)'),
  }),
  earthRotation: z.object({
    dut1Seconds: finite('DUT1')
      .min(-0.9, 'DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds')
      .max(0.9, 'DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds'),
  }),
});

export type CreateEventInput = z.infer<typeof createEventInputSchema>;

/** "time, RA, Dec, distance" per line, commas or spaces between; blank lines are skipped. */
export function parseEphemerisLines(
  text: string,
): Array<{ time: string; raDeg: number; decDeg: number; distanceKm: number }> {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== '')
    .map((line) => {
      const [time = '', ra = '', dec = '', distance = ''] = line.split(/[\s,;]+/);
      const num = (s: string) => (s === '' ? Number.NaN : Number(s));
      return { time, raDeg: num(ra), decDeg: num(dec), distanceKm: num(distance) };
    });
}

/** How the event names its body: one of the team's, or a new one made with it. */
export type BodyChoice =
  | { kind: 'existing'; bodyId: string }
  | { kind: 'new'; name: string; designation: string }
  | { kind: 'none' };

/** The create form as typed; every field text, so nothing typed is lost when one is refused. */
export interface CreateEventDraft {
  teamId: string | null;
  body: BodyChoice;
  title: string;
  ra: string;
  dec: string;
  pmRa: string;
  pmDec: string;
  parallax: string;
  epoch: string;
  angularDiameter: string;
  dut1: string;
  eventTime: string;
  timeScale: 'UTC' | 'TT' | 'TDB';
  rows: string;
}

export type FieldErrors = Record<string, string>;

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/**
 * The draft as the API's body, or one message per field, keyed by the field's JSON path as the server
 * names it ("star.raDeg", "newBody.name", "ephemeris.rows"), so both land on the same field.
 */
export function createEventPayloadOf(
  draft: CreateEventDraft,
): { ok: true; input: CreateEventInput } | { ok: false; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const ra = parseRightAscension(draft.ra);
  if (!ra.ok) errors['star.raDeg'] = ra.message;
  const dec = parseDeclination(draft.dec);
  if (!dec.ok) errors['star.decDeg'] = dec.message;
  let eventTimeUtc: string | undefined;
  if (draft.eventTime.trim() !== '') {
    const time = parseUtcInput(draft.eventTime);
    if (time.ok) eventTimeUtc = time.iso;
    else errors.eventTimeUtc = time.message;
  }
  if (draft.body.kind === 'none') errors.bodyId = 'choose the body this event observes, or add a new one';
  const parsed = createEventInputSchema.safeParse({
    ...(draft.teamId === null ? {} : { teamId: draft.teamId }),
    ...(draft.body.kind === 'existing' ? { bodyId: draft.body.bodyId } : {}),
    ...(draft.body.kind === 'new'
      ? {
          newBody: {
            name: draft.body.name,
            ...(draft.body.designation.trim() === '' ? {} : { designation: draft.body.designation }),
          },
        }
      : {}),
    title: draft.title,
    ...(eventTimeUtc === undefined ? {} : { eventTimeUtc }),
    star: {
      raDeg: ra.ok ? ra.deg : 0,
      decDeg: dec.ok ? dec.deg : 0,
      catalogEpochJyear: numberOf(draft.epoch),
      pmRaCosDecMasPerYear: numberOf(draft.pmRa),
      pmDecMasPerYear: numberOf(draft.pmDec),
      parallaxMas: numberOf(draft.parallax),
      ...(draft.angularDiameter.trim() === '' ? {} : { angularDiameterMas: numberOf(draft.angularDiameter) }),
    },
    ephemeris: { timeScale: draft.timeScale, rows: parseEphemerisLines(draft.rows) },
    earthRotation: { dut1Seconds: numberOf(draft.dut1) },
  });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const [first, second, index] = issue.path;
      const key = first === 'ephemeris' && second === 'rows' ? 'ephemeris.rows' : issue.path.join('.');
      errors[key] ??= typeof index === 'number' ? `line ${index + 1}: ${issue.message}` : issue.message;
    }
  }
  if (!parsed.success || Object.keys(errors).length > 0) return { ok: false, errors };
  return { ok: true, input: parsed.data };
}

/**
 * The server's issues on the form's fields: a problem in one ephemeris row ("ephemeris.rows.2.time")
 * goes to the rows field with its line number.
 */
export function fieldErrorsOfIssues(issues: Array<{ path: string; message: string }>): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of issues) {
    const row = /^ephemeris\.rows\.(\d+)/.exec(issue.path);
    if (row?.[1] !== undefined) errors['ephemeris.rows'] ??= `line ${Number(row[1]) + 1}: ${issue.message}`;
    else errors[issue.path] ??= issue.message;
  }
  return errors;
}

const createdSchema = z.object({ id: z.string() });

export function createEvent(input: CreateEventInput): Promise<{ id: string }> {
  // Checked against the server's own schema at compile time, without loading it (it pulls geometry).
  const body: z.input<typeof createEventPayloadSchema> = input;
  return apiRequest('/api/events', { method: 'POST', body, schema: createdSchema });
}

export function useCreateEvent(onCreated: (eventId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createEvent,
    onSuccess: async ({ id }) => {
      // A new body may have come with the event; the team's body lists are invalidated with the events.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: eventsQueryKey }),
        queryClient.invalidateQueries({
          predicate: ({ queryKey: [scope, , part] }) => scope === 'teams' && part === 'bodies',
        }),
      ]);
      onCreated(id);
    },
  });
}
