import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type {
  AcceptSiteProposalPayload,
  DeclineSiteProposalPayload,
  SiteProposalPayload,
} from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, ForbiddenError, NotFoundError } from '../common/domain-errors';
import { EventsService } from '../events/events.service';
import { type StationView, stationView } from '../events/views';
import { Report } from '../reports/entities/report.entity';
import { Station } from '../stations/entities/station.entity';
import { Membership } from '../teams/entities/membership.entity';
import { PlanningNotices } from './planning-notices';

/** A second site with a station id the event already has: 409, naming the field, whatever the timing. */
function codeTaken(code: string): ConflictError {
  const message = `station id "${code}" is already used in this event`;
  return new ConflictError(message, 'station-code-taken', { issues: [{ path: 'code', message }] });
}

const ALREADY_DECIDED = 'This proposal was already decided (accepted, declined or changed meanwhile)';

const reportedFrom = () =>
  new ConflictError(
    'The observer has already reported from this proposed site; accept it, or reject the report first',
  );

/**
 * Observers propose their own sites; coordinators accept them (as planned or observing stations) or
 * decline them (the proposed station is removed). A decision changes only a station still `proposed`:
 * of two decisions at once one applies, the other gets 409.
 */
@Injectable()
export class SiteProposalsService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
    private readonly notices: PlanningNotices,
  ) {}

  async propose(user: AuthUser, eventId: string, body: SiteProposalPayload): Promise<StationView> {
    const event = await this.events.find(eventId);
    // The proposer becomes the station's observer, so they must be a member (a site admin outside the
    // team has no place at the event).
    const membership = await this.em.findOne(
      Membership,
      { team: event.team.id, user: user.id },
      { populate: ['user'] },
    );
    if (!membership)
      throw new ForbiddenError('Only a member of the team can propose their own site for its events');
    if ((await this.em.count(Station, { event, code: body.code })) > 0) throw codeTaken(body.code);
    const station = new Station(event, body);
    station.status = 'proposed';
    station.observer = membership.user;
    station.observerName = membership.user.name;
    station.notes = body.notes === undefined || body.notes === '' ? null : body.notes;
    try {
      await this.em.transactional(async (em) => {
        station.position = (await em.count(Station, { event })) + 1;
        em.persist(station);
        this.audit.record(em, {
          teamId: event.team.id,
          eventId,
          actorId: user.id,
          action: 'station.propose',
          objectType: 'station',
          objectId: station.id,
          detail: {
            code: station.code,
            latDeg: station.latDeg,
            lonDeg: station.lonDeg,
            heightM: station.heightM,
          },
        });
        await em.flush();
      });
    } catch (error) {
      // Two proposals of one id that both passed the look-up: the unique key (event, code) lets one in.
      if (error instanceof UniqueConstraintViolationException) throw codeTaken(body.code);
      throw error;
    }
    await this.notices.proposed(event, station, membership.user.name);
    return stationView(station);
  }

  private async proposal(eventId: string, stationId: string): Promise<Station> {
    const station = await this.em.findOne(
      Station,
      { id: stationId, event: eventId },
      { populate: ['event', 'event.team', 'observer'] },
    );
    if (!station) throw new NotFoundError();
    if (station.status !== 'proposed') throw new ConflictError(ALREADY_DECIDED);
    return station;
  }

  async accept(
    user: AuthUser,
    eventId: string,
    stationId: string,
    body: AcceptSiteProposalPayload,
  ): Promise<StationView> {
    await this.events.find(eventId);
    const station = await this.proposal(eventId, stationId);
    await this.em.transactional(async (em) => {
      // Only from `proposed`: a decision made meanwhile leaves nothing to change here.
      const changed = await em.nativeUpdate(
        Station,
        { id: stationId, event: eventId, status: 'proposed' },
        { status: body.status },
      );
      if (changed !== 1) throw new ConflictError(ALREADY_DECIDED);
      this.audit.record(em, {
        teamId: station.event.team.id,
        eventId,
        actorId: user.id,
        action: 'station.proposal.accept',
        objectType: 'station',
        objectId: stationId,
        detail: { code: station.code, status: body.status },
      });
      await em.flush();
    });
    station.status = body.status;
    await this.notices.decided(station, user.id, { accepted: true, status: body.status });
    return stationView(station);
  }

  async decline(
    user: AuthUser,
    eventId: string,
    stationId: string,
    body: DeclineSiteProposalPayload,
  ): Promise<void> {
    await this.events.find(eventId);
    const station = await this.proposal(eventId, stationId);
    await this.em.transactional(async (em) => {
      // Lock the row first: a report filed from the site waits on it (its foreign key check reads the
      // station), so the count below sees every report, and reports would go with the station otherwise.
      const locked = await em.findOne(
        Station,
        { id: stationId, event: eventId, status: 'proposed' },
        { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true },
      );
      if (!locked) throw new ConflictError(ALREADY_DECIDED);
      if ((await em.count(Report, { station: stationId })) > 0) throw reportedFrom();
      await em.nativeDelete(Station, { id: stationId });
      this.audit.record(em, {
        teamId: station.event.team.id,
        eventId,
        actorId: user.id,
        action: 'station.proposal.decline',
        objectType: 'station',
        objectId: stationId,
        detail: {
          code: station.code,
          latDeg: station.latDeg,
          lonDeg: station.lonDeg,
          heightM: station.heightM,
          observerId: station.observer?.id ?? null,
          reason: body.reason,
        },
      });
      await em.flush();
    });
    await this.notices.decided(station, user.id, { accepted: false, reason: body.reason });
  }
}
