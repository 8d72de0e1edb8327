import 'reflect-metadata';
import { randomBytes, randomInt, randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { MikroORM } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import type { Server } from 'node:http';
import request from 'supertest';
import { AppModule } from '../src/app.module';
import { configureApp } from '../src/bootstrap';
import { type AppConfig, loadConfig } from '../src/config/app-config';
import { startObjectStore } from '../src/fakes/object-store-server';
import { type CaughtMessage, startSmtpCatcher } from '../src/fakes/smtp-catcher-server';
import { Membership } from '../src/teams/entities/membership.entity';
import { Team } from '../src/teams/entities/team.entity';
import type { TeamRole } from '../src/teams/roles';
import { User } from '../src/users/entities/user.entity';
import { PasswordService } from '../src/users/password.service';

/**
 * Boots the real AppModule, with main.ts's own configureApp, against the MariaDB and Redis named
 * in the environment (DB_*, REDIS_URL). SMTP and S3 come from SMTP_URL / MAIL_CATCHER_URL / S3_*
 * when set (tools/test), otherwise from the fakes started in-process on free ports.
 */
export interface TestApp {
  app: NestExpressApplication;
  config: AppConfig;
  orm: MikroORM;
  /** Client address sent as X-Forwarded-For, unique per boot so sign-in counters never leak between files. */
  address: string;
  get(url: string): request.Test;
  post(url: string): request.Test;
  /** Messages caught for one recipient, waiting up to 5 s for at least `atLeast` of them. */
  mailTo(email: string, atLeast?: number): Promise<CaughtMessage[]>;
  /**
   * The newest message to one recipient whose subject starts with `subjectStart`, waiting up to 5 s:
   * notices leave after the request has answered.
   */
  mailAbout(email: string, subjectStart: string): Promise<CaughtMessage>;
  createTeam(name?: string): Promise<Team>;
  createUser(options?: {
    teams?: Array<{ team: Team; roles: TeamRole[] }>;
    isAdmin?: boolean;
    password?: string;
  }): Promise<{ user: User; email: string; password: string }>;
  signIn(email: string, password: string): Promise<string>;
  close(): Promise<void>;
}

export const TEST_PASSWORD = 'correct horse battery';

export function uniqueEmail(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}@example.org`;
}

function required(name: string): string {
  const value = process.env[name];
  if (!value)
    throw new Error(
      `e2e tests need ${name} (MariaDB and Redis are not faked: set DB_HOST, DB_PORT, DB_NAME, DB_USER, DB_PASSWORD, REDIS_URL)`,
    );
  return value;
}

export async function bootTestApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  for (const name of ['DB_PORT', 'DB_NAME', 'DB_USER', 'REDIS_URL']) required(name);
  const cleanups: Array<() => Promise<void>> = [];

  const env: Record<string, string | undefined> = {
    LOG_LEVEL: 'silent',
    JWT_SECRET: randomBytes(32).toString('hex'),
    LIMBUS_ADMIN_EMAIL: 'initial-admin@example.org',
    LIMBUS_ADMIN_PASSWORD: 'initial-admin-password',
    LIMBUS_TRUST_PROXY: 'loopback',
    ...process.env,
    LIMBUS_DEMO: '0',
    ...overrides,
  };
  if (!env.SMTP_URL || !env.MAIL_CATCHER_URL) {
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0 });
    cleanups.push(() => catcher.close());
    env.SMTP_URL = catcher.smtpUrl;
    env.MAIL_CATCHER_URL = catcher.httpUrl;
  }
  if (!env.S3_ENDPOINT) {
    const directory = await mkdtemp(path.join(tmpdir(), 'limbus-e2e-s3-'));
    const store = await startObjectStore({ port: 0, directory, bucket: env.S3_BUCKET ?? 'limbus' });
    cleanups.push(async () => {
      await store.close();
      await rm(directory, { recursive: true, force: true });
    });
    env.S3_ENDPOINT = store.endpoint;
    env.S3_ACCESS_KEY_ID ??= 'S3RVER';
    env.S3_SECRET_ACCESS_KEY ??= 'S3RVER';
  }
  const config = loadConfig(env);

  const moduleRef = await Test.createTestingModule({ imports: [AppModule.register(config)] }).compile();
  const app = moduleRef.createNestApplication<NestExpressApplication>({ bufferLogs: true });
  configureApp(app, config);
  const orm = app.get<MikroORM>(MikroORM);
  await orm.getMigrator().up();
  await app.init();
  const server = app.getHttpServer() as Server;
  const address = `10.${randomInt(256)}.${randomInt(256)}.${randomInt(1, 255)}`;
  const passwords = new PasswordService();
  const mailCatcherUrl = config.mailCatcherUrl;
  if (!mailCatcherUrl) throw new Error('no mail catcher');

  const testApp: TestApp = {
    app,
    config,
    orm,
    address,
    get: (url) => request(server).get(url).set('X-Forwarded-For', address),
    post: (url) => request(server).post(url).set('X-Forwarded-For', address),
    async mailTo(email, atLeast = 1) {
      const deadline = Date.now() + 5000;
      for (;;) {
        const response = await fetch(`${mailCatcherUrl}/messages`);
        const all = (await response.json()) as CaughtMessage[];
        const mine = all.filter((m) => m.to.some((to) => to.toLowerCase().includes(email.toLowerCase())));
        if (mine.length >= atLeast || Date.now() > deadline) return mine;
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    },
    async mailAbout(email, subjectStart) {
      const deadline = Date.now() + 5000;
      for (;;) {
        const mine = await testApp.mailTo(email, 0);
        const found = mine.filter((m) => m.subject.startsWith(subjectStart)).at(-1);
        if (found) return found;
        if (Date.now() > deadline) throw new Error(`no e-mail "${subjectStart}…" to ${email} within 5 s`);
        await new Promise((resolve) => setTimeout(resolve, 100));
      }
    },
    async createTeam(name = `Team ${randomUUID().slice(0, 8)}`) {
      const team = new Team(name);
      await orm.em.fork().persist(team).flush();
      return team;
    },
    async createUser(options = {}) {
      const em = orm.em.fork();
      const email = uniqueEmail(options.isAdmin ? 'admin' : 'user');
      const password = options.password ?? TEST_PASSWORD;
      const user = new User(email, `Test ${email.split('@')[0]}`, await passwords.hash(password));
      user.isAdmin = options.isAdmin ?? false;
      em.persist(user);
      for (const { team, roles } of options.teams ?? []) {
        em.persist(new Membership(em.getReference(Team, team.id), user, roles));
      }
      await em.flush();
      return { user, email, password };
    },
    async signIn(email, password) {
      const response = await testApp.post('/api/auth/login').send({ email, password }).expect(200);
      const body = response.body as { accessToken: string };
      return body.accessToken;
    },
    async close() {
      await app.close();
      for (const cleanup of cleanups.reverse()) await cleanup();
    },
  };
  return testApp;
}

/** Token from a link such as `${LIMBUS_PUBLIC_URL}/invitations/<token>` inside a message body. */
export function tokenFromLink(text: string, route: 'invitations' | 'reset-password'): string {
  const match = new RegExp(`/${route}/([A-Za-z0-9_-]+)`).exec(text);
  if (!match?.[1]) throw new Error(`no /${route}/ link in: ${text}`);
  return match[1];
}
