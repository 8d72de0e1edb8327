import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { Team } from '../../teams/entities/team.entity';
import { User } from '../../users/entities/user.entity';

/** Bytes live in object storage under `storageKey`; the row keeps what is needed to trust them. */
@Entity({ tableName: 'uploads' })
export class Upload {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  @Property({ type: 'string', length: 300 })
  storageKey: string;

  @Property({ type: 'string', length: 300 })
  name: string;

  @Property({ type: 'string', length: 100 })
  contentType: string;

  @Property({ type: 'integer' })
  sizeBytes: number;

  @Property({ type: 'string', length: 64 })
  sha256: string;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  createdBy: User | null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(fields: Omit<Upload, 'id' | 'createdAt'>) {
    this.team = fields.team;
    this.storageKey = fields.storageKey;
    this.name = fields.name;
    this.contentType = fields.contentType;
    this.sizeBytes = fields.sizeBytes;
    this.sha256 = fields.sha256;
    this.createdBy = fields.createdBy;
  }
}
