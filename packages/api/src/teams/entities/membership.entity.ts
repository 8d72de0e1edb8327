import { randomUUID } from 'node:crypto';
import { Entity, EntityRepositoryType, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import { User } from '../../users/entities/user.entity';
import type { TeamRole } from '../roles';
import { MembershipRepository } from '../membership.repository';
import { Team } from './team.entity';

@Entity({ tableName: 'memberships', repository: () => MembershipRepository })
@Unique({ properties: ['team', 'user'] })
export class Membership {
  [EntityRepositoryType]?: MembershipRepository;

  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Team, deleteRule: 'cascade' })
  team: Team;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  user: User;

  /** A member may hold several roles (an observer who also models); kept sorted and unique. */
  @Property({ type: 'json' })
  roles: TeamRole[];

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(team: Team, user: User, roles: TeamRole[]) {
    this.team = team;
    this.user = user;
    this.roles = [...new Set(roles)].sort();
  }

  addRole(role: TeamRole): void {
    if (!this.roles.includes(role)) this.roles = [...this.roles, role].sort();
  }
}
