import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { STATION_STATUS_LABELS, type CoordinatorStationStatus } from '@limbus/schema';
import type { OccultationEvent } from '../events/entities/occultation-event.entity';
import { NoticesService } from '../mail/notices.service';
import type { Station } from '../stations/entities/station.entity';
import { Membership } from '../teams/entities/membership.entity';
import { User } from '../users/entities/user.entity';

const stationsLink = (eventId: string) => ({
  path: `/events/${eventId}?section=stations`,
  label: 'Open the stations of the event',
});

/**
 * The notices of site proposals, sent once the change is stored: coordinators hear of a new proposal, the
 * proposer of the decision on it. Nobody is told of their own act.
 */
@Injectable()
export class PlanningNotices {
  constructor(
    private readonly em: EntityManager,
    private readonly notices: NoticesService,
  ) {}

  async proposed(event: OccultationEvent, station: Station, proposerName: string): Promise<void> {
    const members = await this.em.find(Membership, { team: event.team.id });
    const proposerId = station.observer?.id;
    this.notices.notify({
      kind: 'site-proposed',
      to: members
        .filter((m) => m.roles.includes('coordinator') && m.user.id !== proposerId)
        .map((m) => m.user.id),
      subject: `Site proposed: ${station.code}, ${event.title}`,
      lines: [
        `${proposerName} proposes to observe "${event.title}" from ${station.code} (${station.latDeg.toFixed(4)}°, ${station.lonDeg.toFixed(4)}°, ${station.heightM.toFixed(0)} m).`,
        ...(station.notes ? [`Their notes: ${station.notes}`] : []),
        'Accept it as a planned or observing station, or decline it, under Stations.',
      ],
      link: stationsLink(event.id),
    });
  }

  async decided(
    station: Station,
    actorId: string,
    decision: { accepted: true; status: CoordinatorStationStatus } | { accepted: false; reason: string },
  ): Promise<void> {
    const observerId = station.observer?.id;
    if (observerId === undefined || observerId === actorId) return;
    const actor =
      (await this.em.findOne(User, { id: actorId }, { fields: ['name'] }))?.name ?? 'A coordinator';
    const where = `${station.code}, ${station.event.title}`;
    this.notices.notify({
      kind: 'site-proposal-decided',
      to: [observerId],
      subject: `Site ${decision.accepted ? 'accepted' : 'declined'}: ${where}`,
      lines: decision.accepted
        ? [
            `${actor} accepted your proposed site ${station.code} for "${station.event.title}" as a station (${STATION_STATUS_LABELS[decision.status].toLowerCase()}).`,
          ]
        : [
            `${actor} declined your proposed site ${station.code} for "${station.event.title}"; it was removed.`,
            ...(decision.reason === '' ? [] : [`Reason: ${decision.reason}`]),
          ],
      link: stationsLink(station.event.id),
    });
  }
}
