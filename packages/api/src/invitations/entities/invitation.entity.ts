import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { Team } from '../../teams/entities/team.entity';
import type { TeamRole } from '../../teams/roles';
import { User } from '../../users/entities/user.entity';

/**
 * One open invitation per address and team: `openEmail` holds the address while the invitation is
 * open and null once it is accepted or revoked, and the unique key on (team, openEmail) lets MariaDB
 * refuse a second one (NULLs never clash), whatever races the requests run.
 */
@Entity({ tableName: 'invitations' })
@Unique({ properties: ['team', 'openEmail'] })
export class Invitation {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  @Property({ type: 'string', length: 254 })
  email: string;

  /** Sorted, without repeats; the member gets all of them on accepting. */
  @Property({ type: 'json' })
  roles: TeamRole[];

  @Property({ type: 'string', length: 254, nullable: true })
  openEmail: string | null;

  /** SHA-256 of the token in the e-mailed link. */
  @Property({ type: 'string', length: 64, unique: true })
  tokenHash: string;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  invitedBy: User;

  @Property({ type: 'datetime' })
  expiresAt: Date;

  @Property({ type: 'datetime', nullable: true })
  acceptedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime', nullable: true })
  revokedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  /** A resend makes a new token and moves this and the expiry. */
  @Property({ type: 'datetime' })
  lastSentAt: Date & Opt = new Date();

  constructor(
    team: Team,
    email: string,
    roles: TeamRole[],
    tokenHash: string,
    invitedBy: User,
    expiresAt: Date,
  ) {
    this.team = team;
    this.email = email.toLowerCase();
    this.openEmail = this.email;
    this.roles = [...new Set(roles)].sort();
    this.tokenHash = tokenHash;
    this.invitedBy = invitedBy;
    this.expiresAt = expiresAt;
  }
}
