import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ChordInput } from '@limbus/geometry';
import {
  type CreateReportPayload,
  chordPayloadSchema,
  type PatchReportPayload,
  reportTimingProblems,
} from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { Chord } from '../chords/entities/chord.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { applyChordInput, chordRow } from '../events/event-rows';
import { rolesIn } from '../events/team-choice';
import { EventsService } from '../events/events.service';
import { Station } from '../stations/entities/station.entity';
import { User } from '../users/entities/user.entity';
import { Report } from './entities/report.entity';
import { type ReportView, reportView } from './report-view';

const POPULATE = ['station', 'author', 'event', 'event.team', 'lightCurve'] as const;

/** The chord an accepted report stands for; clouded-out and failed reports stand for none. */
export function chordOfReport(report: Report): ChordInput | null {
  if (report.result === 'positive' && report.disappearance && report.reappearance)
    return {
      station: report.station.code,
      type: 'positive',
      disappearance: report.disappearance,
      reappearance: report.reappearance,
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

@Injectable()
export class ReportsService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
  ) {}

  /** Observers see their own reports only; coordinators, modellers and reviewers see all. */
  async list(user: AuthUser, eventId: string): Promise<ReportView[]> {
    const event = await this.events.find(eventId);
    const roles = await rolesIn(this.em, user, event.team.id);
    const seesAll = roles.some((r) => r !== 'observer');
    const reports = await this.em.find(Report, seesAll ? { event } : { event, author: user.id }, {
      populate: POPULATE,
      orderBy: { createdAt: 'asc', id: 'asc' },
    });
    return reports.map(reportView);
  }

  async find(reportId: string): Promise<Report> {
    const report = await this.em.findOne(
      Report,
      { id: reportId, event: { state: 'active' } },
      { populate: POPULATE },
    );
    if (!report) throw new NotFoundError();
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
    if (open)
      throw new ConflictError(
        open.state === 'accepted'
          ? 'Your report for this station is already accepted'
          : `You already have a report for this station (${open.id}); edit it instead`,
      );
    const report = new Report(event, station, this.em.getReference(User, user.id), body.result);
    this.applyFields(report, body);
    this.em.persist(report);
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'report.submit',
      objectType: 'report',
      objectId: report.id,
      detail: { station: station.code, result: report.result },
    });
    await this.em.flush();
    return reportView(await this.find(report.id));
  }

  private applyFields(report: Report, body: PatchReportPayload): void {
    if (body.result !== undefined) report.result = body.result;
    if (body.disappearance !== undefined) report.disappearance = body.disappearance;
    if (body.reappearance !== undefined) report.reappearance = body.reappearance;
    if (body.observedFromUtc !== undefined) report.observedFromUtc = body.observedFromUtc;
    if (body.observedToUtc !== undefined) report.observedToUtc = body.observedToUtc;
    if (body.ringDips !== undefined) report.ringDips = body.ringDips;
    if (body.notes !== undefined) report.notes = body.notes;
  }

  /** The author edits until acceptance; editing a rejected report submits it again. */
  async update(user: AuthUser, reportId: string, body: PatchReportPayload): Promise<ReportView> {
    const report = await this.find(reportId);
    if (report.author.id !== user.id) throw new ForbiddenError('Only the author can edit a report');
    if (report.state === 'accepted') throw new ConflictError('An accepted report can no longer be edited');
    this.applyFields(report, body);
    const problems = reportTimingProblems(report);
    if (problems.length > 0) throw new ValidationError(problems);
    const wasRejected = report.state === 'rejected';
    report.state = 'submitted';
    report.rejectReason = null;
    this.audit.record(this.em, {
      teamId: report.event.team.id,
      eventId: report.event.id,
      actorId: user.id,
      action: wasRejected ? 'report.resubmit' : 'report.update',
      objectType: 'report',
      objectId: report.id,
      detail: { fields: Object.keys(body) },
    });
    await this.em.flush();
    return reportView(report);
  }

  /** Acceptance creates or updates the report's chord and replaces its ring events, in one transaction. */
  async accept(user: AuthUser, reportId: string): Promise<ReportView> {
    const report = await this.find(reportId);
    if (report.state !== 'submitted') throw new ConflictError(`The report is ${report.state}, not submitted`);
    const input = chordOfReport(report);
    if (input && !chordPayloadSchema.safeParse(input).success)
      throw new ValidationError([{ path: 'report', message: 'the report does not make a valid chord' }]);
    await this.em.transactional(async (em) => {
      const existing = await em.findOne(Chord, { report });
      if (input && existing) applyChordInput(existing, report.station, input);
      else if (input) {
        const last = await em.findOne(Chord, { event: report.event }, { orderBy: { position: 'desc' } });
        const chord = chordRow(report.event, report.station, input, 'report', (last?.position ?? -1) + 1);
        chord.report = report;
        em.persist(chord);
      } else if (existing) em.remove(existing);
      await em.nativeDelete(RingEvent, { report });
      const lastRing = await em.findOne(
        RingEvent,
        { event: report.event },
        { orderBy: { position: 'desc' } },
      );
      let ringPosition = (lastRing?.position ?? -1) + 1;
      for (const dip of report.ringDips) {
        const ring = new RingEvent(report.event, report.station, dip);
        ring.report = report;
        ring.position = ringPosition++;
        em.persist(ring);
      }
      report.state = 'accepted';
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'report.accept',
        objectType: 'report',
        objectId: report.id,
        detail: { chord: input?.type ?? null, ringEvents: report.ringDips.length },
      });
      await em.flush();
    });
    return reportView(report);
  }

  async reject(user: AuthUser, reportId: string, reason: string): Promise<ReportView> {
    const report = await this.find(reportId);
    if (report.state !== 'submitted') throw new ConflictError(`The report is ${report.state}, not submitted`);
    report.state = 'rejected';
    report.rejectReason = reason;
    this.audit.record(this.em, {
      teamId: report.event.team.id,
      eventId: report.event.id,
      actorId: user.id,
      action: 'report.reject',
      objectType: 'report',
      objectId: report.id,
      detail: { reason },
    });
    await this.em.flush();
    return reportView(report);
  }
}
