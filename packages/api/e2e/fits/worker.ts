import { type ChildProcess, spawn } from 'node:child_process';
import path from 'node:path';
import type { INestApplicationContext } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { AppConfig } from '../../src/config/app-config';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { WorkerModule } from '../../src/worker.module';
import type { TestApp } from '../setup';

/** The worker module inside the test process: the same processor the worker entry runs. */
export async function bootWorker(config: AppConfig): Promise<INestApplicationContext> {
  const app = await NestFactory.createApplicationContext(WorkerModule.register(config), { logger: false });
  await app.init();
  return app;
}

/** Environment for `node dist/worker.js` that reaches the same services as the test's API. */
export function workerEnv(t: TestApp, extra: Record<string, string>): NodeJS.ProcessEnv {
  const c = t.config;
  return {
    PATH: process.env.PATH,
    LOG_LEVEL: 'warn',
    LIMBUS_DEMO: '0',
    JWT_SECRET: c.jwtSecret,
    LIMBUS_ADMIN_EMAIL: 'initial-admin@example.org',
    LIMBUS_ADMIN_PASSWORD: 'initial-admin-password',
    LIMBUS_PUBLIC_URL: c.publicUrl,
    DB_HOST: c.db.host,
    DB_PORT: String(c.db.port),
    DB_NAME: c.db.name,
    DB_USER: c.db.user,
    DB_PASSWORD: c.db.password,
    REDIS_URL: c.redisUrl,
    SMTP_URL: c.smtpUrl,
    MAIL_FROM: c.mailFrom,
    S3_ENDPOINT: c.s3.endpoint,
    S3_BUCKET: c.s3.bucket,
    S3_ACCESS_KEY_ID: c.s3.accessKeyId,
    S3_SECRET_ACCESS_KEY: c.s3.secretAccessKey,
    ...extra,
  };
}

/** Starts the built worker and resolves once it prints its ready line. */
export async function spawnWorker(env: NodeJS.ProcessEnv): Promise<ChildProcess> {
  const entry = path.resolve(__dirname, '../../dist/worker.js');
  const child = spawn(process.execPath, [entry], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker not ready after 30 s:\n${output}`)), 30_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('ready worker')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`worker exited with ${String(code)}:\n${output}`));
    });
  });
  child.removeAllListeners('exit');
  return child;
}

/** The fit's row once it is solved or failed, or as it stands after `ms`. */
export async function fitWhenFinished(t: TestApp, fitId: string, ms = 30_000): Promise<FitRun> {
  const deadline = Date.now() + ms;
  let fit = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId });
  while (fit.state !== 'solved' && fit.state !== 'failed' && Date.now() < deadline) {
    await new Promise((resolve) => setTimeout(resolve, 200));
    fit = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId });
  }
  return fit;
}
