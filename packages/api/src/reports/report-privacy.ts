import type { EntityManager } from '@mikro-orm/mariadb';
import type { AuthUser } from '../auth/auth-user';
import { NotFoundError } from '../common/domain-errors';
import { rolesIn } from '../events/team-choice';
import type { TeamRole } from '../teams/roles';

/**
 * A member whose only role is observer sees their own reports and nothing of anyone else's (their
 * light curves, timings, corrections): another observer's report answers 404, like a missing one.
 * Coordinators, modellers, reviewers and site admins see every report of the team.
 */
export function seesEveryReport(roles: readonly TeamRole[]): boolean {
  return roles.some((role) => role !== 'observer');
}

/**
 * Throws the 404 of a missing report when the user may not see this one. `missing` is the message the
 * route gives for a missing id, so the two answers are the same and cannot confirm that an id exists.
 */
export async function assertSeesReport(
  em: EntityManager,
  user: AuthUser,
  report: { author: { id: string }; event: { team: { id: string } } },
  missing?: string,
): Promise<void> {
  if (report.author.id === user.id) return;
  if (!seesEveryReport(await rolesIn(em, user, report.event.team.id))) throw new NotFoundError(missing);
}
