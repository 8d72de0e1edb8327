import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { NoticesService } from '../mail/notices.service';
import { Membership } from '../teams/entities/membership.entity';
import { User } from '../users/entities/user.entity';
import type { Report } from './entities/report.entity';
import type { ReportCorrection } from './entities/report-correction.entity';

const RESULT_WORDS: Record<Report['result'], string> = {
  positive: 'positive',
  negative: 'negative',
  clouded_out: 'clouded-out',
  technical_failure: 'technical-failure',
};

/**
 * The e-mail notices of the report loop, sent once the change is stored: coordinators hear of new
 * reports and correction requests, the author of every decision on theirs. Nobody is told of their own act.
 */
@Injectable()
export class ReportNotices {
  constructor(
    private readonly em: EntityManager,
    private readonly notices: NoticesService,
  ) {}

  private link(report: Report): { path: string; label: string } {
    return { path: `/events/${report.event.id}?section=stations`, label: 'Open the stations of the event' };
  }

  private where(report: Report): string {
    return `${report.station.code}, ${report.event.title}`;
  }

  private async nameOf(userId: string): Promise<string> {
    return (await this.em.findOne(User, { id: userId }, { fields: ['name'] }))?.name ?? 'Someone';
  }

  private async coordinators(report: Report, exceptId: string): Promise<string[]> {
    const members = await this.em.find(Membership, { team: report.event.team.id });
    return members
      .filter((m) => m.roles.includes('coordinator') && m.user.id !== exceptId)
      .map((m) => m.user.id);
  }

  private toAuthor(report: Report, actorId: string): string[] {
    return report.author.id === actorId ? [] : [report.author.id];
  }

  async submitted(report: Report, resubmitted: boolean): Promise<void> {
    const lines = [
      `${report.author.name} ${resubmitted ? 'resubmitted' : 'submitted'} a ${RESULT_WORDS[report.result]} report for ${report.station.code} in "${report.event.title}".`,
    ];
    if (report.timesFromLightCurve && !report.disappearance)
      lines.push(
        'Its times are to come from its light curve: time it under Light curves and accept the timing.',
      );
    this.notices.notify({
      kind: 'report-submitted',
      to: await this.coordinators(report, report.author.id),
      subject: `Report ${resubmitted ? 'resubmitted' : 'submitted'}: ${this.where(report)}`,
      lines,
      link: this.link(report),
    });
  }

  /** `how` is what was accepted: the report's own times, or the timing of its light curve. */
  async decided(report: Report, actorId: string, how: 'report' | 'timing'): Promise<void> {
    const actor = await this.nameOf(actorId);
    const lines =
      report.state === 'rejected'
        ? [
            `${actor} rejected your report for ${report.station.code} in "${report.event.title}".`,
            `Reason: ${report.rejectReason ?? ''}`,
            'You can edit the report and submit it again.',
          ]
        : how === 'timing'
          ? [
              `${actor} timed the light curve of your report for ${report.station.code} in "${report.event.title}" and accepted the timing into the chord; your report is accepted.`,
            ]
          : [
              `${actor} accepted your report for ${report.station.code} in "${report.event.title}" into the chord.`,
            ];
    this.notices.notify({
      kind: 'report-decided',
      to: this.toAuthor(report, actorId),
      subject: `Report ${report.state === 'rejected' ? 'rejected' : 'accepted'}: ${this.where(report)}`,
      lines,
      link: this.link(report),
    });
  }

  async correctionRequested(report: Report, correction: ReportCorrection): Promise<void> {
    this.notices.notify({
      kind: 'correction-requested',
      to: await this.coordinators(report, correction.author.id),
      subject: `Correction requested: ${this.where(report)}`,
      lines: [
        `${report.author.name} asks to correct their accepted report for ${report.station.code} in "${report.event.title}".`,
        `Fields to change: ${Object.keys(correction.changes).join(', ')}.`,
        `Their message: ${correction.message}`,
      ],
      link: this.link(report),
    });
  }

  async correctionDecided(report: Report, correction: ReportCorrection, actorId: string): Promise<void> {
    const actor = await this.nameOf(actorId);
    const accepted = correction.state === 'accepted';
    this.notices.notify({
      kind: 'correction-decided',
      to: this.toAuthor(report, actorId),
      subject: `Correction ${accepted ? 'accepted' : 'rejected'}: ${this.where(report)}`,
      lines: accepted
        ? [
            `${actor} accepted your correction of the report for ${report.station.code} in "${report.event.title}"; the report now holds the corrected values.`,
          ]
        : [
            `${actor} rejected your correction of the report for ${report.station.code} in "${report.event.title}"; the report stays as accepted.`,
            `Reason: ${correction.reason ?? ''}`,
          ],
      link: this.link(report),
    });
  }
}
