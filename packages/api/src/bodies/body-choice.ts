import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/mariadb';
import { ValidationError } from '../common/domain-errors';
import type { Team } from '../teams/entities/team.entity';
import { Body } from './entities/body.entity';

/** How a new or imported event names its body: one of the team's by id, or by name (made when new). */
export interface BodyChoice {
  bodyId?: string | undefined;
  /** A body of this name is taken when the team has one (names compare case-insensitively), else made. */
  name?: { name: string; designation?: string | null | undefined } | undefined;
  /** Where the choice came from, so a refusal names the field the caller sent. */
  path: { bodyId: string; name: string };
}

/** The body an event goes to when nothing names one and the team has none yet. */
export const UNASSIGNED_BODY_NAME = 'Unassigned';

/**
 * The body an event goes to: the one named by id (another team's is "no such body"), the one named by
 * name (found or made, in the caller's transaction), else the team's only body. A team without bodies
 * gets an "Unassigned" one (a coordinator renames or splits it later); a team with several is asked to
 * choose. The client always asks; the fallbacks keep API callers that predate bodies working.
 */
export async function chooseBody(
  em: EntityManager,
  team: Team,
  choice: BodyChoice,
  createdById: string,
): Promise<Body> {
  if (choice.bodyId !== undefined) {
    const body = await em.findOne(Body, { id: choice.bodyId, team });
    if (!body)
      throw new ValidationError([{ path: choice.path.bodyId, message: 'no such body in this team' }]);
    return body;
  }
  if (choice.name !== undefined) {
    // Found or made in one statement: two requests naming the same new body at once meet at the
    // unique key (team, name), and the second one finds the first one's row instead of failing.
    const now = new Date();
    await em.execute(
      'insert ignore into `bodies` (`id`, `team_id`, `name`, `designation`, `created_by_id`, `created_at`, `updated_at`) values (?, ?, ?, ?, ?, ?, ?)',
      [randomUUID(), team.id, choice.name.name, choice.name.designation ?? null, createdById, now, now],
    );
    return em.findOneOrFail(Body, { team, name: choice.name.name });
  }
  const bodies = await em.find(Body, { team }, { limit: 2 });
  if (bodies.length === 1 && bodies[0]) return bodies[0];
  if (bodies.length === 0)
    return chooseBody(em, team, { ...choice, name: { name: UNASSIGNED_BODY_NAME } }, createdById);
  throw new ValidationError([
    { path: choice.path.bodyId, message: 'the team has several bodies: choose the one this event observes' },
  ]);
}
