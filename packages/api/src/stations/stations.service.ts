import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { CreateStationPayload, PatchStationPayload } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import { EventsService } from '../events/events.service';
import { type StationView, stationView } from '../events/views';
import { Report } from '../reports/entities/report.entity';
import { Membership } from '../teams/entities/membership.entity';
import { User } from '../users/entities/user.entity';
import { Station } from './entities/station.entity';

const PROPOSAL_DECIDED_ELSEWHERE =
  'an observer proposed this site: accept it (POST /api/events/:eventId/site-proposals/:stationId/accept) or decline it (…/decline)';

@Injectable()
export class StationsService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
  ) {}

  private async stationOf(eventId: string, stationId: string): Promise<Station> {
    const station = await this.em.findOne(
      Station,
      { id: stationId, event: eventId },
      { populate: ['event'] },
    );
    if (!station) throw new NotFoundError();
    return station;
  }

  /** An observer must belong to the event's team; anyone else would see nothing of it. */
  private async observerFor(
    teamId: string,
    observerId: string | null | undefined,
  ): Promise<User | null | undefined> {
    if (observerId === undefined || observerId === null) return observerId;
    const membership = await this.em.findOne(
      Membership,
      { team: teamId, user: observerId },
      { populate: ['user'] },
    );
    if (!membership)
      throw new ValidationError([{ path: 'observerId', message: 'not a member of this team' }]);
    return membership.user;
  }

  private async assertCodeFree(eventId: string, code: string, exceptId?: string): Promise<void> {
    const clash = await this.em.findOne(Station, {
      event: eventId,
      code,
      ...(exceptId ? { id: { $ne: exceptId } } : {}),
    });
    if (clash)
      throw new ValidationError([
        { path: 'code', message: `station id "${code}" is already used in this event` },
      ]);
  }

  private apply(station: Station, body: PatchStationPayload, observer: User | null | undefined): void {
    if (body.code !== undefined) station.code = body.code;
    if (body.latDeg !== undefined) station.latDeg = body.latDeg;
    if (body.lonDeg !== undefined) station.lonDeg = body.lonDeg;
    if (body.heightM !== undefined) station.heightM = body.heightM;
    if (observer !== undefined) station.observer = observer;
    if (body.observerName !== undefined) station.observerName = body.observerName;
    if (body.apertureMm !== undefined) station.apertureMm = body.apertureMm;
    if (body.camera !== undefined) station.camera = body.camera;
    if (body.exposureSeconds !== undefined) station.exposureSeconds = body.exposureSeconds;
    if (body.timeSource !== undefined) station.timeSource = body.timeSource;
    if (body.status !== undefined) station.status = body.status;
  }

  async create(user: AuthUser, eventId: string, body: CreateStationPayload): Promise<StationView> {
    const event = await this.events.find(eventId);
    await this.assertCodeFree(eventId, body.code);
    const observer = await this.observerFor(event.team.id, body.observerId);
    const station = new Station(event, body);
    station.position = (await this.em.count(Station, { event })) + 1;
    this.apply(station, body, observer);
    this.em.persist(station);
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'station.create',
      objectType: 'station',
      objectId: station.id,
      detail: { code: station.code },
    });
    await this.em.flush();
    return stationView(station);
  }

  async update(
    user: AuthUser,
    eventId: string,
    stationId: string,
    body: PatchStationPayload,
  ): Promise<StationView> {
    const event = await this.events.find(eventId);
    const station = await this.stationOf(eventId, stationId);
    // An observer's proposal is decided on its own routes, which say who decided and tell the observer.
    if (body.status !== undefined && station.status === 'proposed')
      throw new ValidationError([{ path: 'status', message: PROPOSAL_DECIDED_ELSEWHERE }]);
    if (body.code !== undefined) await this.assertCodeFree(eventId, body.code, stationId);
    this.apply(station, body, await this.observerFor(event.team.id, body.observerId));
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'station.update',
      objectType: 'station',
      objectId: station.id,
      detail: { fields: Object.keys(body) },
    });
    await this.em.flush();
    return stationView(station);
  }

  /** A station with reports is not deleted: the reports are what observers submitted. */
  async remove(user: AuthUser, eventId: string, stationId: string): Promise<void> {
    const event = await this.events.find(eventId);
    const station = await this.stationOf(eventId, stationId);
    if ((await this.em.count(Report, { station })) > 0)
      throw new ConflictError(
        'This station has observer reports; reject them instead of deleting the station',
      );
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'station.delete',
      objectType: 'station',
      objectId: station.id,
      detail: { code: station.code },
    });
    this.em.remove(station);
    await this.em.flush();
  }
}
