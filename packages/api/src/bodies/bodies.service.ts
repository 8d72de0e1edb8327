import { EntityManager, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { Solution } from '@limbus/geometry';
import type {
  BodyDetail,
  BodyEventRow,
  BodySummary,
  CreateBodyPayload,
  FitStatus,
  PatchBodyPayload,
} from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import { DynamicsContext } from '../dynamics/entities/dynamics-context.entity';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
import { EventsService } from '../events/events.service';
import { FitRun } from '../fits/entities/fit-run.entity';
import { Team } from '../teams/entities/team.entity';
import { Body } from './entities/body.entity';

const nameTaken = (name: string) =>
  new ValidationError([{ path: 'name', message: `the team already has a body named "${name}"` }]);

function limbOf(solution: Solution | null): NonNullable<BodyEventRow['approvedFit']>['limb'] {
  const limb = solution?.limb;
  if (!limb) return null;
  return {
    equatorialRadiusKm: { value: limb.equatorialRadiusKm, sigma: limb.uncertainty.equatorialRadiusKm },
    oblateness: { value: limb.oblateness, sigma: limb.uncertainty.oblateness },
    positionAngleDeg: { value: limb.positionAngleDeg, sigma: limb.uncertainty.positionAngleDeg },
    chi2: limb.chi2,
    dof: limb.dof,
  };
}

@Injectable()
export class BodiesService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
  ) {}

  async find(bodyId: string): Promise<Body> {
    const body = await this.em.findOne(Body, { id: bodyId }, { populate: ['team'] });
    if (!body) throw new NotFoundError('No such body');
    return body;
  }

  async list(teamId: string): Promise<BodySummary[]> {
    const bodies = await this.em.find(Body, { team: teamId }, { orderBy: { name: 'asc', id: 'asc' } });
    if (bodies.length === 0) return [];
    const ids = bodies.map((b) => b.id);
    const marks = ids.map(() => '?').join(', ');
    const connection = this.em.getConnection();
    const [events, approved, contexts] = await Promise.all([
      connection.execute<Array<{ body_id: string; n: number | string }>>(
        `select \`body_id\`, count(*) as n from \`events\` where \`state\` = 'active' and \`body_id\` in (${marks}) group by \`body_id\``,
        ids,
      ),
      connection.execute<Array<{ body_id: string; n: number | string }>>(
        'select e.`body_id`, count(*) as n from `fit_runs` f join `events` e on e.`id` = f.`event_id` ' +
          `where e.\`state\` = 'active' and f.\`review_state\` = 'approved' and e.\`body_id\` in (${marks}) group by e.\`body_id\``,
        ids,
      ),
      connection.execute<Array<{ body_id: string }>>(
        `select \`body_id\` from \`dynamics_contexts\` where \`body_id\` in (${marks})`,
        ids,
      ),
    ]);
    const count = (rows: Array<{ body_id: string; n: number | string }>) =>
      new Map(rows.map((r) => [r.body_id, Number(r.n)]));
    const eventCounts = count(events);
    const approvedCounts = count(approved);
    const withContext = new Set(contexts.map((r) => r.body_id));
    return bodies.map((b) => ({
      ...this.summaryFields(b),
      eventCount: eventCounts.get(b.id) ?? 0,
      approvedFitCount: approvedCounts.get(b.id) ?? 0,
      hasContext: withContext.has(b.id),
    }));
  }

  private summaryFields(b: Body) {
    return {
      id: b.id,
      teamId: b.team.id,
      name: b.name,
      designation: b.designation,
      updatedAt: b.updatedAt.toISOString(),
    };
  }

  async create(user: AuthUser, teamId: string, payload: CreateBodyPayload): Promise<BodySummary> {
    const team = this.em.getReference(Team, teamId);
    const body = new Body(team, payload.name);
    body.designation = payload.designation ?? null;
    body.createdById = user.id;
    try {
      await this.em.transactional(async (em) => {
        em.persist(body);
        this.audit.record(em, {
          teamId,
          eventId: null,
          actorId: user.id,
          action: 'body.create',
          objectType: 'body',
          objectId: body.id,
          detail: { name: body.name },
        });
        await em.flush();
      });
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw nameTaken(payload.name);
      throw error;
    }
    return { ...this.summaryFields(body), eventCount: 0, approvedFitCount: 0, hasContext: false };
  }

  async update(user: AuthUser, bodyId: string, payload: PatchBodyPayload): Promise<BodyDetail> {
    const body = await this.find(bodyId);
    const before = { name: body.name, designation: body.designation };
    if (payload.name !== undefined) body.name = payload.name;
    if (payload.designation !== undefined) body.designation = payload.designation;
    this.audit.record(this.em, {
      teamId: body.team.id,
      eventId: null,
      actorId: user.id,
      action: 'body.update',
      objectType: 'body',
      objectId: body.id,
      detail: { before, after: { name: body.name, designation: body.designation } },
    });
    try {
      await this.em.flush();
    } catch (error) {
      if (error instanceof UniqueConstraintViolationException) throw nameTaken(body.name);
      throw error;
    }
    return this.detail(bodyId);
  }

  /** Only a body without events (deleted ones included, which can still be restored) can go. */
  async remove(user: AuthUser, bodyId: string): Promise<void> {
    const body = await this.find(bodyId);
    const active = await this.em.count(OccultationEvent, { body, state: 'active' });
    const deleted = await this.em.count(OccultationEvent, { body, state: 'deleted' });
    if (active + deleted > 0)
      throw new ConflictError(
        `"${body.name}" still has ${active} event(s)${deleted > 0 ? ` and ${deleted} deleted one(s)` : ''}: move them to another body first`,
      );
    this.audit.record(this.em, {
      teamId: body.team.id,
      eventId: null,
      actorId: user.id,
      action: 'body.delete',
      objectType: 'body',
      objectId: body.id,
      detail: { name: body.name },
    });
    this.em.remove(body);
    await this.em.flush();
  }

  /** The body with its events, each with its latest fit and its latest approved fit's limb and rings. */
  async detail(bodyId: string): Promise<BodyDetail> {
    const body = await this.find(bodyId);
    const events = await this.em.find(
      OccultationEvent,
      { body, state: 'active' },
      { orderBy: { eventTimeUtc: 'asc', id: 'asc' } },
    );
    const ids = events.map((e) => e.id);
    const fits =
      ids.length === 0
        ? []
        : await this.em.find(
            FitRun,
            { event: { $in: ids } },
            {
              fields: ['id', 'event', 'state', 'reviewState', 'createdAt', 'dataSha256'],
              orderBy: { createdAt: 'desc', id: 'desc' },
            },
          );
    const context = await this.em.findOne(DynamicsContext, { body });
    const rows: BodyEventRow[] = [];
    for (const event of events) {
      const detail = await this.events.detail(event.id);
      const status = (
        f: Pick<FitRun, 'id' | 'state' | 'reviewState' | 'createdAt' | 'dataSha256'>,
      ): FitStatus => ({
        id: f.id,
        state: f.state,
        reviewState: f.reviewState,
        createdAt: f.createdAt.toISOString(),
        inputMatchesEvent: f.dataSha256 === detail.dataSha256,
      });
      const own = fits.filter((f) => f.event.id === event.id);
      const latest = own[0];
      const approved = own.find((f) => f.reviewState === 'approved');
      let approvedFit: BodyEventRow['approvedFit'] = null;
      if (approved) {
        const withSolution = await this.em.findOneOrFail(
          FitRun,
          { id: approved.id },
          { populate: ['solution'] },
        );
        const solution = withSolution.solution;
        approvedFit = {
          ...status(approved),
          limb: limbOf(solution),
          rings: (solution?.rings ?? []).map((r) => ({
            ring: r.ring,
            radiusKm: { value: r.radiusKm, sigma: r.uncertainty.radiusKm },
          })),
        };
      }
      rows.push({
        id: event.id,
        title: event.title,
        eventTimeUtc: event.eventTimeUtc,
        counts: { stations: detail.stations.length, chords: detail.chords.length },
        latestFit: latest ? status(latest) : null,
        approvedFit,
      });
    }
    const { updatedAt, ...fields } = this.summaryFields(body);
    return {
      ...fields,
      updatedAt,
      hasContext: context !== null,
      context: context === null ? null : { ...context.document },
      events: rows,
    };
  }
}
