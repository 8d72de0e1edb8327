import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplicationContext } from '@nestjs/common';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { JointPoleView } from '../../src/comparisons/comparisons.service';
import type { ShapeView } from '../../src/shapes/shapes.service';
import { createWorkspace, exampleEvent, importExample, type Workspace } from '../events/workspace';
import { bootWorker } from '../fits/worker';
import { bootTestApp, type TestApp } from '../setup';

// The CLI's invented joint-pole fixtures (tools/examples/make-event-examples.ts): one ring seen at three
// events; the 2036 one has no positive chord, so no limb.
const FIXTURES = path.resolve(__dirname, '../../../../tools/cli/test/fixtures');
const fixture = (name: string) =>
  JSON.parse(readFileSync(path.join(FIXTURES, name), 'utf8')) as Record<string, unknown>;

describe('3D shape with the pole of a solved joint ring-pole job', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  const fitIds: string[] = [];
  let jointId = '';

  const until = async <T>(read: () => Promise<T>, done: (v: T) => boolean): Promise<T> => {
    const deadline = Date.now() + 60_000;
    for (;;) {
      const v = await read();
      if (done(v)) return v;
      if (Date.now() > deadline) throw new Error('timed out');
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  };

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    for (const file of [exampleEvent(), fixture('joint-2031.json'), fixture('joint-2036.json')]) {
      const eventId = await importExample(t, w, file);
      const id = (
        (
          await t
            .post(`/api/events/${eventId}/fits`)
            .set(w.auth('modeller'))
            .send({ options: {} })
            .expect(202)
        ).body as { id: string }
      ).id;
      await until(
        async () =>
          ((await t.get(`/api/fits/${id}`).set(w.auth('observer'))).body as { state: string }).state,
        (s) => s === 'solved' || s === 'failed',
      );
      fitIds.push(id);
    }
    jointId = (
      (
        await t
          .post(`/api/teams/${w.team.id}/joint-poles`)
          .set(w.auth('modeller'))
          .send({ fitIds })
          .expect(202)
      ).body as { id: string }
    ).id;
    await until(
      async () => (await t.get(`/api/joint-poles/${jointId}`).set(w.auth('observer'))).body as JointPoleView,
      (v) => v.state === 'solved' || v.state === 'failed',
    );
  }, 240_000);
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  it('POST /api/teams/:teamId/shape takes the joint ring pole as the spin pole, and says it assumed an equatorial ring', async () => {
    const joint = (await t.get(`/api/joint-poles/${jointId}`).set(w.auth('observer')).expect(200))
      .body as JointPoleView;
    expect(joint.state).toBe('solved');
    const view = (
      await t
        .post(`/api/teams/${w.team.id}/shape`)
        .set(w.auth('observer'))
        .send({
          fitIds: fitIds.slice(0, 2),
          pole: { fromJointPoleId: jointId },
          periodHours: 7.5,
          epochUtc: '2028-01-01T00:00:00Z',
          model: 'spheroid',
        })
        .expect(200)
    ).body as ShapeView;
    expect(view.pole).toEqual({ ...joint.result?.pole, source: 'joint ring pole', jointPoleId: jointId });
    // The pole's caution first, then the fit's own (two events of invented limbs fit a spheroid poorly).
    expect(view.cautions).toEqual([
      expect.stringMatching(/ring lies in the equatorial plane/),
      ...view.result.cautions,
    ]);
    expect(view.result.events.map((e) => e.id)).toEqual(fitIds.slice(0, 2));
    expect(view.result.semiAxesKm.aKm).toBeGreaterThan(0);
  });

  it("POST /api/teams/:teamId/shape refuses the ringed event without a limb and another team's joint pole", async () => {
    const refused = await t
      .post(`/api/teams/${w.team.id}/shape`)
      .set(w.auth('observer'))
      .send({
        fitIds,
        pole: { fromJointPoleId: jointId },
        periodHours: 7.5,
        epochUtc: '2028-01-01T00:00:00Z',
        model: 'spheroid',
      })
      .expect(400);
    expect((refused.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'fitIds.2',
    ]);
    // The outsider's own team, naming this team's joint job: answered as missing.
    const other = await t
      .post(`/api/teams/${w.otherTeam.id}/shape`)
      .set(w.auth('outsider'))
      .send({
        fitIds: ['x'],
        pole: { fromJointPoleId: jointId },
        periodHours: 7.5,
        epochUtc: '2028-01-01T00:00:00Z',
        model: 'spheroid',
      })
      .expect(400);
    expect((other.body as { issues: Array<{ path: string; message: string }> }).issues).toEqual([
      { path: 'fitIds.0', message: 'no such fit in this team' },
      { path: 'pole.fromJointPoleId', message: 'no such joint pole in this team' },
    ]);
  });
});
