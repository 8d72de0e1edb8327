import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { Team } from '../../teams/entities/team.entity';
import type { TeamRole } from '../../teams/roles';
import { User } from '../../users/entities/user.entity';

@Entity({ tableName: 'invitations' })
export class Invitation {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  @Property({ type: 'string', length: 254 })
  email: string;

  @Property({ type: 'string', length: 32 })
  role: TeamRole;

  /** SHA-256 of the token in the e-mailed link. */
  @Property({ type: 'string', length: 64, unique: true })
  tokenHash: string;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  invitedBy: User;

  @Property({ type: 'datetime' })
  expiresAt: Date;

  @Property({ type: 'datetime', nullable: true })
  acceptedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(
    team: Team,
    email: string,
    role: TeamRole,
    tokenHash: string,
    invitedBy: User,
    expiresAt: Date,
  ) {
    this.team = team;
    this.email = email.toLowerCase();
    this.role = role;
    this.tokenHash = tokenHash;
    this.invitedBy = invitedBy;
    this.expiresAt = expiresAt;
  }
}
