// Payloads of the event-workspace API (docs/authorization.md lists the routes). The server validates
// with these and the client builds its forms from them, so the two cannot disagree. Event parts reuse
// the event file's own schemas: a star or an ephemeris is checked the same way wherever it comes from.

import { z } from 'zod';

import { eventFileSchema } from './event-file.js';
import { parseUtcTime } from './iso-time.js';

const shape = eventFileSchema.shape;

const utcTime = z.string().refine((s) => parseUtcTime(s) !== null, {
  message: 'not an ISO 8601 UTC time (expected e.g. "2028-03-14T02:11:04.25Z", ending in Z)',
});

const timedMark = z.strictObject({
  time: utcTime,
  sigmaSeconds: z.number().positive('sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)'),
});

const orderOf = (time: string | undefined | null): number | undefined =>
  time ? parseUtcTime(time)?.orderSeconds : undefined;

const text = (max: number) => z.string().trim().max(max, `at most ${max} characters`);

export const createEventPayloadSchema = z.strictObject({
  teamId: z.string().min(1).optional(),
  title: shape.title,
  star: shape.star,
  ephemeris: shape.ephemeris,
  earthRotation: shape.earthRotation,
  fitDefaults: shape.fit,
});
export type CreateEventPayload = z.output<typeof createEventPayloadSchema>;

/** Unwrapped so that a field left out stays out instead of taking its default. */
export const patchEventPayloadSchema = z.strictObject({
  title: shape.title.optional(),
  star: shape.star.optional(),
  ephemeris: shape.ephemeris.optional(),
  earthRotation: shape.earthRotation.unwrap().optional(),
  fitDefaults: shape.fit.unwrap().optional(),
});
export type PatchEventPayload = z.output<typeof patchEventPayloadSchema>;

const stationFields = {
  code: z.string().trim().min(1, 'station id must not be empty').max(100, 'at most 100 characters'),
  latDeg: z.number().min(-90, 'latitude must be within ±90°').max(90, 'latitude must be within ±90°'),
  lonDeg: z
    .number()
    .min(-180, 'longitude must be within ±180° (east positive)')
    .max(180, 'longitude must be within ±180° (east positive)'),
  heightM: z.number(),
  observerId: z.string().min(1).nullable().optional(),
  observerName: text(200).nullable().optional(),
  apertureMm: z.number().positive('apertureMm must be greater than zero').nullable().optional(),
  camera: text(200).nullable().optional(),
  exposureSeconds: z.number().positive('exposureSeconds must be greater than zero').nullable().optional(),
  timeSource: text(200).nullable().optional(),
};
export const createStationPayloadSchema = z.strictObject(stationFields);
export type CreateStationPayload = z.output<typeof createStationPayloadSchema>;
export const patchStationPayloadSchema = createStationPayloadSchema.partial();
export type PatchStationPayload = z.output<typeof patchStationPayloadSchema>;

export const REPORT_RESULT_VALUES = ['positive', 'negative', 'clouded_out', 'technical_failure'] as const;

const ringDip = z
  .strictObject({
    ring: z.string().trim().min(1, 'ring label must not be empty'),
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
  ringDips: z.array(ringDip).optional(),
  notes: text(10_000).nullable().optional(),
};

export interface ReportTimings {
  result: (typeof REPORT_RESULT_VALUES)[number];
  disappearance?: { time: string } | null;
  reappearance?: { time: string } | null;
  observedFromUtc?: string | null;
  observedToUtc?: string | null;
}

/** What a result needs: a positive its two timings in order, a negative the span watched. */
export function reportTimingProblems(report: ReportTimings): Array<{ path: string; message: string }> {
  const problems: Array<{ path: string; message: string }> = [];
  if (report.result === 'positive') {
    if (!report.disappearance)
      problems.push({ path: 'disappearance', message: 'a positive report needs the disappearance' });
    if (!report.reappearance)
      problems.push({ path: 'reappearance', message: 'a positive report needs the reappearance' });
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
  reason: z.string().trim().min(1, 'a reason is required so the observer knows what to fix').max(2000),
});

/** A chord exactly as the event file states one (station by its id in the event). */
export const chordPayloadSchema = shape.chords.element;
export type ChordPayload = z.output<typeof chordPayloadSchema>;

export const submitFitPayloadSchema = z.strictObject({
  options: z.record(z.string(), z.unknown()).default({}),
});
export type SubmitFitPayload = z.output<typeof submitFitPayloadSchema>;

export const reviewDecisionPayloadSchema = z
  .strictObject({
    decision: z.enum(['approve', 'return']),
    comment: z.string().trim().max(10_000).default(''),
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
