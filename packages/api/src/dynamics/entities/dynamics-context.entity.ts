import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { ContextInputFile } from '@limbus/schema';
import { Body } from '../../bodies/entities/body.entity';
import { User } from '../../users/entities/user.entity';

/**
 * A body's physical parameters as a dynamics-context input (limbus-context-input/1), kept as validated:
 * mass or density, radius and spin with their 1σ and sources, satellites, ring-particle density and
 * heliocentric distance. One per body, read by every event of that body.
 */
@Entity({ tableName: 'dynamics_contexts' })
export class DynamicsContext {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Body, deleteRule: 'cascade', unique: true })
  body: Body;

  @Property({ type: 'json' })
  document: ContextInputFile;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  updatedBy: User | null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  constructor(body: Body, document: ContextInputFile, updatedBy: User | null) {
    this.body = body;
    this.document = document;
    this.updatedBy = updatedBy;
  }
}
