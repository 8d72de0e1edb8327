import type { INestApplicationContext } from '@nestjs/common';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventDataSha256 } from '../../src/events/event-data';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootWorker } from './worker';

interface FitStatusBody {
  id: string;
  state: string;
  reviewState: string;
  dataSha256: string;
  inputMatchesEvent: boolean;
}

/** Whether a fit still matches its event: the fit's data hash against the event's current one. */
describe('fits based on older data', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let fitId: string;

  const fit = async () =>
    (await t.get(`/api/fits/${fitId}`).set(w.auth('reviewer')).expect(200)).body as FitStatusBody;
  const listed = async () =>
    (
      (await t.get(`/api/events/${eventId}/fits`).set(w.auth('reviewer')).expect(200)).body as FitStatusBody[]
    ).find((f) => f.id === fitId);
  const eventHash = async () =>
    (
      (await t.get(`/api/events/${eventId}`).set(w.auth('observer')).expect(200)).body as {
        dataSha256: string;
      }
    ).dataSha256;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    eventId = await importExample(t, w);
    const response = await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202);
    fitId = (response.body as { id: string }).id;
    const deadline = Date.now() + 30_000;
    while ((await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId })).state !== 'solved') {
      if (Date.now() > deadline) throw new Error('fit not solved in 30 s');
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  it('a fit run on the event as it is matches it: the stored hash is the hash of its own input', async () => {
    const stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId });
    expect(stored.dataSha256).toBe(eventDataSha256(JSON.parse(stored.input)));
    expect(await fit()).toMatchObject({ dataSha256: stored.dataSha256, inputMatchesEvent: true });
    expect(await eventHash()).toBe(stored.dataSha256);
  });

  it('renaming the event or changing its fit defaults leaves the fit current', async () => {
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ title: 'Renamed, same data', fitDefaults: { limb: { modelErrorKm: 3 } } })
      .expect(200);
    expect((await fit()).inputMatchesEvent).toBe(true);
  });

  it('editing a chord after the fit marks it as based on older data, in the fit and in the list', async () => {
    const chords = (await t.get(`/api/events/${eventId}/chords`).set(w.auth('modeller')).expect(200))
      .body as Array<{
      id: string;
      timeOffsetSeconds: number;
    }>;
    const chord = chords[0];
    if (!chord) throw new Error('the example has chords');
    await patch(t, `/api/chords/${chord.id}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: chord.timeOffsetSeconds + 0.1 })
      .expect(200);
    expect((await fit()).inputMatchesEvent).toBe(false);
    expect((await listed())?.inputMatchesEvent).toBe(false);
    const page = (await t.get(`/api/events?teamId=${w.team.id}`).set(w.auth('reviewer')).expect(200))
      .body as {
      items: Array<{ id: string; latestFit: FitStatusBody | null }>;
    };
    expect(page.items.find((e) => e.id === eventId)?.latestFit).toMatchObject({
      id: fitId,
      inputMatchesEvent: false,
    });
    // Undoing the edit gives the same data again, and the fit is current once more.
    await patch(t, `/api/chords/${chord.id}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: chord.timeOffsetSeconds })
      .expect(200);
    expect((await fit()).inputMatchesEvent).toBe(true);
  });
});
