import { MikroORM, type EntityManager } from '@mikro-orm/mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type AppConfig, loadConfig } from '../../src/config/app-config';
import { ormOptions } from '../../src/database/orm-options';
import { DEMO_PASSWORD, DEMO_TEAM_NAME, DEMO_USERS, seedDatabase } from '../../src/database/seed';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Membership } from '../../src/teams/entities/membership.entity';
import { Team } from '../../src/teams/entities/team.entity';
import { User } from '../../src/users/entities/user.entity';
import { PasswordService } from '../../src/users/password.service';

/**
 * The seed acts only on an empty database, and the test user may not create databases (tools/test
 * grants one database). So each case empties the tables inside a transaction that is rolled back.
 */
async function inEmptiedDatabase(orm: MikroORM, check: (em: EntityManager) => Promise<void>): Promise<void> {
  const em = orm.em.fork();
  await em.begin();
  try {
    await em.nativeDelete(User, {});
    // Events first: a body with events cannot be deleted (the key says so), not even by a team's cascade.
    await em.nativeDelete(OccultationEvent, {});
    await em.nativeDelete(Team, {});
    await check(em);
  } finally {
    await em.rollback();
  }
}

const passwords = new PasswordService();
let orm: MikroORM;
beforeAll(async () => {
  orm = await MikroORM.init(ormOptions(loadConfig({ LIMBUS_DEMO: '1', ...process.env })));
  await orm.getMigrator().up();
});
afterAll(async () => {
  await orm.close();
});

describe('seedDatabase() in demo mode', () => {
  const config: AppConfig = loadConfig({ ...process.env, LIMBUS_DEMO: '1' });

  it('seedDatabase() creates the demo team with one user per role, once', async () => {
    await inEmptiedDatabase(orm, async (em) => {
      expect(await seedDatabase(em, config, passwords)).toMatch(/^seed: demo team "Outer Belt Timing Group"/);
      expect(await seedDatabase(em, config, passwords)).toBe('seed: database not empty, nothing to do');

      em.clear();
      const users = await em.find(User, {}, { orderBy: { email: 'asc' } });
      expect(users.map((u) => u.email)).toEqual(DEMO_USERS.map((d) => d.email).sort());
      const memberships = await em.find(Membership, {}, { populate: ['team', 'user'] });
      expect(new Set(memberships.map((m) => m.team.name))).toEqual(new Set([DEMO_TEAM_NAME]));
      const rolesByEmail = Object.fromEntries(memberships.map((m) => [m.user.email, m.roles]));
      expect(rolesByEmail).toEqual(Object.fromEntries(DEMO_USERS.map((d) => [d.email, d.roles])));
      expect(users.filter((u) => u.isAdmin).map((u) => u.email)).toEqual(['admin@example.org']);
      const observer = users.find((u) => u.email === 'observer@example.org');
      expect(observer?.name).toBe('Ilse Darrow');
      expect(await passwords.verify(observer?.passwordHash ?? '', DEMO_PASSWORD)).toBe(true);
    });
  });
});

describe('seedDatabase() outside demo mode', () => {
  const config: AppConfig = loadConfig({
    ...process.env,
    LIMBUS_DEMO: '0',
    JWT_SECRET: 'y'.repeat(40),
    LIMBUS_ADMIN_EMAIL: 'Chief@Example.org',
    LIMBUS_ADMIN_PASSWORD: 'first-admin-password',
    SMTP_URL: 'smtp://127.0.0.1:25',
    S3_ENDPOINT: 'http://127.0.0.1:9',
    S3_ACCESS_KEY_ID: 'x',
    S3_SECRET_ACCESS_KEY: 'x',
  });

  it('seedDatabase() creates only the initial admin from the environment, once', async () => {
    await inEmptiedDatabase(orm, async (em) => {
      expect(await seedDatabase(em, config, passwords)).toBe('seed: created admin chief@example.org');
      expect(await seedDatabase(em, config, passwords)).toBe('seed: an admin exists, nothing to do');
      em.clear();
      const users = await em.find(User, {});
      expect(users).toHaveLength(1);
      expect(users[0]?.isAdmin).toBe(true);
      expect(await passwords.verify(users[0]?.passwordHash ?? '', 'first-admin-password')).toBe(true);
      expect(await em.count(Membership, {})).toBe(0);
    });
  });

  it('seedDatabase() promotes an existing account with the admin address instead of duplicating it', async () => {
    await inEmptiedDatabase(orm, async (em) => {
      await em
        .persist(new User('chief@example.org', 'Already Here', await passwords.hash('own-password-1')))
        .flush();
      expect(await seedDatabase(em, config, passwords)).toBe('seed: made admin chief@example.org');
      em.clear();
      const users = await em.find(User, {});
      expect(users.map((u) => [u.name, u.isAdmin])).toEqual([['Already Here', true]]);
    });
  });
});
