import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { computeDynamicsContext, GeometryInputError } from '@limbus/geometry';
import { type ContextInputFile, validateContextInput } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
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

export interface DynamicsView {
  input: ContextInputFile;
  result: ContextOutput;
  ringFits: RingFitAgainstContext[];
  updatedAt: string;
}

/** No context stored yet is an ordinary state of an event, not a missing resource, so it is not a 404. */
export interface NoDynamics {
  input: null;
  result: null;
  ringFits: [];
  updatedAt: null;
}

@Injectable()
export class DynamicsService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {}

  private async event(eventId: string): Promise<OccultationEvent> {
    const event = await this.em.findOne(OccultationEvent, { id: eventId, state: 'active' });
    if (!event) throw new NotFoundError('No such event');
    return event;
  }

  /** Validates with the file's own schema, then asks the geometry, so both kinds of refusal name a field. */
  async put(user: AuthUser, eventId: string, body: unknown): Promise<DynamicsView> {
    const event = await this.event(eventId);
    const validation = validateContextInput(body);
    if (!validation.ok) throw new ValidationError(validation.problems);
    try {
      computeDynamicsContext(validation.input);
    } catch (error) {
      if (error instanceof GeometryInputError) {
        throw new ValidationError([{ path: error.path, message: error.detail }]);
      }
      throw error;
    }
    let row = await this.em.findOne(DynamicsContext, { event: eventId });
    if (row) {
      row.document = validation.file;
      row.updatedBy = this.em.getReference(User, user.id);
    } else {
      row = new DynamicsContext(event, validation.file, this.em.getReference(User, user.id));
      this.em.persist(row);
    }
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'dynamics.put',
      objectType: 'dynamics',
      objectId: row.id,
    });
    await this.em.flush();
    return this.view(row);
  }

  async get(eventId: string): Promise<DynamicsView | NoDynamics> {
    await this.event(eventId);
    const row = await this.em.findOne(DynamicsContext, { event: eventId });
    if (!row) return { input: null, result: null, ringFits: [], updatedAt: null };
    return this.view(row);
  }

  private async view(row: DynamicsContext): Promise<DynamicsView> {
    const fit = await this.em.findOne(
      FitRun,
      { event: row.event.id, state: 'solved' },
      { orderBy: { finishedAt: 'desc', createdAt: 'desc' }, populate: ['solution'] },
    );
    return {
      input: row.document,
      result: contextOutput(row.document),
      ringFits: fit?.solution ? ringFitsAgainst(row.document, { id: fit.id, rings: fit.solution.rings }) : [],
      updatedAt: row.updatedAt.toISOString(),
    };
  }
}
