import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { CreateStationPayload, PatchStationPayload } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import { assertEventRoom } from '../events/event-size';
import { EventsService } from '../events/events.service';
import { type StationView, stationView } from '../events/views';
import { Report } from '../reports/entities/report.entity';
import { Membership } from '../teams/entities/membership.entity';
import { User } from '../users/entities/user.entity';
import { Station } from './entities/station.entity';

function codeTaken(code: string): { path: string; message: string } {
  return { path: 'code', message: `station id "${code}" is already used in this event` };
}

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

  private async assertCodeFree(
    em: EntityManager,
    eventId: string,
    code: string,
    exceptId?: string,
  ): Promise<void> {
    const clash = await em.findOne(Station, {
      event: eventId,
      code,
      ...(exceptId ? { id: { $ne: exceptId } } : {}),
    });
    if (clash) throw new ValidationError([codeTaken(code)]);
  }

  /**
   * Runs a write that sets a station id. The look-up above answers the usual case; two writes of one id
   * that meet both pass it, and the unique key (event, code) lets one in: the other gets the same 400.
   */
  private async writingCode<T>(code: string | undefined, write: () => Promise<T>): Promise<T> {
    try {
      return await write();
    } catch (error) {
      if (code !== undefined && error instanceof UniqueConstraintViolationException)
        throw new ValidationError([codeTaken(code)]);
      throw error;
    }
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
    const observer = await this.observerFor(event.team.id, body.observerId);
    const station = await this.writingCode(body.code, () =>
      this.em.transactional(async (em) => {
        // The event's row is locked from here on: adds to one event are counted one after the other.
        await assertEventRoom(em, eventId, { stations: 1 });
        await this.assertCodeFree(em, eventId, body.code);
        const row = new Station(event, body);
        row.position = (await em.count(Station, { event })) + 1;
        this.apply(row, body, observer);
        em.persist(row);
        this.audit.record(em, {
          teamId: event.team.id,
          eventId,
          actorId: user.id,
          action: 'station.create',
          objectType: 'station',
          objectId: row.id,
          detail: { code: row.code },
        });
        await em.flush();
        return row;
      }),
    );
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
    if (body.code !== undefined) await this.assertCodeFree(this.em, eventId, body.code, stationId);
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
    await this.writingCode(body.code, () => this.em.flush());
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
