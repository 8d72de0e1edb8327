import { randomBytes } from 'node:crypto';
import { MikroORM } from '@mikro-orm/mariadb';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../src/config/app-config';
import { ormOptions } from '../../src/database/orm-options';
import { DEMO_PASSWORD, DEMO_TEAM_NAME, DEMO_USERS, seedDatabase } from '../../src/database/seed';
import { Membership } from '../../src/teams/entities/membership.entity';
import { User } from '../../src/users/entities/user.entity';
import { PasswordService } from '../../src/users/password.service';

/** The seed acts only on an empty database, so each case gets a database of its own. */
async function freshDatabase(
  mode: Record<string, string>,
): Promise<{ orm: MikroORM; config: ReturnType<typeof loadConfig> }> {
  const name = `limbus_seed_${randomBytes(4).toString('hex')}`;
  const base = loadConfig({ LIMBUS_DEMO: '1', ...process.env });
  const admin = await MikroORM.init({ ...ormOptions(base), dbName: base.db.name });
  await admin.em.getConnection().execute(`create database \`${name}\``);
  await admin.close();
  const config = loadConfig({ ...process.env, ...mode, DB_NAME: name });
  const orm = await MikroORM.init(ormOptions(config));
  await orm.getMigrator().up();
  return { orm, config };
}

async function drop(orm: MikroORM): Promise<void> {
  const name = orm.config.get('dbName');
  await orm.em.getConnection().execute(`drop database \`${name}\``);
  await orm.close();
}

describe('seedDatabase() in demo mode', () => {
  let db: Awaited<ReturnType<typeof freshDatabase>>;
  beforeAll(async () => {
    db = await freshDatabase({ LIMBUS_DEMO: '1' });
  });
  afterAll(async () => {
    await drop(db.orm);
  });

  it('seedDatabase() creates the demo team with one user per role, once', async () => {
    const passwords = new PasswordService();
    expect(await seedDatabase(db.orm.em.fork(), db.config, passwords)).toMatch(/^seed: demo team/);
    expect(await seedDatabase(db.orm.em.fork(), db.config, passwords)).toBe(
      'seed: database not empty, nothing to do',
    );

    const em = db.orm.em.fork();
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

describe('seedDatabase() outside demo mode', () => {
  let db: Awaited<ReturnType<typeof freshDatabase>>;
  beforeAll(async () => {
    db = await freshDatabase({
      LIMBUS_DEMO: '0',
      JWT_SECRET: 'y'.repeat(40),
      LIMBUS_ADMIN_EMAIL: 'Chief@Example.org',
      LIMBUS_ADMIN_PASSWORD: 'first-admin-password',
      SMTP_URL: 'smtp://127.0.0.1:25',
      S3_ENDPOINT: 'http://127.0.0.1:9',
      S3_ACCESS_KEY_ID: 'x',
      S3_SECRET_ACCESS_KEY: 'x',
    });
  });
  afterAll(async () => {
    await drop(db.orm);
  });

  it('seedDatabase() creates only the initial admin from the environment, once', async () => {
    const passwords = new PasswordService();
    expect(await seedDatabase(db.orm.em.fork(), db.config, passwords)).toBe(
      'seed: created admin chief@example.org',
    );
    expect(await seedDatabase(db.orm.em.fork(), db.config, passwords)).toBe(
      'seed: an admin exists, nothing to do',
    );
    const users = await db.orm.em.fork().find(User, {});
    expect(users).toHaveLength(1);
    expect(users[0]?.isAdmin).toBe(true);
    expect(await passwords.verify(users[0]?.passwordHash ?? '', 'first-admin-password')).toBe(true);
    expect(await db.orm.em.fork().count(Membership, {})).toBe(0);
  });
});
