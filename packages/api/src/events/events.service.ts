import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type {
  EventInput,
  FitOptions,
  PredictionSettings,
  StarInput,
  TimeScale,
  EphemerisRow,
} from '@limbus/geometry';
import {
  type CreateEventPayload,
  type EventsPage,
  type EventsQuery,
  type EventSummary,
  type PatchEventPayload,
  type PredictionOffsetSource,
  validateEventFile,
} from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { chooseBody, type BodyChoice } from '../bodies/body-choice';
import { Body } from '../bodies/entities/body.entity';
import { ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { keepsOffsetSource, predictionSettingsProblems } from '../planning/prediction-settings';
import { Membership } from '../teams/entities/membership.entity';
import { OccultationEvent, type EventState } from './entities/occultation-event.entity';
import { defaultEventTimeUtc, eventDataSha256, wholeSecondUtc } from './event-data';
import { EventDetailCache } from './event-detail.cache';
import { eventFileOf, loadEventRows, persistEventFile, planningFileOf, type EventRows } from './event-rows';
import { listEventIds, summariesOf } from './event-list';
import { chooseTeam, rolesIn } from './team-choice';
import {
  type ChordView,
  chordView,
  type RingEventView,
  ringEventView,
  type StationView,
  stationView,
} from './views';

export interface EventDetail {
  id: string;
  teamId: string;
  bodyId: string;
  bodyName: string;
  bodyDesignation: string | null;
  title: string;
  /** "YYYY-MM-DDThh:mm:ssZ" */
  eventTimeUtc: string;
  /** SHA-256 of the event's data now (eventDataSha256); a fit whose own differs ran on older data. */
  dataSha256: string;
  state: EventState;
  star: StarInput;
  ephemeris: { timeScale: TimeScale; rows: EphemerisRow[] };
  earthRotation: { dut1Seconds: number };
  fitDefaults: FitOptions;
  /** The event file's `prediction` section, or null until a coordinator sets it. */
  prediction: PredictionSettings | null;
  /** Which solved fit the prediction's offset and its σ were taken from, while they are still that fit's. */
  predictionOffsetSource: PredictionOffsetSource | null;
  deletedAt: string | null;
  createdAt: string;
  updatedAt: string;
  stations: StationView[];
  chords: ChordView[];
  ringEvents: RingEventView[];
}

/** The multipart fields of an import beside the file. */
export interface ImportFields {
  teamId?: string | undefined;
  bodyId?: string | undefined;
  bodyName?: string | undefined;
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
    const event = await this.em.findOne(OccultationEvent, { id: eventId }, { populate: ['team', 'body'] });
    if (!event || (event.state === 'deleted' && !options.includeDeleted)) throw new NotFoundError();
    return event;
  }

  /**
   * One page of the events of the caller's teams, filtered and sorted in SQL; summaries are built for
   * that page only, so the list costs the same however large the team's events are.
   */
  async list(user: AuthUser, query: EventsQuery): Promise<EventsPage> {
    const memberships = await this.em.find(Membership, { user: user.id });
    let teams = memberships.map((m) => ({ id: m.team.id, roles: m.roles }));
    if (query.teamId !== undefined) teams = teams.filter((t) => t.id === query.teamId);
    if (query.archived) {
      // Deleted events are the coordinators' to restore: a member who is not is refused when naming the
      // team, and otherwise sees none of that team's. Like every list, only the caller's own teams count.
      const coordinated = teams.filter((t) => user.isAdmin || t.roles.includes('coordinator'));
      if (query.teamId !== undefined && teams.length > 0 && coordinated.length === 0)
        throw new ForbiddenError();
      teams = coordinated;
    }
    const empty: EventsPage = { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    if (teams.length === 0) return empty;
    const reviewerTeams = teams.filter((t) => user.isAdmin || t.roles.includes('reviewer')).map((t) => t.id);
    const { ids, total } = await listEventIds(this.em, {
      userId: user.id,
      teamIds: teams.map((t) => t.id),
      reviewerTeamIds: reviewerTeams,
      query,
    });
    if (ids.length === 0) return { ...empty, total };
    const items: EventSummary[] = await summariesOf(this.em, ids, user.id, (id, revision) =>
      this.dataSha256At(id, revision),
    );
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  /** The event's current data hash, from the detail view cached under that revision. */
  async dataSha256At(eventId: string, revision: number): Promise<string> {
    return (
      this.detailCache.dataSha256(eventId, revision) ??
      (await this.detailAt(eventId, revision, { includeDeleted: true })).dataSha256
    );
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
    return this.detailAt(eventId, current.revision);
  }

  private async detailAt(
    eventId: string,
    revision: number,
    options: { includeDeleted?: boolean } = {},
  ): Promise<EventDetail> {
    const cached = this.detailCache.get(eventId, revision);
    if (cached) return cached;
    const event = await this.find(eventId, options);
    const detail = this.detailOf(await loadEventRows(this.em, event));
    this.detailCache.set(eventId, revision, detail);
    return detail;
  }

  detailOf(rows: EventRows): EventDetail {
    const e = rows.event;
    return {
      id: e.id,
      teamId: e.team.id,
      bodyId: e.body.id,
      bodyName: e.body.name,
      bodyDesignation: e.body.designation,
      title: e.title,
      eventTimeUtc: e.eventTimeUtc,
      dataSha256: eventDataSha256(eventFileOf(rows)),
      state: e.state,
      star: e.star,
      ephemeris: e.ephemeris,
      earthRotation: e.earthRotation,
      fitDefaults: e.fitDefaults,
      prediction: e.prediction,
      predictionOffsetSource: e.predictionSource,
      deletedAt: e.deletedAt?.toISOString() ?? null,
      createdAt: e.createdAt.toISOString(),
      updatedAt: e.updatedAt.toISOString(),
      stations: rows.stations.map(stationView),
      chords: rows.chords.map(chordView),
      ringEvents: rows.ringEvents.map(ringEventView),
    };
  }

  /** One transaction: either the whole file is stored, or (on any problem) nothing is. */
  async importFile(user: AuthUser, fields: ImportFields, raw: Buffer | undefined): Promise<{ id: string }> {
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
    const team = await chooseTeam(this.em, user, fields.teamId, ['coordinator']);
    const named = fields.bodyName ?? validation.body?.name;
    const choice: BodyChoice = {
      bodyId: fields.bodyId,
      name:
        named === undefined
          ? undefined
          : {
              name: named,
              designation: fields.bodyName === undefined ? validation.body?.designation : undefined,
            },
      path: { bodyId: 'bodyId', name: fields.bodyName === undefined ? 'file.body.name' : 'bodyName' },
    };
    return this.em.transactional(async (em) => {
      const body = await chooseBody(em, team, choice, user.id);
      const rows = persistEventFile(em, team, body, validation.event, user.id);
      rows.event.prediction = validation.prediction ?? null;
      this.audit.record(em, {
        teamId: team.id,
        eventId: rows.event.id,
        actorId: user.id,
        action: 'event.import',
        objectType: 'event',
        objectId: rows.event.id,
        detail: {
          body: body.name,
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
      const observed = await chooseBody(
        em,
        team,
        { bodyId: body.bodyId, name: body.newBody, path: { bodyId: 'bodyId', name: 'newBody.name' } },
        user.id,
      );
      const event = new OccultationEvent(team, observed, {
        title: body.title,
        eventTimeUtc:
          body.eventTimeUtc === undefined
            ? defaultEventTimeUtc({ ephemeris: body.ephemeris })
            : wholeSecondUtc(body.eventTimeUtc),
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
        detail: { body: observed.name },
      });
      await em.flush();
      return { id: event.id };
    });
  }

  async update(user: AuthUser, eventId: string, body: PatchEventPayload): Promise<EventDetail> {
    const event = await this.find(eventId);
    // Planning the night is the coordinator's: a modeller may correct the star and the ephemeris, not this.
    if (
      body.prediction !== undefined &&
      !(await rolesIn(this.em, user, event.team.id)).includes('coordinator')
    )
      throw new ForbiddenError('Prediction settings are set by a coordinator of the team');
    const changed = Object.keys(body).filter((k) => body[k as keyof PatchEventPayload] !== undefined);
    if (body.title !== undefined) event.title = body.title;
    if (body.eventTimeUtc !== undefined) event.eventTimeUtc = wholeSecondUtc(body.eventTimeUtc);
    if (body.bodyId !== undefined) {
      const moved = await this.em.findOne(Body, { id: body.bodyId, team: event.team });
      if (!moved) throw new ValidationError([{ path: 'bodyId', message: 'no such body in this team' }]);
      event.body = moved;
    }
    if (body.star !== undefined) event.star = body.star;
    if (body.ephemeris !== undefined) event.ephemeris = body.ephemeris;
    if (body.earthRotation !== undefined) event.earthRotation = body.earthRotation;
    if (body.fitDefaults !== undefined) event.fitDefaults = body.fitDefaults;
    if (body.prediction !== undefined) {
      event.prediction = body.prediction;
      if (event.predictionSource !== null && !keepsOffsetSource(event.predictionSource, body.prediction))
        event.predictionSource = null;
    }
    // Settings and ephemeris must agree whichever of the two this request changes; nothing is saved if not.
    const settingsProblems = predictionSettingsProblems(event.ephemeris, event.prediction);
    if (settingsProblems.length > 0) throw new ValidationError(settingsProblems);
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

  /** The event file, naming its body so that an import into another team finds or makes the same one. */
  async exportFile(eventId: string): Promise<EventInput & { body: { name: string; designation?: string } }> {
    const event = await this.find(eventId);
    const { format, title, ...rest } = planningFileOf(await loadEventRows(this.em, event));
    const body = {
      name: event.body.name,
      ...(event.body.designation === null ? {} : { designation: event.body.designation }),
    };
    return { format, title, body, ...rest };
  }
}
