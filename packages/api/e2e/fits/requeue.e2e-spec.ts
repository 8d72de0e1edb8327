import type { INestApplicationContext } from '@nestjs/common';
import { getQueueToken } from '@nestjs/bullmq';
import type { Queue } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { FITS_QUEUE } from '../../src/queue/queue.module';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { bootWorker, fitWhenFinished } from './worker';

describe('a fit submitted while the queue is unreachable', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext | undefined;
  let queue: Queue;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    queue = t.app.get<Queue>(getQueueToken(FITS_QUEUE));
  });
  afterAll(async () => {
    await worker?.close();
    delete process.env.REQUEUE_INTERVAL_MS;
    await t.close();
  });

  const fitRow = (id: string) => t.orm.em.fork().findOneOrFail(FitRun, { id });

  it('is answered 202 and kept queued, then queued again and solved once a worker sweeps', async () => {
    const eventId = await importExample(t, w);
    // What the API sees while Redis is away: the add fails (or never answers; see the next test).
    const add = queue.add.bind(queue);
    queue.add = () => Promise.reject(new Error('Connection is closed.'));
    let fitId: string;
    try {
      const response = await t
        .post(`/api/events/${eventId}/fits`)
        .set(w.auth('modeller'))
        .send({})
        .expect(202);
      fitId = (response.body as { id: string }).id;
    } finally {
      queue.add = add;
    }
    expect((await fitRow(fitId)).state).toBe('queued');
    expect(await queue.getJob(fitId)).toBeUndefined();

    process.env.REQUEUE_INTERVAL_MS = '300';
    worker = await bootWorker(t.config);
    const fit = await fitWhenFinished(t, fitId);
    expect(fit.state).toBe('solved');
    expect(fit.attempts).toBe(1);
  });

  it('does not hold the request when the queue never answers', async () => {
    const eventId = await importExample(t, w);
    const add = queue.add.bind(queue);
    queue.add = () => new Promise(() => undefined);
    try {
      const started = Date.now();
      await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202);
      expect(Date.now() - started).toBeLessThan(10_000);
    } finally {
      queue.add = add;
    }
  });
});
