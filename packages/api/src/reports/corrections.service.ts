import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { type CorrectionView, type ReportCorrectionPayload, reportTimingProblems } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { User } from '../users/entities/user.entity';
import type { Report } from './entities/report.entity';
import { ReportCorrection } from './entities/report-correction.entity';
import { writeReportChord, writeReportRingEvents } from './report-chord';
import { applyReportFields, CHORD_FIELDS, type ReportFields, reportFieldsOf } from './report-fields';
import { ReportNotices } from './report-notices';
import { correctionView, type ReportView } from './report-view';
import { awaitsTiming, checkedChordOf, ReportsService } from './reports.service';

const ONE_PENDING = 'A correction of this report is already waiting for a coordinator';

/** 400 naming `changes.<field>` when the report with these changes would not be a valid report. */
function checkChanges(report: Report, changes: ReportCorrectionPayload['changes']): void {
  const merged: ReportFields = reportFieldsOf(report);
  applyReportFields(merged, changes);
  const problems = reportTimingProblems(merged);
  if (problems.length > 0)
    throw new ValidationError(problems.map((p) => ({ path: `changes.${p.path}`, message: p.message })));
}

/**
 * An observer asks to correct their accepted report; the report keeps what was accepted until a
 * coordinator accepts the change, which then rewrites the report's chord as an accept does. One
 * request at a time per report, which MariaDB enforces (see ReportCorrection).
 */
@Injectable()
export class CorrectionsService {
  constructor(
    private readonly em: EntityManager,
    private readonly reports: ReportsService,
    private readonly audit: AuditService,
    private readonly notices: ReportNotices,
  ) {}

  async request(user: AuthUser, reportId: string, body: ReportCorrectionPayload): Promise<CorrectionView> {
    const report = await this.reports.findVisible(user, reportId);
    if (report.author.id !== user.id) throw new ForbiddenError('Only the author can ask to correct a report');
    if (report.state !== 'accepted')
      throw new ConflictError(`The report is ${report.state}, not accepted: edit it instead`);
    checkChanges(report, body.changes);
    if (await this.em.findOne(ReportCorrection, { openReportId: report.id }))
      throw new ConflictError(ONE_PENDING);
    const correction = new ReportCorrection(
      report,
      this.em.getReference(User, user.id),
      body.changes,
      body.message,
    );
    this.em.persist(correction);
    this.audit.record(this.em, {
      teamId: report.event.team.id,
      eventId: report.event.id,
      actorId: user.id,
      action: 'report.correction.request',
      objectType: 'report',
      objectId: report.id,
      detail: { correctionId: correction.id, fields: Object.keys(body.changes) },
    });
    try {
      await this.em.flush();
    } catch (error) {
      // Two requests at once: both passed the look-up above, the unique key lets one in.
      if (error instanceof UniqueConstraintViolationException) throw new ConflictError(ONE_PENDING);
      throw error;
    }
    await this.em.populate(correction, ['author', 'decidedBy']);
    await this.notices.correctionRequested(report, correction);
    return correctionView(correction);
  }

  private async pending(
    reportId: string,
    correctionId: string,
  ): Promise<{ report: Report; correction: ReportCorrection }> {
    const report = await this.reports.find(reportId);
    const correction = await this.em.findOne(ReportCorrection, { id: correctionId, report: report.id });
    if (!correction) throw new NotFoundError('No such correction of this report');
    if (correction.state !== 'pending')
      throw new ConflictError(`The correction is ${correction.state}, not pending`);
    return { report, correction };
  }

  /** Conditional, so that of two decisions at once exactly one counts. */
  private async decide(
    em: EntityManager,
    correction: ReportCorrection,
    user: AuthUser,
    state: 'accepted' | 'rejected',
  ): Promise<void> {
    const decided = await em.nativeUpdate(
      ReportCorrection,
      { id: correction.id, state: 'pending' },
      { state, openReportId: null },
    );
    if (decided === 0) throw new ConflictError('The correction was decided meanwhile');
    correction.state = state;
    correction.openReportId = null;
    correction.decidedBy = em.getReference(User, user.id);
    correction.decidedAt = new Date();
  }

  /**
   * Applies the changes to the report. The chord is rewritten only when a field it is made of changed,
   * with the same rule as an accept about better-timed values; a positive left without times (to come
   * from its light curve) keeps its chord until its timing is accepted. Ring events follow the ring dips
   * only when those changed.
   */
  async accept(
    user: AuthUser,
    reportId: string,
    correctionId: string,
    replaceTimedChord: boolean,
  ): Promise<ReportView> {
    const { report, correction } = await this.pending(reportId, correctionId);
    checkChanges(report, correction.changes);
    const before = reportFieldsOf(report);
    const changed = Object.keys(correction.changes).filter((k): k is keyof ReportFields => k in before);
    applyReportFields(report, correction.changes);
    const rewritesChord =
      CHORD_FIELDS.some((f) => correction.changes[f] !== undefined) && !awaitsTiming(report);
    const input = rewritesChord ? checkedChordOf(report, 'changes') : null;
    await this.em.transactional(async (em) => {
      await this.decide(em, correction, user, 'accepted');
      const written = rewritesChord
        ? await writeReportChord(em, {
            report,
            input,
            timing: null,
            what: 'the corrected report',
            times: "the corrected report's times",
            replaceTimedChord,
          })
        : null;
      if (correction.changes.ringDips !== undefined) await writeReportRingEvents(em, report);
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'report.correction.accept',
        objectType: 'report',
        objectId: report.id,
        detail: {
          correctionId: correction.id,
          before: Object.fromEntries(changed.map((k) => [k, before[k]])),
          after: correction.changes,
          chordId: written?.chord?.id ?? null,
          replaced: written?.before ?? null,
        },
      });
      await em.flush();
    });
    await this.notices.correctionDecided(report, correction, user.id);
    return this.reports.view(report);
  }

  async reject(user: AuthUser, reportId: string, correctionId: string, reason: string): Promise<ReportView> {
    const { report, correction } = await this.pending(reportId, correctionId);
    await this.em.transactional(async (em) => {
      await this.decide(em, correction, user, 'rejected');
      correction.reason = reason;
      this.audit.record(em, {
        teamId: report.event.team.id,
        eventId: report.event.id,
        actorId: user.id,
        action: 'report.correction.reject',
        objectType: 'report',
        objectId: report.id,
        detail: { correctionId: correction.id, reason },
      });
      await em.flush();
    });
    await this.notices.correctionDecided(report, correction, user.id);
    return this.reports.view(report);
  }
}
