import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { ContextInputFile } from '@limbus/schema';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { User } from '../../users/entities/user.entity';

/** The body's dynamics-context input (limbus-context-input/1) for one event, kept as validated. */
@Entity({ tableName: 'dynamics_contexts' })
export class DynamicsContext {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade', unique: true })
  event: OccultationEvent;

  @Property({ type: 'json' })
  document: ContextInputFile;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  updatedBy: User | null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  constructor(event: OccultationEvent, document: ContextInputFile, updatedBy: User | null) {
    this.event = event;
    this.document = document;
    this.updatedBy = updatedBy;
  }
}
