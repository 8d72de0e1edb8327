import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { TEXT_LIMITS } from '@limbus/schema';
import { Team } from '../../teams/entities/team.entity';

/**
 * The small body a team observes. Events name it; its physical parameters (the dynamics context)
 * hang on it, so every event of a body reads the same mass, radius and satellites. Names are unique
 * within a team, compared as the column's collation does (case- and accent-insensitive).
 */
@Entity({ tableName: 'bodies' })
@Unique({ properties: ['team', 'name'] })
export class Body {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  @Property({ type: 'string', length: TEXT_LIMITS.bodyName })
  name: string;

  /** A catalogue designation, e.g. a provisional one, beside the name. */
  @Property({ type: 'string', length: TEXT_LIMITS.bodyDesignation, nullable: true })
  designation: (string & Opt) | null = null;

  @Property({ type: 'string', length: 36, nullable: true })
  createdById: (string & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  constructor(team: Team, name: string) {
    this.team = team;
    this.name = name;
  }
}
