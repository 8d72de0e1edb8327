// Payloads of the event-workspace API (docs/authorization.md lists the routes). The server validates
// with these and the client builds its forms from them, so the two cannot disagree. Event parts reuse
// the event file's own schemas: a star or an ephemeris is checked the same way wherever it comes from.

import { z } from 'zod';

import { bodyNameSchema, createBodyPayloadSchema } from './bodies.js';
import { eventFileSchema, utcTimeSchema } from './event-file.js';
import { parseUtcTime } from './iso-time.js';
import {
  apertureMmSchema,
  exposureSecondsSchema,
  parallaxMasSchema,
  properMotionMasPerYearSchema,
} from './physical-ranges.js';
import { coordinatorStationStatusSchema, siteFields } from './planning.js';
import { messageText } from './team.js';
import { lineText, noteText, TEXT_LIMITS } from './text.js';
import { REPORT_RESULT_VALUES } from './views.js';

const shape = eventFileSchema.shape;

/**
 * The event file's star with the payload's narrower ranges (physical-ranges.ts): a form is held to a
 * catalogue star's values, where a file refuses only the impossible.
 */
const starPayloadSchema = shape.star.extend({
  pmRaCosDecMasPerYear: properMotionMasPerYearSchema('pmRaCosDecMasPerYear').default(0),
  pmDecMasPerYear: properMotionMasPerYearSchema('pmDecMasPerYear').default(0),
  parallaxMas: parallaxMasSchema.default(0),
});

const utcTime = utcTimeSchema;

const timedMark = z.strictObject({
  time: utcTime,
  sigmaSeconds: z.number().positive('sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)'),
});

const orderOf = (time: string | undefined | null): number | undefined =>
  time ? parseUtcTime(time)?.orderSeconds : undefined;

const id = z.string().min(1).max(36);

/**
 * The body comes as `bodyId` (one of the team's) or `newBody` (made with the event); when both are left
 * out the team's only body is taken, and a team with several bodies is asked to choose (400 `bodyId`).
 * The event time defaults to the middle of the ephemeris, in UTC.
 */
export const createEventPayloadSchema = z
  .strictObject({
    teamId: id.optional(),
    bodyId: id.optional(),
    newBody: createBodyPayloadSchema.optional(),
    title: shape.title,
    eventTimeUtc: utcTime.optional(),
    star: starPayloadSchema,
    ephemeris: shape.ephemeris,
    earthRotation: shape.earthRotation,
    fitDefaults: shape.fit,
  })
  .superRefine((body, ctx) => {
    if (body.bodyId !== undefined && body.newBody !== undefined)
      ctx.addIssue({ code: 'custom', path: ['newBody'], message: 'give bodyId or newBody, not both' });
  });
export type CreateEventPayload = z.output<typeof createEventPayloadSchema>;

/** Unwrapped so that a field left out stays out instead of taking its default. */
export const patchEventPayloadSchema = z.strictObject({
  title: shape.title.optional(),
  bodyId: id.optional(),
  eventTimeUtc: utcTime.optional(),
  star: starPayloadSchema.optional(),
  ephemeris: shape.ephemeris.optional(),
  earthRotation: shape.earthRotation.unwrap().optional(),
  fitDefaults: shape.fit.unwrap().optional(),
  /** The event file's `prediction` section, or null to clear it; a coordinator's (docs/authorization.md). */
  prediction: shape.prediction.unwrap().nullable().optional(),
});
export type PatchEventPayload = z.output<typeof patchEventPayloadSchema>;

/** What the latest fit of an event is doing, as the events list filters it. */
export const EVENT_FIT_FILTERS = [
  'none',
  'running',
  'solved',
  'in_review',
  'approved',
  'returned',
  'failed',
] as const;
export type EventFitFilter = (typeof EVENT_FIT_FILTERS)[number];
export const EVENT_SORTS = ['date-desc', 'date-asc', 'title', 'created-desc'] as const;

const flag = z.enum(['true', 'false']).transform((v) => v === 'true');

/** `GET /api/events`: one page of the caller's events, newest event date first unless asked. */
export const eventsQuerySchema = z.strictObject({
  teamId: id.optional(),
  bodyId: id.optional(),
  q: z.string().trim().max(200, 'at most 200 characters').optional(),
  fit: z.enum(EVENT_FIT_FILTERS).optional(),
  awaitingMyReview: flag.optional(),
  /** Deleted (archived) events instead of active ones; coordinators' teams only. */
  archived: flag.optional(),
  sort: z.enum(EVENT_SORTS).default('date-desc'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'at most 100 a page').default(25),
});
export type EventsQuery = z.output<typeof eventsQuerySchema>;

const stationFields = {
  ...siteFields,
  /** `observing` unless given; `planned` for a site placed ahead of the event (planning.ts). */
  status: coordinatorStationStatusSchema.optional(),
  observerId: id.nullable().optional(),
  observerName: lineText(TEXT_LIMITS.stationDetail, 'observer name').nullable().optional(),
  apertureMm: apertureMmSchema.nullable().optional(),
  camera: lineText(TEXT_LIMITS.stationDetail, 'camera').nullable().optional(),
  exposureSeconds: exposureSecondsSchema.nullable().optional(),
  timeSource: lineText(TEXT_LIMITS.stationDetail, 'time source').nullable().optional(),
};
export const createStationPayloadSchema = z.strictObject(stationFields);
export type CreateStationPayload = z.output<typeof createStationPayloadSchema>;
export const patchStationPayloadSchema = createStationPayloadSchema.partial();
export type PatchStationPayload = z.output<typeof patchStationPayloadSchema>;

const ringDip = z
  .strictObject({
    ring: lineText(TEXT_LIMITS.ringLabel, 'ring label'),
    start: timedMark,
    end: timedMark,
  })
  .superRefine((dip, ctx) => {
    const start = orderOf(dip.start.time);
    const end = orderOf(dip.end.time);
    if (start !== undefined && end !== undefined && end <= start)
      ctx.addIssue({ code: 'custom', path: ['end', 'time'], message: 'end must come after start' });
  });

const reportFields = {
  result: z.enum(REPORT_RESULT_VALUES),
  disappearance: timedMark.nullable().optional(),
  reappearance: timedMark.nullable().optional(),
  observedFromUtc: utcTime.nullable().optional(),
  observedToUtc: utcTime.nullable().optional(),
  ringDips: z.array(ringDip).max(50, 'at most 50 dips in one report').optional(),
  /** A positive report whose times are to come from timing its light curve: typed times are optional. */
  timesFromLightCurve: z.boolean().optional(),
  notes: noteText(TEXT_LIMITS.note).nullable().optional(),
};

export interface ReportTimings {
  result: (typeof REPORT_RESULT_VALUES)[number];
  timesFromLightCurve?: boolean | undefined;
  disappearance?: { time: string } | null;
  reappearance?: { time: string } | null;
  observedFromUtc?: string | null;
  observedToUtc?: string | null;
}

/** Said at `disappearance` of a positive report without either time (and not awaiting its light curve). */
export const POSITIVE_REPORT_NEEDS_A_TIME =
  'a positive report needs the disappearance, the reappearance or both (one alone when the camera started late or a cloud hid the other)';

/**
 * What a result needs: a positive at least one of its two timings, in order when both are given (none
 * when its times are to come from its light curve), a negative the span watched. A positive with one
 * time becomes a single-edge chord (docs/file-formats.md, "Event file").
 */
export function reportTimingProblems(report: ReportTimings): Array<{ path: string; message: string }> {
  const problems: Array<{ path: string; message: string }> = [];
  if (report.result === 'positive') {
    const fromCurve = report.timesFromLightCurve === true;
    if (!report.disappearance && !report.reappearance && !fromCurve)
      problems.push({ path: 'disappearance', message: POSITIVE_REPORT_NEEDS_A_TIME });
    const d = orderOf(report.disappearance?.time);
    const r = orderOf(report.reappearance?.time);
    if (d !== undefined && r !== undefined && r <= d)
      problems.push({ path: 'reappearance.time', message: 'reappearance must come after disappearance' });
  }
  if (report.result === 'negative') {
    if (!report.observedFromUtc)
      problems.push({
        path: 'observedFromUtc',
        message: 'a negative report needs the start of the span watched',
      });
    if (!report.observedToUtc)
      problems.push({
        path: 'observedToUtc',
        message: 'a negative report needs the end of the span watched',
      });
    const from = orderOf(report.observedFromUtc);
    const to = orderOf(report.observedToUtc);
    if (from !== undefined && to !== undefined && to <= from)
      problems.push({ path: 'observedToUtc', message: 'the end must come after the start' });
  }
  return problems;
}

export const createReportPayloadSchema = z
  .strictObject({ stationId: z.string().min(1), ...reportFields })
  .superRefine((report, ctx) => {
    for (const p of reportTimingProblems(report))
      ctx.addIssue({ code: 'custom', path: p.path.split('.'), message: p.message });
  });
export type CreateReportPayload = z.output<typeof createReportPayloadSchema>;

/** Checked again against the stored report once merged, since a partial edit may change the result. */
export const patchReportPayloadSchema = z.strictObject(reportFields).partial();
export type PatchReportPayload = z.output<typeof patchReportPayloadSchema>;

export const rejectReportPayloadSchema = z.strictObject({
  reason: noteText(TEXT_LIMITS.reason).refine(
    (s) => s.length > 0,
    'a reason is required so the observer knows what to fix',
  ),
});
export type RejectReportPayload = z.output<typeof rejectReportPayloadSchema>;

/**
 * Accepting a report or a timing writes a chord. When that would replace better-timed values (smaller
 * σ, or times from a light-curve timing) the API answers 409 `replaces-better-timing` saying what, and
 * the caller repeats the request with `replaceTimedChord: true` once the person has agreed.
 */
export const acceptIntoChordPayloadSchema = z
  .strictObject({ replaceTimedChord: z.boolean().default(false) })
  .prefault({});
export type AcceptIntoChordPayload = z.output<typeof acceptIntoChordPayloadSchema>;

/** An observer asks to correct their accepted report; a coordinator sees the change and decides. */
export const reportCorrectionPayloadSchema = z.strictObject({
  changes: z
    .strictObject(reportFields)
    .partial()
    .refine((c) => Object.values(c).some((v) => v !== undefined), 'change at least one field'),
  message: messageText.refine((s) => s.length > 0, 'say what is wrong with the accepted report'),
});
export type ReportCorrectionPayload = z.output<typeof reportCorrectionPayloadSchema>;

/** A chord exactly as the event file states one (station by its id in the event). */
export const chordPayloadSchema = shape.chords.element;
export type ChordPayload = z.output<typeof chordPayloadSchema>;

export const submitFitPayloadSchema = z.strictObject({
  options: z.record(z.string(), z.unknown()).default({}),
});
export type SubmitFitPayload = z.output<typeof submitFitPayloadSchema>;

/** A review request may carry a message to the reviewers (what changed, what to look at). */
export const reviewRequestPayloadSchema = z.strictObject({ message: messageText.default('') }).prefault({});
export type ReviewRequestPayload = z.output<typeof reviewRequestPayloadSchema>;

export const reviewDecisionPayloadSchema = z
  .strictObject({
    decision: z.enum(['approve', 'return']),
    comment: noteText(TEXT_LIMITS.note).default(''),
  })
  .superRefine((review, ctx) => {
    if (review.decision === 'return' && review.comment === '')
      ctx.addIssue({
        code: 'custom',
        path: ['comment'],
        message: 'say what must change before it can be approved',
      });
  });
export type ReviewDecisionPayload = z.output<typeof reviewDecisionPayloadSchema>;

/** The text fields of `POST /api/events/import` beside the file (multipart). */
export const importFieldsSchema = z.strictObject({
  teamId: id.optional(),
  bodyId: id.optional(),
  bodyName: bodyNameSchema.optional(),
});
