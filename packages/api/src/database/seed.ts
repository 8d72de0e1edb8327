import type { EntityManager } from '@mikro-orm/mariadb';
import type { AppConfig } from '../config/app-config';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import type { TeamRole } from '../teams/roles';
import { User } from '../users/entities/user.entity';
import type { PasswordService } from '../users/password.service';

/** Invented demo people (see the product brief); all share this password. */
export const DEMO_PASSWORD = 'limbus-demo';
export const DEMO_TEAM_NAME = 'Outer Belt Timing Group';
export const DEMO_USERS: ReadonlyArray<{ email: string; name: string; isAdmin: boolean; roles: TeamRole[] }> =
  [
    { email: 'admin@example.org', name: 'Mara Quell', isAdmin: true, roles: ['coordinator'] },
    { email: 'coordinator@example.org', name: 'Tomas Reyne', isAdmin: false, roles: ['coordinator'] },
    { email: 'observer@example.org', name: 'Ilse Darrow', isAdmin: false, roles: ['observer'] },
    { email: 'modeller@example.org', name: 'Noor Calder', isAdmin: false, roles: ['modeller'] },
    { email: 'reviewer@example.org', name: 'Piet Ansel', isAdmin: false, roles: ['reviewer'] },
  ];

/**
 * Idempotent: demo mode fills an empty database with the demo team and users; otherwise the
 * initial admin from the environment is created when no admin exists. Returns what it did.
 */
export async function seedDatabase(
  em: EntityManager,
  config: AppConfig,
  passwords: PasswordService,
): Promise<string> {
  if (config.demo) {
    if ((await em.count(User, {})) > 0) return 'seed: database not empty, nothing to do';
    const team = new Team(DEMO_TEAM_NAME);
    const hash = await passwords.hash(DEMO_PASSWORD);
    em.persist(team);
    for (const demo of DEMO_USERS) {
      const user = new User(demo.email, demo.name, hash);
      user.isAdmin = demo.isAdmin;
      em.persist([user, new Membership(team, user, demo.roles)]);
    }
    await em.flush();
    return `seed: demo team "${team.name}" (${team.id}) with ${DEMO_USERS.length} users`;
  }
  if ((await em.count(User, { isAdmin: true })) > 0) return 'seed: an admin exists, nothing to do';
  const admin = config.initialAdmin;
  if (!admin)
    throw new Error('LIMBUS_ADMIN_EMAIL and LIMBUS_ADMIN_PASSWORD are required to create the first admin');
  const existing = await em.findOne(User, { email: admin.email });
  const user = existing ?? new User(admin.email, 'Administrator', await passwords.hash(admin.password));
  user.isAdmin = true;
  await em.persist(user).flush();
  return `seed: ${existing ? 'made' : 'created'} admin ${admin.email}`;
}
