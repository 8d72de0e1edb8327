import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { EventInput, FitOptions, StarInput, TimeScale, EphemerisRow } from '@limbus/geometry';
import { type CreateEventPayload, type PatchEventPayload, validateEventFile } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { Chord } from '../chords/entities/chord.entity';
import { NotFoundError, ValidationError } from '../common/domain-errors';
import { FitRun } from '../fits/entities/fit-run.entity';
import { Membership } from '../teams/entities/membership.entity';
import { OccultationEvent, type EventState } from './entities/occultation-event.entity';
import { EventDetailCache } from './event-detail.cache';
import { eventFileOf, loadEventRows, persistEventFile, type EventRows } from './event-rows';
import { chooseTeam } from './team-choice';
import {
  type ChordView,
  chordView,
  type RingEventView,
  ringEventView,
  type StationView,
  stationView,
} from './views';

export interface EventSummary {
  id: string;
  title: string;
  teamId: string;
  eventDate: string | null;
  star: { raDeg: number; decDeg: number };
  counts: { stations: number; chords: number; reports: number; fits: number };
  latestFit: { id: string; state: string } | null;
}

export interface EventDetail {
  id: string;
  teamId: string;
  title: string;
  state: EventState;
  star: StarInput;
  ephemeris: { timeScale: TimeScale; rows: EphemerisRow[] };
  earthRotation: { dut1Seconds: number };
  fitDefaults: FitOptions;
  deletedAt: string | null;
  createdAt: string;
  updatedAt: string;
  stations: StationView[];
  chords: ChordView[];
  ringEvents: RingEventView[];
}

/** Earliest chord time of an event: a positive's disappearance or a negative's start. */
function chordTime(c: Pick<Chord, 'disappearance' | 'startUtc'>): string | null {
  return c.disappearance?.time ?? c.startUtc ?? null;
}

@Injectable()
export class EventsService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly detailCache: EventDetailCache,
  ) {}

  /** Throws NotFound for a missing or (unless asked) soft-deleted event. */
  async find(eventId: string, options: { includeDeleted?: boolean } = {}): Promise<OccultationEvent> {
    const event = await this.em.findOne(OccultationEvent, { id: eventId }, { populate: ['team'] });
    if (!event || (event.state === 'deleted' && !options.includeDeleted)) throw new NotFoundError();
    return event;
  }

  async list(user: AuthUser): Promise<EventSummary[]> {
    const memberships = await this.em.find(Membership, { user: user.id });
    const teamIds = memberships.map((m) => m.team.id);
    if (teamIds.length === 0) return [];
    const events = await this.em.find(
      OccultationEvent,
      { team: { $in: teamIds }, state: 'active' },
      { orderBy: { createdAt: 'desc', id: 'asc' } },
    );
    const ids = events.map((e) => e.id);
    if (ids.length === 0) return [];
    const placeholders = ids.map(() => '?').join(', ');
    const countBy = async (table: 'stations' | 'chords' | 'reports' | 'fit_runs') => {
      const rows: Array<{ event_id: string; n: number | string | bigint }> = await this.em.execute(
        `select event_id, count(*) as n from \`${table}\` where event_id in (${placeholders}) group by event_id`,
        ids,
      );
      return new Map(rows.map((r) => [r.event_id, Number(r.n)]));
    };
    const [stations, chords, reports, fits] = await Promise.all([
      countBy('stations'),
      countBy('chords'),
      countBy('reports'),
      countBy('fit_runs'),
    ]);
    const chordRows = await this.em.find(
      Chord,
      { event: { $in: ids } },
      { fields: ['event', 'disappearance', 'startUtc'] },
    );
    const firstTime = new Map<string, string>();
    for (const c of chordRows) {
      const time = chordTime(c);
      const seen = firstTime.get(c.event.id);
      if (time && (!seen || time < seen)) firstTime.set(c.event.id, time);
    }
    const fitRows = await this.em.find(
      FitRun,
      { event: { $in: ids } },
      { fields: ['event', 'state', 'createdAt'], orderBy: { createdAt: 'desc', id: 'desc' } },
    );
    const latest = new Map<string, { id: string; state: string }>();
    for (const f of fitRows)
      if (!latest.has(f.event.id)) latest.set(f.event.id, { id: f.id, state: f.state });
    return events.map((e) => ({
      id: e.id,
      title: e.title,
      teamId: e.team.id,
      eventDate: firstTime.get(e.id) ?? null,
      star: { raDeg: e.star.raDeg, decDeg: e.star.decDeg },
      counts: {
        stations: stations.get(e.id) ?? 0,
        chords: chords.get(e.id) ?? 0,
        reports: reports.get(e.id) ?? 0,
        fits: fits.get(e.id) ?? 0,
      },
      latestFit: latest.get(e.id) ?? null,
    }));
  }

  /**
   * The event as the desk shows it. Reads the revision first (one indexed row, no entity) and builds
   * the view only when the cache has none for that revision: the workspace reads far more than it writes.
   */
  async detail(eventId: string): Promise<EventDetail> {
    const [current] = await this.em
      .getConnection()
      .execute<Array<{ state: string; revision: number }>>(
        'select `state`, `revision` from `events` where `id` = ? limit 1',
        [eventId],
      );
    if (!current || current.state === 'deleted') throw new NotFoundError();
    const cached = this.detailCache.get(eventId, current.revision);
    if (cached) return cached;
    const event = await this.find(eventId);
    const detail = this.detailOf(await loadEventRows(this.em, event));
    this.detailCache.set(eventId, current.revision, detail);
    return detail;
  }

  detailOf(rows: EventRows): EventDetail {
    const e = rows.event;
    return {
      id: e.id,
      teamId: e.team.id,
      title: e.title,
      state: e.state,
      star: e.star,
      ephemeris: e.ephemeris,
      earthRotation: e.earthRotation,
      fitDefaults: e.fitDefaults,
      deletedAt: e.deletedAt?.toISOString() ?? null,
      createdAt: e.createdAt.toISOString(),
      updatedAt: e.updatedAt.toISOString(),
      stations: rows.stations.map(stationView),
      chords: rows.chords.map(chordView),
      ringEvents: rows.ringEvents.map(ringEventView),
    };
  }

  /** One transaction: either the whole file is stored, or (on any problem) nothing is. */
  async importFile(
    user: AuthUser,
    teamId: string | undefined,
    raw: Buffer | undefined,
  ): Promise<{ id: string }> {
    if (!raw)
      throw new ValidationError([{ path: 'file', message: 'missing; send the event file as field "file"' }]);
    let json: unknown;
    try {
      json = JSON.parse(raw.toString('utf8'));
    } catch (error) {
      throw new ValidationError([
        {
          path: 'file',
          message: `not valid JSON: ${error instanceof Error ? error.message : String(error)}`,
        },
      ]);
    }
    const validation = validateEventFile(json);
    if (!validation.ok) throw new ValidationError(validation.problems);
    const team = await chooseTeam(this.em, user, teamId, ['coordinator']);
    return this.em.transactional(async (em) => {
      const rows = persistEventFile(em, team, validation.event, user.id);
      this.audit.record(em, {
        teamId: team.id,
        eventId: rows.event.id,
        actorId: user.id,
        action: 'event.import',
        objectType: 'event',
        objectId: rows.event.id,
        detail: {
          stations: rows.stations.length,
          chords: rows.chords.length,
          ringEvents: rows.ringEvents.length,
        },
      });
      await em.flush();
      return { id: rows.event.id };
    });
  }

  async create(user: AuthUser, body: CreateEventPayload): Promise<{ id: string }> {
    const team = await chooseTeam(this.em, user, body.teamId, ['coordinator']);
    return this.em.transactional(async (em) => {
      const event = new OccultationEvent(team, {
        title: body.title,
        star: body.star,
        ephemeris: body.ephemeris,
        earthRotation: body.earthRotation,
        fitDefaults: body.fitDefaults,
      });
      event.createdById = user.id;
      em.persist(event);
      this.audit.record(em, {
        teamId: team.id,
        eventId: event.id,
        actorId: user.id,
        action: 'event.create',
        objectType: 'event',
        objectId: event.id,
      });
      await em.flush();
      return { id: event.id };
    });
  }

  async update(user: AuthUser, eventId: string, body: PatchEventPayload): Promise<EventDetail> {
    const event = await this.find(eventId);
    const changed = Object.keys(body).filter((k) => body[k as keyof PatchEventPayload] !== undefined);
    if (body.title !== undefined) event.title = body.title;
    if (body.star !== undefined) event.star = body.star;
    if (body.ephemeris !== undefined) event.ephemeris = body.ephemeris;
    if (body.earthRotation !== undefined) event.earthRotation = body.earthRotation;
    if (body.fitDefaults !== undefined) event.fitDefaults = body.fitDefaults;
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'event.update',
      objectType: 'event',
      objectId: eventId,
      detail: { fields: changed },
    });
    await this.em.flush();
    return this.detail(eventId);
  }

  async softDelete(user: AuthUser, eventId: string): Promise<void> {
    const event = await this.find(eventId);
    event.state = 'deleted';
    event.deletedAt = new Date();
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'event.delete',
      objectType: 'event',
      objectId: eventId,
    });
    await this.em.flush();
  }

  async restore(user: AuthUser, eventId: string): Promise<EventDetail> {
    const event = await this.find(eventId, { includeDeleted: true });
    event.state = 'active';
    event.deletedAt = null;
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'event.restore',
      objectType: 'event',
      objectId: eventId,
    });
    await this.em.flush();
    return this.detail(eventId);
  }

  async exportFile(eventId: string): Promise<EventInput> {
    const event = await this.find(eventId);
    return eventFileOf(await loadEventRows(this.em, event));
  }
}
