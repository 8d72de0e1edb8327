import type { TeamRole } from './roles';

export type AccessDecision = 'allow' | 'not-found' | 'forbidden';

/**
 * The rule behind every team-scoped route. A non-member gets "not-found", not "forbidden", so
 * that another team's ids do not even confirm the object exists. `required` empty means any member.
 * A site admin may act in every team.
 */
export function decideTeamAccess(input: {
  isAdmin: boolean;
  memberRoles: readonly TeamRole[] | null;
  required: readonly TeamRole[];
}): AccessDecision {
  if (input.isAdmin) return 'allow';
  if (input.memberRoles === null) return 'not-found';
  if (input.required.length === 0) return 'allow';
  return input.required.some((role) => input.memberRoles?.includes(role)) ? 'allow' : 'forbidden';
}
