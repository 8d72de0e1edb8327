import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable, Logger } from '@nestjs/common';
import type { Briefing, BriefingsSent } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { rolesIn } from '../events/team-choice';
import { escapeHtml, MailService } from '../mail/mail.service';
import { User } from '../users/entities/user.entity';
import { briefingMailLines, briefingOf, briefingStations } from './briefing';
import { PredictionService } from './prediction.service';

/**
 * Briefings: every observer with a station is e-mailed their stations' predicted times, watch window,
 * pointing and cautions, and reads the same on their page. A briefing is sent on purpose by a coordinator,
 * so it is not a notice and goes out whatever the observer's notice settings.
 */
@Injectable()
export class BriefingsService {
  private readonly logger = new Logger(BriefingsService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly predictions: PredictionService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
  ) {}

  private link(eventId: string): string {
    return this.mail.link(`/events/${eventId}?section=briefing`);
  }

  /** The caller's own stations; coordinators (and site admins) see every station. */
  async forUser(user: AuthUser, eventId: string): Promise<Briefing> {
    const snapshot = await this.predictions.current(eventId);
    const all = briefingStations(snapshot);
    const seesAll = (await rolesIn(this.em, user, snapshot.teamId)).includes('coordinator');
    const stations = seesAll ? all : all.filter((s) => s.observerId === user.id);
    return briefingOf(snapshot, stations, this.link(eventId));
  }

  /**
   * One e-mail per observer listing their planned and observing stations (a proposal not yet accepted is
   * not briefed). Sent one after the other so the answer says who got one; audited with the recipients.
   */
  async send(user: AuthUser, eventId: string): Promise<BriefingsSent> {
    const snapshot = await this.predictions.current(eventId);
    const link = this.link(eventId);
    const stations = briefingStations(snapshot).filter((s) => s.status !== 'proposed');
    const byObserver = new Map<string, typeof stations>();
    for (const s of stations)
      if (s.observerId !== null) byObserver.set(s.observerId, [...(byObserver.get(s.observerId) ?? []), s]);
    const users = await this.em.find(
      User,
      { id: { $in: [...byObserver.keys()] } },
      { fields: ['id', 'email', 'name'] },
    );
    const result: BriefingsSent = {
      sent: [],
      withoutObserver: stations.filter((s) => s.observerId === null).map((s) => s.code),
      failed: [],
    };
    for (const observer of users) {
      const mine = byObserver.get(observer.id) ?? [];
      const briefing = briefingOf(snapshot, mine, link);
      const lines = briefingMailLines(briefing, mine);
      try {
        await this.mail.send({
          to: observer.email,
          kind: 'briefing',
          subject: `Briefing: ${snapshot.title}`,
          text: [`Dear ${observer.name},`, '', ...lines, '', `Your briefing page: ${link}`].join('\n'),
          html:
            `<p>Dear ${escapeHtml(observer.name)},</p>` +
            lines.map((l) => (l === '' ? '' : `<p>${escapeHtml(l)}</p>`)).join('') +
            `<p><a href="${escapeHtml(link)}">Your briefing page</a></p>`,
        });
        result.sent.push({ userId: observer.id, name: observer.name, stations: mine.map((s) => s.code) });
      } catch (error) {
        const reason = error instanceof Error ? error.message : String(error);
        this.logger.warn(`briefing to ${observer.email} not sent: ${reason}`);
        result.failed.push({ userId: observer.id, name: observer.name, reason });
      }
    }
    this.audit.record(this.em, {
      teamId: snapshot.teamId,
      eventId,
      actorId: user.id,
      action: 'event.briefing.send',
      objectType: 'event',
      objectId: eventId,
      detail: {
        sent: result.sent.map((r) => ({ userId: r.userId, stations: r.stations })),
        failed: result.failed.map((r) => r.userId),
        withoutObserver: result.withoutObserver,
        closestApproachUtc: snapshot.prediction.closestApproach.timeUtc,
      },
    });
    await this.em.flush();
    return result;
  }
}
