import { EntityRepository } from '@mikro-orm/mariadb';
import { jsonColumn } from '../database/json-column';
import type { Membership } from './entities/membership.entity';
import type { TeamRole } from './roles';

export class MembershipRepository extends EntityRepository<Membership> {
  findOfUser(userId: string): Promise<Membership[]> {
    return this.find({ user: userId }, { populate: ['team'], orderBy: { team: { name: 'asc' } } });
  }

  /** The user's roles in the team, or null for a non-member; for the guard, so no entity is built. */
  async rolesOf(teamId: string, userId: string): Promise<TeamRole[] | null> {
    const [row] = await this.getEntityManager()
      .getConnection()
      .execute<Array<{ roles: string | TeamRole[] }>>(
        'select `roles` from `memberships` where `team_id` = ? and `user_id` = ? limit 1',
        [teamId, userId],
      );
    if (!row) return null;
    return jsonColumn<TeamRole[]>(row.roles);
  }
}
