import type { EntityManager } from '@mikro-orm/mariadb';
import { NotFoundError } from '../common/domain-errors';
import { Body } from './entities/body.entity';

/** Whose fits a comparison, joint pole or shape takes: a team's, narrowed to one of its bodies. */
export interface FitScope {
  teamId: string;
  bodyId?: string | undefined;
}

/** The scope of a body route (`/api/bodies/:bodyId/…`); the guard has checked the caller's team. */
export async function bodyScope(em: EntityManager, bodyId: string): Promise<FitScope & { bodyId: string }> {
  const body = await em.findOne(Body, { id: bodyId }, { fields: ['team'] });
  if (!body) throw new NotFoundError();
  return { teamId: body.team.id, bodyId };
}
