import { EntityRepository } from '@mikro-orm/mariadb';
import type { AuthUser } from '../auth/auth-user';
import type { User } from './entities/user.entity';

export class UserRepository extends EntityRepository<User> {
  findByEmail(email: string): Promise<User | null> {
    return this.findOne({ email: email.toLowerCase() });
  }

  /**
   * What every authenticated request needs of its user, read fresh (a removed user or a revoked admin
   * flag acts at once) but without building an entity: this runs on each request.
   */
  async findAuthUser(id: string): Promise<AuthUser | null> {
    const [row] = await this.getEntityManager()
      .getConnection()
      .execute<Array<{ id: string; email: string; is_admin: number | boolean }>>(
        'select `id`, `email`, `is_admin` from `users` where `id` = ? limit 1',
        [id],
      );
    return row ? { id: row.id, email: row.email, isAdmin: Boolean(row.is_admin) } : null;
  }
}
