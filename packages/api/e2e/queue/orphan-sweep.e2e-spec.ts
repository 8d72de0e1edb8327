import { randomUUID } from 'node:crypto';
import { getQueueToken } from '@nestjs/bullmq';
import { type Queue, Worker } from 'bullmq';
import IORedis from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import type { FitJobData } from '../../src/fits/fit-queue';
import { FitRequeue } from '../../src/fits/fit-requeue';
import { FITS_QUEUE } from '../../src/queue/queue.module';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

/**
 * The re-queue sweep against the real Redis: which unfinished fits it takes back. No worker runs here,
 * so every job stays where the test puts it; a job is made active or failed by hand, through BullMQ's
 * manual-processing calls (Worker.getNextJob, Job.moveToFailed), as a dead or cut-off worker leaves it.
 */
describe('FitRequeue.sweep()', () => {
  let t: TestApp;
  let w: Workspace;
  let queue: Queue<FitJobData>;
  let sweep: FitRequeue;
  let hand: Worker<FitJobData>;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    queue = t.app.get<Queue<FitJobData>>(getQueueToken(FITS_QUEUE));
    sweep = new FitRequeue(t.orm, queue);
    // Never started: it only takes jobs when the test asks it to.
    hand = new Worker<FitJobData>(FITS_QUEUE, null, {
      connection: { url: t.config.redisUrl, maxRetriesPerRequest: null },
      prefix: 'limbus',
      autorun: false,
    });
  });
  afterAll(async () => {
    await hand.close();
    await t.close();
  });

  /** A fit submitted through the API, made older than the submit grace and put in `state`. */
  async function fitIn(state: 'queued' | 'running'): Promise<string> {
    const eventId = await importExample(t, w);
    const response = await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202);
    const id = (response.body as { id: string }).id;
    await t.orm.em.fork().nativeUpdate(FitRun, { id }, { state, createdAt: new Date(Date.now() - 60_000) });
    return id;
  }

  /** Takes jobs by hand until it holds `id` (other files' waiting jobs are moved to failed on the way). */
  async function take(id: string, token: string) {
    for (let i = 0; i < 100; i++) {
      const job = await hand.getNextJob(token);
      if (!job) break;
      if (job.id === id) return job;
      await job.moveToFailed(new Error('not this test'), token, false);
    }
    throw new Error(`job ${id} was not handed out`);
  }

  it('queues again a running fit whose job is not in Redis (Redis lost it, or never had it)', async () => {
    const id = await fitIn('running');
    expect(await queue.remove(id)).toBe(1);
    expect(await queue.getJobState(id)).toBe('unknown');

    expect(await sweep.sweep()).toContain(id);
    expect(await queue.getJobState(id)).toBe('waiting');
    expect((await t.orm.em.fork().findOneOrFail(FitRun, { id })).state).toBe('running');
  });

  it('removes and queues again the failed job of a queued or running fit (its worker lost the database)', async () => {
    for (const state of ['queued', 'running'] as const) {
      const id = await fitIn(state);
      const token = randomUUID();
      const job = await take(id, token);
      await job.moveToFailed(new Error('connect ECONNREFUSED 127.0.0.1:3306'), token, false);
      expect(await queue.getJobState(id)).toBe('failed');

      expect(await sweep.sweep()).toContain(id);
      expect(await queue.getJobState(id)).toBe('waiting');
      // A fresh job: the failure and its attempt are gone with the old one.
      const again = await queue.getJob(id);
      expect(again?.failedReason).toBeFalsy();
      expect(again?.attemptsMade).toBe(0);
    }
  });

  it('leaves a running fit alone while a live worker holds its job (the job lock exists)', async () => {
    const id = await fitIn('running');
    const token = randomUUID();
    await take(id, token);
    expect(await queue.getJobState(id)).toBe('active');
    const redis = new IORedis(t.config.redisUrl);
    try {
      expect(await redis.exists(`${queue.toKey(id)}:lock`)).toBe(1);
    } finally {
      redis.disconnect();
    }

    expect(await sweep.sweep()).not.toContain(id);
    expect(await queue.getJobState(id)).toBe('active');
    await (await queue.getJob(id))?.moveToFailed(new Error('test over'), token, false);
  });

  it('leaves a fit that finished meanwhile, even when its job failed', async () => {
    const id = await fitIn('running');
    const token = randomUUID();
    await (await take(id, token)).moveToFailed(new Error('lost the answer'), token, false);
    await t.orm.em.fork().nativeUpdate(FitRun, { id }, { state: 'solved' });

    expect(await sweep.sweep()).not.toContain(id);
    expect(await queue.getJobState(id)).toBe('failed');
  });
});
