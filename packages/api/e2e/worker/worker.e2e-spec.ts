import 'reflect-metadata';
import { randomBytes } from 'node:crypto';
import { getQueueToken } from '@nestjs/bullmq';
import type { INestApplicationContext } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { Queue } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FITS_QUEUE } from '../../src/queue/queue.module';
import { WorkerModule } from '../../src/worker.module';
import { bootTestApp, type TestApp } from '../setup';

describe('worker entry point', () => {
  let api: TestApp;
  let worker: INestApplicationContext;
  beforeAll(async () => {
    api = await bootTestApp();
    // Same configuration as the API under test, so both talk to the same Redis.
    worker = await NestFactory.createApplicationContext(WorkerModule.register(api.config), { logger: false });
    await worker.init();
  });
  afterAll(async () => {
    await worker.close();
    await api.close();
  });

  it('WorkerModule boots without HTTP and shares the fits queue with the API', async () => {
    const fromApi = api.app.get<Queue>(getQueueToken(FITS_QUEUE));
    const fromWorker = worker.get<Queue>(getQueueToken(FITS_QUEUE));
    const marker = randomBytes(6).toString('hex');
    const job = await fromApi.add('probe', { marker }, { delay: 60_000 });
    if (!job.id) throw new Error('no job id');
    const seen = await fromWorker.getJob(job.id);
    expect(seen?.data).toEqual({ marker });
    await seen?.remove();
    expect(await fromWorker.getJob(job.id)).toBeUndefined();
  });
});
