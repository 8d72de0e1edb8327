import { EntityManager, LockMode } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { MemberView, MeView, NoticeKind } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import { jsonColumn } from '../database/json-column';
import { ConflictError, NotFoundError } from '../common/domain-errors';
import { Station } from '../stations/entities/station.entity';
import { User } from '../users/entities/user.entity';
import { Membership } from './entities/membership.entity';
import { Team } from './entities/team.entity';
import { MembershipRepository } from './membership.repository';
import type { TeamRole } from './roles';
import { TeamRepository } from './team.repository';
import { UserRepository } from '../users/user.repository';

export type { MemberView, MeView };

/** One row of the /api/me query: the user's columns, repeated once per membership (nulls without). */
interface MeRow {
  id: string;
  email: string;
  name: string;
  is_admin: number | boolean;
  notice_opt_outs: string | NoticeKind[];
  team_id: string | null;
  team_name: string | null;
  roles: string | TeamRole[] | null;
}

export interface TeamSummary {
  id: string;
  name: string;
  roles: TeamRole[];
}

function memberView(membership: Membership, user: User): MemberView {
  return {
    userId: user.id,
    name: user.name,
    email: user.email,
    roles: membership.roles,
    joinedAt: membership.createdAt.toISOString(),
  };
}

@Injectable()
export class TeamsService {
  constructor(
    private readonly em: EntityManager,
    private readonly teams: TeamRepository,
    private readonly memberships: MembershipRepository,
    private readonly users: UserRepository,
    private readonly audit: AuditService,
  ) {}

  /**
   * GET /api/me, also returned with every new access token so the client needs no second call. The
   * client reads it on every page, so it is one query and builds no entity: as two ORM finds (user,
   * then memberships with their teams) it cost most of the route's time (docs/performance.md, "API").
   */
  async me(userId: string): Promise<MeView> {
    const rows = await this.em
      .getConnection()
      .execute<MeRow[]>(
        'select u.`id`, u.`email`, u.`name`, u.`is_admin`, u.`notice_opt_outs`, t.`id` as `team_id`, ' +
          't.`name` as `team_name`, m.`roles` from `users` u ' +
          'left join `memberships` m on m.`user_id` = u.`id` left join `teams` t on t.`id` = m.`team_id` ' +
          'where u.`id` = ? order by t.`name` asc',
        [userId],
      );
    const [user] = rows;
    if (!user) throw new NotFoundError();
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      isAdmin: Boolean(user.is_admin),
      teams: rows.flatMap((r) =>
        r.team_id === null || r.team_name === null || r.roles === null
          ? []
          : [{ id: r.team_id, name: r.team_name, roles: jsonColumn<TeamRole[]>(r.roles) }],
      ),
      noticeOptOuts: jsonColumn<NoticeKind[]>(user.notice_opt_outs),
    };
  }

  async setNoticeOptOuts(userId: string, optOut: NoticeKind[]): Promise<MeView> {
    const user = await this.users.findOne({ id: userId });
    if (!user) throw new NotFoundError();
    user.noticeOptOuts = optOut;
    await this.em.flush();
    return this.me(userId);
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

  async members(teamId: string): Promise<MemberView[]> {
    const rows = await this.memberships.find(
      { team: teamId },
      { populate: ['user'], orderBy: { user: { name: 'asc' } } },
    );
    return rows.map((m) => memberView(m, m.user));
  }

  /** Sets a member's roles; refused with 409 when it would leave the team without a coordinator. */
  async updateMember(
    teamId: string,
    userId: string,
    roles: TeamRole[],
    actorId: string,
  ): Promise<MemberView> {
    return this.withLockedMembers(teamId, userId, async ({ em, team, target, rows }) => {
      const before = target.roles;
      const after = [...new Set(roles)].sort();
      if (!after.includes('coordinator')) assertAnotherCoordinator(team, target, rows);
      if (before.join() !== after.join()) {
        target.roles = after;
        this.audit.record(em, {
          teamId,
          eventId: null,
          actorId,
          action: 'membership.roles',
          objectType: 'membership',
          objectId: target.id,
          detail: { userId, before, after },
        });
        await em.flush();
      }
      return memberView(target, await em.findOneOrFail(User, { id: userId }));
    });
  }

  /**
   * Removes a member; refused with 409 for the last coordinator. The team's stations they observed
   * keep their name (observerName) but no longer link to them, so they cannot report there.
   */
  async removeMember(teamId: string, userId: string, actorId: string): Promise<void> {
    await this.withLockedMembers(teamId, userId, async ({ em, team, target, rows }) => {
      assertAnotherCoordinator(team, target, rows);
      const user = await em.findOneOrFail(User, { id: userId });
      const stations = await em.find(Station, { observer: userId, event: { team: teamId } });
      for (const station of stations) {
        station.observer = null;
        if (!station.observerName?.trim()) station.observerName = user.name;
      }
      this.audit.record(em, {
        teamId,
        eventId: null,
        actorId,
        action: 'membership.remove',
        objectType: 'membership',
        objectId: target.id,
        detail: { userId, roles: target.roles, stationIds: stations.map((s) => s.id) },
      });
      em.remove(target);
      await em.flush();
    });
  }

  /**
   * Runs `change` in a transaction holding a write lock on every membership row of the team
   * (`select … for update`), so two requests that each remove or demote one of two coordinators run
   * one after the other and the second sees the first's result.
   */
  private async withLockedMembers<T>(
    teamId: string,
    userId: string,
    change: (locked: { em: EntityManager; team: Team; target: Membership; rows: Membership[] }) => Promise<T>,
  ): Promise<T> {
    return this.em.transactional(
      async (em) => {
        const rows = await em.find(Membership, { team: teamId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
        const team = await em.findOneOrFail(Team, { id: teamId });
        const target = rows.find((m) => m.user.id === userId);
        if (!target) throw new NotFoundError('No such member in this team');
        return change({ em, team, target, rows });
      },
      { clear: true },
    );
  }
}

function assertAnotherCoordinator(team: Team, target: Membership, rows: Membership[]): void {
  if (!target.roles.includes('coordinator')) return;
  if (rows.some((m) => m !== target && m.roles.includes('coordinator'))) return;
  throw new ConflictError(
    `${team.name} needs at least one coordinator: give another member the coordinator role first`,
  );
}
