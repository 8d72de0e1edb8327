// Answers of the API that the client reads: one zod schema each, so the server's TypeScript types
// (z.output) and the client's parsing come from the same definition. No geometry import: the client
// loads this module on its own (`@limbus/schema/views`).

import { z } from 'zod';

import { NOTICE_KINDS, TEAM_ROLES } from './team.js';

const iso = z.string();
const role = z.enum(TEAM_ROLES);
const timedMark = z.object({ time: z.string(), sigmaSeconds: z.number() });
const person = z.object({ id: z.string(), name: z.string() });

export const meViewSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  teams: z.array(z.object({ id: z.string(), name: z.string(), roles: z.array(role) })),
  noticeOptOuts: z.array(z.enum(NOTICE_KINDS)),
});
export type MeView = z.output<typeof meViewSchema>;

export const memberViewSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  roles: z.array(role),
  joinedAt: iso,
});
export type MemberView = z.output<typeof memberViewSchema>;

/** An invitation not yet accepted or revoked, as the team page lists it. */
export const invitationViewSchema = z.object({
  id: z.string(),
  email: z.string(),
  roles: z.array(role),
  invitedBy: person.nullable(),
  createdAt: iso,
  lastSentAt: iso,
  expiresAt: iso,
  expired: z.boolean(),
});
export type InvitationView = z.output<typeof invitationViewSchema>;

/** What the e-mailed link shows before accepting; `existingAccount` asks for a password only. */
export const publicInvitationViewSchema = z.object({
  email: z.string(),
  teamName: z.string(),
  roles: z.array(role),
  /** The first role; kept for older clients. */
  role,
  expiresAt: iso,
  existingAccount: z.boolean(),
});
export type PublicInvitationView = z.output<typeof publicInvitationViewSchema>;

export const FIT_STATE_VALUES = ['queued', 'running', 'solved', 'failed'] as const;
export const REVIEW_STATE_VALUES = ['none', 'in_review', 'approved', 'returned'] as const;

/** One fit in a list: where it stands, and whether the event's data changed since it was run. */
export const fitStatusSchema = z.object({
  id: z.string(),
  state: z.enum(FIT_STATE_VALUES),
  reviewState: z.enum(REVIEW_STATE_VALUES),
  createdAt: iso,
  /** False when the event's stations, chords, ring events, star, ephemeris or Earth rotation changed. */
  inputMatchesEvent: z.boolean(),
});
export type FitStatus = z.output<typeof fitStatusSchema>;

/** A one-time pass to a fit's progress stream (`GET /api/fits/:fitId/events?ticket=`), for EventSource. */
export const streamTicketSchema = z.object({ ticket: z.string(), expiresInSeconds: z.number() });
export type StreamTicket = z.output<typeof streamTicketSchema>;

const measured = z.object({ value: z.number(), sigma: z.number() });

export const bodySummarySchema = z.object({
  id: z.string(),
  teamId: z.string(),
  name: z.string(),
  designation: z.string().nullable(),
  eventCount: z.number(),
  approvedFitCount: z.number(),
  hasContext: z.boolean(),
  updatedAt: iso,
});
export type BodySummary = z.output<typeof bodySummarySchema>;

/** An event of a body with its latest approved fit's limb, for the body page's table. */
export const bodyEventRowSchema = z.object({
  id: z.string(),
  title: z.string(),
  eventTimeUtc: iso,
  counts: z.object({ stations: z.number(), chords: z.number() }),
  latestFit: fitStatusSchema.nullable(),
  approvedFit: fitStatusSchema
    .extend({
      limb: z
        .object({
          equatorialRadiusKm: measured,
          oblateness: measured,
          positionAngleDeg: measured,
          chi2: z.number(),
          dof: z.number(),
        })
        .nullable(),
      rings: z.array(z.object({ ring: z.string(), radiusKm: measured })),
    })
    .nullable(),
});
export type BodyEventRow = z.output<typeof bodyEventRowSchema>;

export const bodyDetailSchema = bodySummarySchema.omit({ eventCount: true, approvedFitCount: true }).extend({
  /** The body's physical parameters, a limbus-context-input/1 document, or null while none is entered. */
  context: z.record(z.string(), z.unknown()).nullable(),
  events: z.array(bodyEventRowSchema),
});
export type BodyDetail = z.output<typeof bodyDetailSchema>;

export const eventSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  teamId: z.string(),
  bodyId: z.string(),
  bodyName: z.string(),
  eventTimeUtc: iso,
  deletedAt: iso.nullable(),
  star: z.object({ raDeg: z.number(), decDeg: z.number() }),
  counts: z.object({
    stations: z.number(),
    chords: z.number(),
    reports: z.number(),
    fits: z.number(),
    /** Stations whose observer is the caller. */
    myStations: z.number(),
    /** Reports submitted and not yet decided. */
    openReports: z.number(),
  }),
  latestFit: fitStatusSchema.nullable(),
  /** Fits of this event waiting in review. */
  fitsInReview: z.number(),
});
export type EventSummary = z.output<typeof eventSummarySchema>;

export const eventsPageSchema = z.object({
  items: z.array(eventSummarySchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type EventsPage = z.output<typeof eventsPageSchema>;

/** Where a chord's times came from. */
export const CHORD_SOURCE_VALUES = ['import', 'report', 'manual', 'csv', 'timing'] as const;
export type ChordSourceValue = (typeof CHORD_SOURCE_VALUES)[number];

export const REPORT_RESULT_VALUES = ['positive', 'negative', 'clouded_out', 'technical_failure'] as const;
export const REPORT_STATE_VALUES = ['submitted', 'accepted', 'rejected'] as const;
export const CORRECTION_STATE_VALUES = ['pending', 'accepted', 'rejected'] as const;

export const correctionViewSchema = z.object({
  id: z.string(),
  reportId: z.string(),
  author: person,
  /** The report fields to change, as the observer sent them. */
  changes: z.record(z.string(), z.unknown()),
  message: z.string(),
  state: z.enum(CORRECTION_STATE_VALUES),
  decidedBy: person.nullable(),
  reason: z.string().nullable(),
  createdAt: iso,
  decidedAt: iso.nullable(),
});
export type CorrectionView = z.output<typeof correctionViewSchema>;

export const reportViewSchema = z.object({
  id: z.string(),
  eventId: z.string(),
  stationId: z.string(),
  station: z.string(),
  authorId: z.string(),
  authorName: z.string(),
  result: z.enum(REPORT_RESULT_VALUES),
  timesFromLightCurve: z.boolean(),
  disappearance: timedMark.nullable(),
  reappearance: timedMark.nullable(),
  observedFromUtc: z.string().nullable(),
  observedToUtc: z.string().nullable(),
  ringDips: z.array(z.object({ ring: z.string(), start: timedMark, end: timedMark })),
  notes: z.string().nullable(),
  lightCurve: z
    .object({ id: z.string(), name: z.string(), sizeBytes: z.number(), sha256: z.string() })
    .nullable(),
  state: z.enum(REPORT_STATE_VALUES),
  rejectReason: z.string().nullable(),
  /** The chord this report stands for, with the times it holds now and where they came from. */
  chord: z
    .object({
      id: z.string(),
      source: z.enum(CHORD_SOURCE_VALUES),
      timingId: z.string().nullable(),
      disappearance: timedMark.nullable(),
      reappearance: timedMark.nullable(),
    })
    .nullable(),
  /** The newest light-curve timing of this report. */
  latestTiming: z
    .object({
      id: z.string(),
      state: z.enum(FIT_STATE_VALUES),
      disappearance: timedMark.nullable(),
      reappearance: timedMark.nullable(),
      inChord: z.boolean(),
      finishedAt: iso.nullable(),
    })
    .nullable(),
  corrections: z.array(correctionViewSchema),
  createdAt: iso,
  updatedAt: iso,
});
export type ReportView = z.output<typeof reportViewSchema>;

/** The 409 code (with `detail`) of an accept that would replace better-timed chord values. */
export const REPLACES_BETTER_TIMING = 'replaces-better-timing';

/** The `detail` of a 409 `replaces-better-timing`: what the accept would overwrite, and with what. */
export const replacesBetterTimingSchema = z.object({
  chordId: z.string(),
  station: z.string(),
  source: z.enum(CHORD_SOURCE_VALUES),
  timingId: z.string().nullable(),
  current: z.object({ disappearance: timedMark.nullable(), reappearance: timedMark.nullable() }),
  incoming: z.object({ disappearance: timedMark.nullable(), reappearance: timedMark.nullable() }),
});
export type ReplacesBetterTiming = z.output<typeof replacesBetterTimingSchema>;

export const REVIEW_ENTRY_KINDS = ['request', 'approve', 'return'] as const;

/** One step of a fit's review: a request (with its message), an approval or a return. */
export const reviewEntrySchema = z.object({
  id: z.string(),
  fitId: z.string(),
  fitCreatedAt: iso,
  decision: z.enum(REVIEW_ENTRY_KINDS),
  comment: z.string(),
  reviewer: person,
  createdAt: iso,
});
export type ReviewEntry = z.output<typeof reviewEntrySchema>;

export const auditEntryViewSchema = z.object({
  id: z.string(),
  actorId: z.string().nullable(),
  actorName: z.string().nullable(),
  action: z.string(),
  objectType: z.string(),
  objectId: z.string(),
  detail: z.record(z.string(), z.unknown()).nullable(),
  createdAt: iso,
});
export type AuditEntryView = z.output<typeof auditEntryViewSchema>;

export const outboxMessageSchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  date: iso,
  /** The X-Limbus-Kind header (invitation, password-reset, a notice kind), null for other mail. */
  kind: z.string().nullable(),
});
export type OutboxMessage = z.output<typeof outboxMessageSchema>;
