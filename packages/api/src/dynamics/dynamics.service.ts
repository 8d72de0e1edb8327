import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { computeDynamicsContext, GeometryInputError } from '@limbus/geometry';
import { type ContextInputFile, validateContextInput } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { Body } from '../bodies/entities/body.entity';
import { NotFoundError, ValidationError } from '../common/domain-errors';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
import { FitRun } from '../fits/entities/fit-run.entity';
import { User } from '../users/entities/user.entity';
import {
  contextOutput,
  type ContextOutput,
  ringFitsAgainst,
  type RingFitAgainstContext,
} from './dynamics-view';
import { DynamicsContext } from './entities/dynamics-context.entity';

/** A fitted ring set against the body's context, saying which event's fit it is. */
export interface RingFitOfEvent extends RingFitAgainstContext {
  eventId: string;
  eventTitle: string;
}

export interface DynamicsView {
  bodyId: string;
  input: ContextInputFile;
  result: ContextOutput;
  ringFits: RingFitOfEvent[];
  updatedAt: string;
}

/** No context stored yet is an ordinary state of a body, not a missing resource, so it is not a 404. */
export interface NoDynamics {
  bodyId: string;
  input: null;
  result: null;
  ringFits: [];
  updatedAt: null;
}

/**
 * A body's physical parameters (the dynamics-context document) and the ring fits set against them.
 * The context belongs to the body; an event reads its body's.
 */
@Injectable()
export class DynamicsService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  private async body(bodyId: string): Promise<Body> {
    const body = await this.em.findOne(Body, { id: bodyId }, { populate: ['team'] });
    if (!body) throw new NotFoundError('No such body');
    return body;
  }

  private async event(eventId: string): Promise<OccultationEvent> {
    const event = await this.em.findOne(OccultationEvent, { id: eventId, state: 'active' });
    if (!event) throw new NotFoundError('No such event');
    return event;
  }

  /** Validates with the file's own schema, then asks the geometry, so both kinds of refusal name a field. */
  async putForBody(user: AuthUser, bodyId: string, document: unknown): Promise<DynamicsView> {
    const body = await this.body(bodyId);
    const validation = validateContextInput(document);
    if (!validation.ok) throw new ValidationError(validation.problems);
    try {
      computeDynamicsContext(validation.input);
    } catch (error) {
      if (error instanceof GeometryInputError) {
        throw new ValidationError([{ path: error.path, message: error.detail }]);
      }
      throw error;
    }
    let row = await this.em.findOne(DynamicsContext, { body });
    if (row) {
      row.document = validation.file;
      row.updatedBy = this.em.getReference(User, user.id);
    } else {
      row = new DynamicsContext(body, validation.file, this.em.getReference(User, user.id));
      this.em.persist(row);
    }
    this.audit.record(this.em, {
      teamId: body.team.id,
      eventId: null,
      actorId: user.id,
      action: 'dynamics.put',
      objectType: 'body',
      objectId: body.id,
    });
    await this.em.flush();
    return this.view(row, await this.ringFitsOfBody(body, row.document));
  }

  /** The body's context with the rings of each of its events' latest approved (else solved) fit. */
  async getForBody(bodyId: string): Promise<DynamicsView | NoDynamics> {
    const body = await this.body(bodyId);
    const row = await this.em.findOne(DynamicsContext, { body });
    if (!row) return { bodyId, input: null, result: null, ringFits: [], updatedAt: null };
    return this.view(row, await this.ringFitsOfBody(body, row.document));
  }

  /** The event's body's context, with this event's latest solved fit set against it. */
  async getForEvent(eventId: string): Promise<DynamicsView | NoDynamics> {
    const event = await this.event(eventId);
    const row = await this.em.findOne(DynamicsContext, { body: event.body.id });
    if (!row) return { bodyId: event.body.id, input: null, result: null, ringFits: [], updatedAt: null };
    const fit = await this.em.findOne(
      FitRun,
      { event, state: 'solved' },
      { orderBy: { finishedAt: 'desc', createdAt: 'desc' }, populate: ['solution'] },
    );
    return this.view(row, fit ? this.ringFitsOf(row.document, event, fit) : []);
  }

  /** Writes the physical parameters of the event's body (they are the body's, shared by its events). */
  async putForEvent(user: AuthUser, eventId: string, document: unknown): Promise<DynamicsView> {
    const event = await this.event(eventId);
    return this.putForBody(user, event.body.id, document);
  }

  private ringFitsOf(document: ContextInputFile, event: OccultationEvent, fit: FitRun): RingFitOfEvent[] {
    if (fit.solution === null) return [];
    return ringFitsAgainst(document, { id: fit.id, rings: fit.solution.rings }).map((r) => ({
      ...r,
      eventId: event.id,
      eventTitle: event.title,
    }));
  }

  private async ringFitsOfBody(body: Body, document: ContextInputFile): Promise<RingFitOfEvent[]> {
    const events = await this.em.find(
      OccultationEvent,
      { body, state: 'active' },
      { orderBy: { eventTimeUtc: 'asc', id: 'asc' } },
    );
    const fits = await this.em.find(
      FitRun,
      { event: { $in: events.map((e) => e.id) }, state: 'solved' },
      { populate: ['solution'], orderBy: { createdAt: 'desc', id: 'desc' } },
    );
    return events.flatMap((event) => {
      const own = fits.filter((f) => f.event.id === event.id);
      const fit = own.find((f) => f.reviewState === 'approved') ?? own[0];
      return fit ? this.ringFitsOf(document, event, fit) : [];
    });
  }

  private view(row: DynamicsContext, ringFits: RingFitOfEvent[]): DynamicsView {
    return {
      bodyId: row.body.id,
      input: row.document,
      result: contextOutput(row.document),
      ringFits,
      updatedAt: row.updatedAt.toISOString(),
    };
  }
}
