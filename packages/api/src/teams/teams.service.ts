import { Injectable } from '@nestjs/common';
import { NotFoundError } from '../common/domain-errors';
import { MembershipRepository } from './membership.repository';
import type { TeamRole } from './roles';
import { TeamRepository } from './team.repository';
import { UserRepository } from '../users/user.repository';

export interface TeamSummary {
  id: string;
  name: string;
  roles: TeamRole[];
}

/** GET /api/me, also returned with every new access token so the client needs no second call. */
export interface MeView {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  teams: TeamSummary[];
}

export interface TeamMemberView {
  userId: string;
  name: string;
  email: string;
  roles: TeamRole[];
}

@Injectable()
export class TeamsService {
  constructor(
    private readonly teams: TeamRepository,
    private readonly memberships: MembershipRepository,
    private readonly users: UserRepository,
  ) {}

  async me(userId: string): Promise<MeView> {
    const user = await this.users.findOne({ id: userId });
    if (!user) throw new NotFoundError();
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      isAdmin: user.isAdmin,
      teams: await this.teamsOf(user.id),
    };
  }

  async teamsOf(userId: string): Promise<TeamSummary[]> {
    const rows = await this.memberships.findOfUser(userId);
    return rows.map((m) => ({ id: m.team.id, name: m.team.name, roles: m.roles }));
  }

  /** Access has been checked by RolesGuard; roles are the caller's own (empty for an admin outsider). */
  async teamFor(teamId: string, userId: string): Promise<TeamSummary> {
    const team = await this.teams.findOne({ id: teamId });
    if (!team) throw new NotFoundError();
    const membership = await this.memberships.findOne({ team: teamId, user: userId });
    return { id: team.id, name: team.name, roles: membership?.roles ?? [] };
  }

  async members(teamId: string): Promise<TeamMemberView[]> {
    const rows = await this.memberships.find(
      { team: teamId },
      { populate: ['user'], orderBy: { user: { name: 'asc' } } },
    );
    return rows.map((m) => ({ userId: m.user.id, name: m.user.name, email: m.user.email, roles: m.roles }));
  }
}
