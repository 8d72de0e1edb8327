import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ChordInput, TimedMark } from '@limbus/geometry';
import {
  type CreateReportPayload,
  chordPayloadSchema,
  type PatchReportPayload,
  reportTimingProblems,
} from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { rolesIn } from '../events/team-choice';
import { EventsService } from '../events/events.service';
import { Station } from '../stations/entities/station.entity';
import type { LightCurveTiming } from '../timings/entities/light-curve-timing.entity';
import { User } from '../users/entities/user.entity';
import { Report, type ReportState } from './entities/report.entity';
import { writeReportChord, writeReportRingEvents } from './report-chord';
import { applyReportFields } from './report-fields';
import { ReportNotices } from './report-notices';
import { assertSeesReport, seesEveryReport } from './report-privacy';
import { REPORT_VIEW_POPULATE, type ReportView, reportViewOf, reportViews } from './report-view';

/** The chord an accepted report stands for; clouded-out and failed reports stand for none. */
export function chordOfReport(report: Report): ChordInput | null {
  // A positive with one time (a camera started late, a cloud) stands for a single-edge chord.
  if (report.result === 'positive' && (report.disappearance || report.reappearance))
    return {
      station: report.station.code,
      type: 'positive',
      ...(report.disappearance ? { disappearance: report.disappearance } : {}),
      ...(report.reappearance ? { reappearance: report.reappearance } : {}),
      timeOffsetSeconds: 0,
    };
  if (report.result === 'negative' && report.observedFromUtc && report.observedToUtc)
    return {
      station: report.station.code,
      type: 'negative',
      start: report.observedFromUtc,
      end: report.observedToUtc,
      timeOffsetSeconds: 0,
    };
  return null;
}

/** A positive with no time yet: its times are still to come from its light curve. */
export function awaitsTiming(report: Report): boolean {
  return report.result === 'positive' && !report.disappearance && !report.reappearance;
}

/** Checks that the report makes a valid chord; `path` names the field of the refusal. */
export function checkedChordOf(report: Report, path: string): ChordInput | null {
  const input = chordOfReport(report);
  if (input && !chordPayloadSchema.safeParse(input).success)
    throw new ValidationError([{ path, message: 'the report does not make a valid chord' }]);
  return input;
}

const DECIDED_MEANWHILE = 'The report was decided meanwhile';
const ANOTHER_OPEN =
  'The observer already has another open report for this station: decide or edit that one instead';

/** The refusal of a second open report by one observer for one station. */
function alreadyOpen(open: Report): string {
  return open.state === 'accepted'
    ? 'Your report for this station is already accepted; ask for a correction instead'
    : `You already have a report for this station (${open.id}); edit it instead`;
}

/** A copy, so the chord's JSON column never shares an object with the timing's result. */
function markCopy(m: TimedMark): TimedMark {
  return { time: m.time, sigmaSeconds: m.sigmaSeconds };
}

@Injectable()
export class ReportsService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
    private readonly notices: ReportNotices,
  ) {}

  view(report: Report): Promise<ReportView> {
    return reportViewOf(this.em, report);
  }

  /** Observers see their own reports only; coordinators, modellers and reviewers see all. */
  async list(user: AuthUser, eventId: string): Promise<ReportView[]> {
    const event = await this.events.find(eventId);
    const seesAll = seesEveryReport(await rolesIn(this.em, user, event.team.id));
    const reports = await this.em.find(Report, seesAll ? { event } : { event, author: user.id }, {
      populate: REPORT_VIEW_POPULATE,
      orderBy: { createdAt: 'asc', id: 'asc' },
    });
    return reportViews(this.em, reports);
  }

  async find(reportId: string): Promise<Report> {
    const report = await this.em.findOne(
      Report,
      { id: reportId, event: { state: 'active' } },
      { populate: REPORT_VIEW_POPULATE },
    );
    if (!report) throw new NotFoundError();
    return report;
  }

  /** As `find`, but another observer's report is as missing to a member who is only an observer. */
  async findVisible(user: AuthUser, reportId: string): Promise<Report> {
    const report = await this.find(reportId);
    await assertSeesReport(this.em, user, report);
    return report;
  }

  async create(user: AuthUser, eventId: string, body: CreateReportPayload): Promise<ReportView> {
    const event = await this.events.find(eventId);
    const station = await this.em.findOne(Station, { id: body.stationId, event }, { populate: ['observer'] });
    if (!station)
      throw new ValidationError([{ path: 'stationId', message: 'no such station in this event' }]);
    if (station.observer?.id !== user.id)
      throw new ForbiddenError('Only the observer of this station can report for it');
    const open = await this.em.findOne(Report, {
      station,
      author: user.id,
      state: { $in: ['submitted', 'accepted'] },
    });
    if (open) throw new ConflictError(alreadyOpen(open));
    const report = new Report(event, station, this.em.getReference(User, user.id), body.result);
    applyReportFields(report, body);
    this.em.persist(report);
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'report.submit',
      objectType: 'report',
      objectId: report.id,
      detail: {
        station: station.code,
        result: report.result,
        timesFromLightCurve: report.timesFromLightCurve,
      },
    });
    try {
      await this.em.flush();
    } catch (error) {
      // Two submits at once both passed the look-up above; the unique key (station, open author) let
      // one in. The other is told about that one, as if it had come second.
      if (!(error instanceof UniqueConstraintViolationException)) throw error;
      const winner = await this.em.fork().findOne(Report, {
        station: station.id,
        openAuthorId: user.id,
      });
      throw new ConflictError(winner ? alreadyOpen(winner) : ANOTHER_OPEN);
    }
    const stored = await this.find(report.id);
    await this.notices.submitted(stored, false);
    return this.view(stored);
  }

  /** The author edits until acceptance; editing a rejected report submits it again. */
  async update(user: AuthUser, reportId: string, body: PatchReportPayload): Promise<ReportView> {
    const report = await this.findVisible(user, reportId);
    if (report.author.id !== user.id) throw new ForbiddenError('Only the author can edit a report');
    if (report.state === 'accepted')
      throw new ConflictError('An accepted report can no longer be edited; ask for a correction instead');
    applyReportFields(report, body);
    const problems = reportTimingProblems(report);
    if (problems.length > 0) throw new ValidationError(problems);
    const wasRejected = report.state === 'rejected';
    await this.em.transactional(async (em) => {
      // Conditional, so that an accept landing meanwhile is not undone by this edit.
      const open = await this.move(em, report, ['submitted', 'rejected'], 'submitted');
      if (!open) throw new ConflictError('The report was accepted meanwhile; ask for a correction instead');
      report.state = 'submitted';
      report.rejectReason = null;
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: wasRejected ? 'report.resubmit' : 'report.update',
        objectType: 'report',
        objectId: report.id,
        detail: { fields: Object.keys(body) },
      });
      await em.flush();
    });
    if (wasRejected) await this.notices.submitted(report, true);
    return this.view(report);
  }

  /**
   * Moves the report to `to` only from one of `from`, in the caller's transaction: of two decisions
   * at once, exactly one moves it. Returns whether this one did. An open report holds its station's
   * open key, so reopening a rejected one while the author has another open there answers 409.
   */
  private async move(
    em: EntityManager,
    report: Report,
    from: ReportState[],
    to: ReportState,
  ): Promise<boolean> {
    const openAuthorId = to === 'rejected' ? null : report.author.id;
    try {
      const moved = await em.nativeUpdate(
        Report,
        { id: report.id, state: { $in: from } },
        { state: to, openAuthorId },
      );
      if (moved > 0) report.openAuthorId = openAuthorId;
      return moved > 0;
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw new ConflictError(ANOTHER_OPEN);
      throw error;
    }
  }

  /**
   * Acceptance writes the report's chord (asking first before it replaces better-timed values) and
   * replaces its ring events, in one transaction. A positive still waiting for its light curve's
   * timing has nothing to write: its timing is accepted instead.
   */
  async accept(user: AuthUser, reportId: string, replaceTimedChord: boolean): Promise<ReportView> {
    const report = await this.find(reportId);
    if (report.state !== 'submitted') throw new ConflictError(`The report is ${report.state}, not submitted`);
    if (awaitsTiming(report))
      throw new ConflictError(
        'this report has no times yet: time its light curve (Light curves) and accept the timing',
      );
    const input = checkedChordOf(report, 'report');
    await this.em.transactional(async (em) => {
      if (!(await this.move(em, report, ['submitted'], 'accepted')))
        throw new ConflictError(DECIDED_MEANWHILE);
      const written = await writeReportChord(em, {
        report,
        input,
        timing: null,
        what: 'the report',
        times: "the report's typed times",
        replaceTimedChord,
      });
      await writeReportRingEvents(em, report);
      report.state = 'accepted';
      report.rejectReason = null;
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'report.accept',
        objectType: 'report',
        objectId: report.id,
        detail: {
          chord: input?.type ?? null,
          chordId: written.chord?.id ?? null,
          replaced: written.before,
          ringEvents: report.ringDips.length,
        },
      });
      await em.flush();
    });
    await this.notices.decided(report, user.id, 'report');
    return this.view(report);
  }

  async reject(user: AuthUser, reportId: string, reason: string): Promise<ReportView> {
    const report = await this.find(reportId);
    if (report.state !== 'submitted') throw new ConflictError(`The report is ${report.state}, not submitted`);
    await this.em.transactional(async (em) => {
      if (!(await this.move(em, report, ['submitted'], 'rejected')))
        throw new ConflictError(DECIDED_MEANWHILE);
      report.state = 'rejected';
      report.rejectReason = reason;
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'report.reject',
        objectType: 'report',
        objectId: report.id,
        detail: { reason },
      });
      await em.flush();
    });
    await this.notices.decided(report, user.id, 'report');
    return this.view(report);
  }

  /**
   * Accepting a timing writes its D and R (with their 1σ) into the chord of the timing's report, with
   * source "timing", and accepts the report if it was not yet: report and timing never disagree. The
   * report's typed ring dips are left to its timing's dips (the ring-events route), which are measured.
   */
  async acceptTiming(
    user: AuthUser,
    timing: LightCurveTiming,
    edges: { disappearance: TimedMark | null; reappearance: TimedMark | null },
    replaceTimedChord: boolean,
  ): Promise<{ chordId: string; report: ReportView }> {
    const report = await this.find(timing.report.id);
    // A timing of a curve that starts or ends inside the event holds one edge: a single-edge chord.
    const input: ChordInput = {
      station: report.station.code,
      type: 'positive',
      ...(edges.disappearance ? { disappearance: markCopy(edges.disappearance) } : {}),
      ...(edges.reappearance ? { reappearance: markCopy(edges.reappearance) } : {}),
      timeOffsetSeconds: 0,
    };
    let moved = false;
    const chordId = await this.em.transactional(async (em) => {
      moved = await this.move(em, report, ['submitted', 'rejected'], 'accepted');
      const { chord, before } = await writeReportChord(em, {
        report,
        input,
        timing,
        what: 'this timing',
        times: "this timing's times",
        replaceTimedChord,
      });
      if (!chord) throw new Error('accepting a timing always writes a chord');
      timing.acceptedAt = new Date();
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'timing.accept',
        objectType: 'chord',
        objectId: chord.id,
        detail: {
          timingId: timing.id,
          reportId: report.id,
          before,
          after: { disappearance: input.disappearance ?? null, reappearance: input.reappearance ?? null },
        },
      });
      if (moved) {
        report.state = 'accepted';
        report.rejectReason = null;
        this.audit.record(em, {
          teamId: report.event.team.id,
          eventId: report.event.id,
          actorId: user.id,
          action: 'report.accept',
          objectType: 'report',
          objectId: report.id,
          detail: { chord: 'positive', chordId: chord.id, timingId: timing.id },
        });
      }
      await em.flush();
      return chord.id;
    });
    if (moved) await this.notices.decided(report, user.id, 'timing');
    return { chordId, report: await this.view(report) };
  }
}
