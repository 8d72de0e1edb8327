import type { EntityManager } from '@mikro-orm/mariadb';
import type { AuthUser } from '../auth/auth-user';
import { ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import type { TeamRole } from '../teams/roles';
import { decideTeamAccess } from '../teams/team-access';

/**
 * The team a new event goes to when the team comes in the body rather than the path (so the global
 * guard cannot see it): the one named, or the user's only team. Same answers as the guard: 404 for
 * a team the user is not in, 403 for a missing role.
 */
export async function chooseTeam(
  em: EntityManager,
  user: AuthUser,
  teamId: string | undefined,
  required: TeamRole[],
): Promise<Team> {
  if (teamId === undefined) {
    const memberships = await em.find(Membership, { user: user.id }, { populate: ['team'] });
    if (memberships.length !== 1 || !memberships[0])
      throw new ValidationError([
        {
          path: 'teamId',
          message: `required: you belong to ${memberships.length} teams, so say which one the event is for`,
        },
      ]);
    teamId = memberships[0].team.id;
  }
  const team = await em.findOne(Team, { id: teamId });
  if (!team) throw new NotFoundError();
  const membership = await em.findOne(Membership, { team: teamId, user: user.id });
  const decision = decideTeamAccess({
    isAdmin: user.isAdmin,
    memberRoles: membership?.roles ?? null,
    required,
  });
  if (decision === 'not-found') throw new NotFoundError();
  if (decision === 'forbidden') throw new ForbiddenError();
  return team;
}

/** Roles of the user in one team; a site admin acts as every role. */
export async function rolesIn(em: EntityManager, user: AuthUser, teamId: string): Promise<TeamRole[]> {
  if (user.isAdmin) return ['coordinator', 'modeller', 'observer', 'reviewer'];
  const membership = await em.findOne(Membership, { team: teamId, user: user.id });
  return membership?.roles ?? [];
}
