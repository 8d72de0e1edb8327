import type { ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { fitWhenFinished, spawnWorker, workerEnv } from './worker';

describe('fit worker killed mid-job', () => {
  let t: TestApp;
  let w: Workspace;
  const children: ChildProcess[] = [];

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    for (const child of children) if (child.exitCode === null) child.kill('SIGKILL');
    await t.close();
  });

  const fitRow = (id: string) => t.orm.em.fork().findOneOrFail(FitRun, { id });

  it('a fit whose worker is SIGKILLed while running is solved by the next worker (stalled-job recovery)', async () => {
    const eventId = await importExample(t, w);
    // The first worker holds every job 20 s before solving, so it is surely killed mid-job.
    const slow = await spawnWorker(
      workerEnv(t, {
        FIT_TEST_DELAY_MS: '20000',
        FIT_STALLED_INTERVAL_MS: '1000',
        FIT_LOCK_DURATION_MS: '1000',
        // High, so that it takes this job even when jobs left over from other test files are waiting.
        FIT_CONCURRENCY: '32',
      }),
    );
    children.push(slow);
    const response = await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202);
    const fitId = (response.body as { id: string }).id;
    const deadline = Date.now() + 15_000;
    while ((await fitRow(fitId)).state !== 'running' && Date.now() < deadline)
      await new Promise((resolve) => setTimeout(resolve, 100));
    expect((await fitRow(fitId)).state).toBe('running');
    slow.kill('SIGKILL');
    await new Promise((resolve) => slow.once('exit', resolve));

    const healthy = await spawnWorker(
      workerEnv(t, { FIT_STALLED_INTERVAL_MS: '1000', FIT_LOCK_DURATION_MS: '1000' }),
    );
    children.push(healthy);
    const fit = await fitWhenFinished(t, fitId);
    expect(fit.state).toBe('solved');
    expect(fit.attempts).toBe(2);
    healthy.kill('SIGTERM');
  });
});
