import { EntityRepository } from '@mikro-orm/mariadb';
import type { Membership } from './entities/membership.entity';

export class MembershipRepository extends EntityRepository<Membership> {
  findOfUser(userId: string): Promise<Membership[]> {
    return this.find({ user: userId }, { populate: ['team'], orderBy: { team: { name: 'asc' } } });
  }
}
