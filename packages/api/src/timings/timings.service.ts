import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger } from '@nestjs/common';
import type { TimedMark } from '@limbus/geometry';
import { parseUtc, ringEventOpacity, secondsBetweenUtc } from '@limbus/schema';
import type { Queue } from 'bullmq';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { Chord } from '../chords/entities/chord.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import { FitRun } from '../fits/entities/fit-run.entity';
import { enqueueOrLeaveToSweep } from '../queue/bounded-enqueue';
import { Report } from '../reports/entities/report.entity';
import { assertSeesReport } from '../reports/report-privacy';
import type { ReportView } from '../reports/report-view';
import { ReportsService } from '../reports/reports.service';
import { loadEventRows, planningFileOf } from '../events/event-rows';
import { assertEventRoom } from '../events/event-size';
import { User } from '../users/entities/user.entity';
import { LightCurveTiming, type TimingState } from './entities/light-curve-timing.entity';
import { type TimingDefaults, timingDefaultsOf } from './timing-defaults';
import type { DipsToRingEventsPayload, MarkDipPayload, TimingOptions } from './timing-options';
import type { TimingView } from './timing-result';
import { enqueueTiming, TIMINGS_QUEUE, type TimingJobData } from './timings-queue';

export interface TimingSummary {
  id: string;
  reportId: string;
  stationId: string;
  state: TimingState;
  error: string | null;
  options: TimingOptions;
  /** The chord of the station holds this timing's D and R now. */
  inChord: boolean;
  /** When it was last accepted into the chord; kept as history after another value replaced it. */
  acceptedAt: string | null;
  ringEventsCreatedAt: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface TimingDetail extends TimingSummary {
  result: TimingView | null;
}

function summary(t: LightCurveTiming, inChord: boolean): TimingSummary {
  return {
    id: t.id,
    reportId: t.report.id,
    stationId: t.report.station.id,
    state: t.state,
    error: t.error,
    options: t.options,
    inChord,
    acceptedAt: t.acceptedAt?.toISOString() ?? null,
    ringEventsCreatedAt: t.ringEventsCreatedAt?.toISOString() ?? null,
    createdAt: t.createdAt.toISOString(),
    finishedAt: t.finishedAt?.toISOString() ?? null,
  };
}

// A missing id and another observer's report or timing answer the same 404 (report-privacy.ts).
const NO_SUCH_REPORT = 'No such report in this event';
const NO_SUCH_TIMING = 'No such timing in this event';

/** A copy, so a ring event's JSON column never shares an object with the timing's result. */
function markCopy(m: TimedMark): TimedMark {
  return { time: m.time, sigmaSeconds: m.sigmaSeconds };
}

@Injectable()
export class TimingsService {
  private readonly logger = new Logger(TimingsService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly reports: ReportsService,
    @InjectQueue(TIMINGS_QUEUE) private readonly queue: Queue<TimingJobData>,
  ) {}

  /** Summaries saying which of these timings the chords hold now. */
  private async summaries(timings: LightCurveTiming[]): Promise<TimingSummary[]> {
    const inChords =
      timings.length === 0
        ? []
        : await this.em.find(Chord, { timing: { $in: timings.map((t) => t.id) } }, { fields: ['timing'] });
    const held = new Set(inChords.map((c) => c.timing?.id));
    return timings.map((t) => summary(t, held.has(t.id)));
  }

  private async report(eventId: string, reportId: string): Promise<Report> {
    const report = await this.em.findOne(
      Report,
      { id: reportId, event: { id: eventId, state: 'active' } },
      { populate: ['lightCurve', 'station', 'event'] },
    );
    if (!report) throw new NotFoundError(NO_SUCH_REPORT);
    return report;
  }

  private async timing(eventId: string, timingId: string): Promise<LightCurveTiming> {
    const timing = await this.em.findOne(
      LightCurveTiming,
      { id: timingId, event: { id: eventId, state: 'active' } },
      { populate: ['report', 'report.station', 'event', 'result'] },
    );
    if (!timing) throw new NotFoundError(NO_SUCH_TIMING);
    return timing;
  }

  /**
   * Speed, distance and exposure to start a timing of this report's light curve from, and each edge's
   * limb-normal speed from the event's latest solved fit, else its prediction settings.
   */
  async defaults(user: AuthUser, eventId: string, reportId: string): Promise<TimingDefaults> {
    const report = await this.report(eventId, reportId);
    await assertSeesReport(this.em, user, report, NO_SUCH_REPORT);
    // Every station: a report may come from a planned site that no chord names yet.
    const file = planningFileOf(await loadEventRows(this.em, report.event));
    const fit = await this.em.findOne(
      FitRun,
      { event: report.event, state: 'solved' },
      { orderBy: { finishedAt: 'desc', createdAt: 'desc' }, populate: ['solution'] },
    );
    const solution = fit?.solution ?? null;
    return timingDefaultsOf(file, report.station.code, report, report.station.exposureSeconds, {
      fit: fit && solution ? { id: fit.id, limb: solution.limb, rings: solution.rings } : null,
      prediction: report.event.prediction,
    });
  }

  async create(
    user: AuthUser,
    eventId: string,
    reportId: string,
    options: TimingOptions,
  ): Promise<TimingSummary> {
    const report = await this.report(eventId, reportId);
    const upload = report.lightCurve;
    if (!upload) {
      throw new ValidationError([{ path: 'reportId', message: 'this report has no uploaded light curve' }]);
    }
    options.markedDips.forEach((d, k) => {
      const start = parseUtc(d.startUtc);
      const end = parseUtc(d.endUtc);
      const issues = [];
      if (typeof start === 'string') issues.push({ path: `markedDips[${k}].startUtc`, message: start });
      if (typeof end === 'string') issues.push({ path: `markedDips[${k}].endUtc`, message: end });
      if (issues.length > 0) throw new ValidationError(issues);
      if (typeof start !== 'string' && typeof end !== 'string' && !(secondsBetweenUtc(end, start) > 0)) {
        throw new ValidationError([{ path: `markedDips[${k}].endUtc`, message: 'ends before it starts' }]);
      }
    });
    const timing = new LightCurveTiming(report.event, report, this.em.getReference(User, user.id), {
      uploadSha256: upload.sha256,
      options,
    });
    this.audit.record(this.em, {
      teamId: report.event.team.id,
      eventId,
      actorId: user.id,
      action: 'timing.create',
      objectType: 'timing',
      objectId: timing.id,
      detail: { reportId, markedDips: options.markedDips.length },
    });
    await this.em.persist(timing).flush();
    // Enqueued after the row is committed, so the worker always finds it.
    await enqueueOrLeaveToSweep(enqueueTiming(this.queue, timing.id), `timing ${timing.id}`, this.logger);
    return summary(timing, false);
  }

  /** Newest first; another observer's report is as missing to a member who is only an observer. */
  async list(user: AuthUser, eventId: string, reportId: string): Promise<TimingSummary[]> {
    const report = await this.report(eventId, reportId);
    await assertSeesReport(this.em, user, report, NO_SUCH_REPORT);
    const rows = await this.em.find(
      LightCurveTiming,
      { report: reportId },
      { populate: ['report', 'report.station'], orderBy: { createdAt: 'desc', id: 'asc' } },
    );
    return this.summaries(rows);
  }

  async detail(user: AuthUser, eventId: string, timingId: string): Promise<TimingDetail> {
    const timing = await this.timing(eventId, timingId);
    await assertSeesReport(this.em, user, timing.report, NO_SUCH_TIMING);
    const [view] = await this.summaries([timing]);
    if (!view) throw new NotFoundError(NO_SUCH_TIMING);
    return { ...view, result: timing.result };
  }

  private solved(timing: LightCurveTiming): TimingView {
    if (timing.state !== 'solved' || timing.result === null) {
      throw new ConflictError(`The timing is ${timing.state}, not solved`);
    }
    return timing.result;
  }

  /**
   * Writes the fitted D and R with their 1σ into the chord of the timing's report (source "timing") and
   * accepts the report with it; 409 `replaces-better-timing` unless `replaceTimedChord` (ReportsService).
   */
  async accept(
    user: AuthUser,
    eventId: string,
    timingId: string,
    replaceTimedChord: boolean,
  ): Promise<{ chordId: string; report: ReportView }> {
    const timing = await this.timing(eventId, timingId);
    const result = this.solved(timing);
    const { disappearance, reappearance } = result;
    // One edge is enough: a curve that starts or ends inside the event gives a single-edge chord.
    if (disappearance === null && reappearance === null) {
      throw new ConflictError('The timing found no disappearance or reappearance to put in a chord');
    }
    return this.reports.acceptTiming(user, timing, { disappearance, reappearance }, replaceTimedChord);
  }

  /** One ring event per chosen dip, under one ring name; a timing feeds ring events once. */
  async dipsToRingEvents(
    user: AuthUser,
    eventId: string,
    timingId: string,
    payload: DipsToRingEventsPayload,
  ): Promise<{ ringEventIds: string[] }> {
    const timing = await this.timing(eventId, timingId);
    const result = this.solved(timing);
    if (timing.ringEventsCreatedAt !== null) {
      throw new ConflictError('Ring events were already made from this timing');
    }
    if (result.dips.length === 0) throw new ConflictError('The timing found no dips');
    const indexes = payload.dips ?? result.dips.map((_, i) => i);
    const issues = indexes
      .map((index, k) => ({ index, k }))
      .filter(({ index }) => index >= result.dips.length)
      .map(({ k }) => ({ path: `dips[${k}]`, message: `there are only ${result.dips.length} dips` }));
    if (issues.length > 0) throw new ValidationError(issues);
    return this.em.transactional(async (em) => {
      await assertEventRoom(em, eventId, { ringEvents: new Set(indexes).size });
      const position = await em.count(RingEvent, { event: eventId });
      const made = [...new Set(indexes)].map((index, k) => {
        const dip = result.dips[index];
        if (!dip) throw new NotFoundError('No such dip');
        // The dip's apparent opacity goes with it, so that a fit can give the ring's optical depths there.
        const apparentOpacity = ringEventOpacity(dip);
        const ringEvent = new RingEvent(timing.event, timing.report.station, {
          ring: payload.ring,
          start: markCopy(dip.start),
          end: markCopy(dip.end),
          ...(apparentOpacity === null ? {} : { apparentOpacity }),
        });
        ringEvent.report = timing.report;
        ringEvent.position = position + k + 1;
        em.persist(ringEvent);
        return ringEvent;
      });
      timing.ringEventsCreatedAt = new Date();
      this.audit.record(em, {
        teamId: timing.event.team.id,
        eventId,
        actorId: user.id,
        action: 'timing.ring-events',
        objectType: 'timing',
        objectId: timing.id,
        detail: { ring: payload.ring, ringEventIds: made.map((r) => r.id) },
      });
      await em.flush();
      return { ringEventIds: made.map((r) => r.id) };
    });
  }

  /** A hand-marked dip is measured by running the timing again with the dip added to its marks. */
  async markDip(
    user: AuthUser,
    eventId: string,
    timingId: string,
    dip: MarkDipPayload,
  ): Promise<TimingSummary> {
    const timing = await this.timing(eventId, timingId);
    const start = parseUtc(dip.startUtc);
    const end = parseUtc(dip.endUtc);
    const issues = [
      ...(typeof start === 'string' ? [{ path: 'startUtc', message: start }] : []),
      ...(typeof end === 'string' ? [{ path: 'endUtc', message: end }] : []),
    ];
    if (issues.length > 0) throw new ValidationError(issues);
    const options: TimingOptions = { ...timing.options, markedDips: [...timing.options.markedDips, dip] };
    return this.create(user, eventId, timing.report.id, options);
  }
}
