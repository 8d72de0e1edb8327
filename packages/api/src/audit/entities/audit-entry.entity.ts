import { randomUUID } from 'node:crypto';
import { Entity, Index, Opt, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * Append-only. Ids are plain strings rather than foreign keys so that an entry outlives the object
 * it names and no cascade can ever delete history.
 */
@Entity({ tableName: 'audit_entries' })
@Index({ properties: ['eventId', 'createdAt'] })
export class AuditEntry {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @Property({ type: 'string', length: 36 })
  teamId: string;

  @Property({ type: 'string', length: 36, nullable: true })
  eventId: string | null;

  @Property({ type: 'string', length: 36, nullable: true })
  actorId: string | null;

  /** e.g. "event.import", "report.accept", "fit.solved". */
  @Property({ type: 'string', length: 60 })
  action: string;

  @Property({ type: 'string', length: 30 })
  objectType: string;

  @Property({ type: 'string', length: 36 })
  objectId: string;

  @Property({ type: 'json', nullable: true })
  detail: (Record<string, unknown> & Opt) | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date & Opt = new Date();

  constructor(
    fields: Pick<AuditEntry, 'teamId' | 'eventId' | 'actorId' | 'action' | 'objectType' | 'objectId'>,
  ) {
    this.teamId = fields.teamId;
    this.eventId = fields.eventId;
    this.actorId = fields.actorId;
    this.action = fields.action;
    this.objectType = fields.objectType;
    this.objectId = fields.objectId;
  }
}
