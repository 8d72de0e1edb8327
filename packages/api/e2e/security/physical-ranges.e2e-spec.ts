import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { createWorkspace, exampleEvent, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

describe('absurd numbers in payloads and event files', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/events/:eventId/stations with heightM 1e308 answers 400 on heightM and stores nothing', async () => {
    const before = await t.orm.em.fork().count(Station, { event: eventId });
    const response = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'absurd-height', latDeg: 38.2, lonDeg: -4.1, heightM: 1e308 })
      .expect(400);
    expect(response.body.issues.map((i: { path: string }) => i.path)).toEqual(['heightM']);
    expect(await t.orm.em.fork().count(Station, { event: eventId })).toBe(before);
    // Everest's summit, 8849 m (from memory), is a station's height still.
    await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'summit', latDeg: 27.988, lonDeg: 86.925, heightM: 8849 })
      .expect(201);
  });

  it('PATCH /api/events/:eventId with parallaxMas 1e308 answers 400 on star.parallaxMas and keeps the star', async () => {
    const star = { ...(exampleEvent().star as Record<string, unknown>), parallaxMas: 1e308 };
    const response = await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ star })
      .expect(400);
    expect(response.body.issues.map((i: { path: string }) => i.path)).toEqual(['star.parallaxMas']);
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id: eventId });
    expect(stored.star.parallaxMas).toBe((exampleEvent().star as { parallaxMas?: number }).parallaxMas ?? 0);
  });

  it('POST /api/events/import of a file with heightM 1e308 answers 400 on stations[0].heightM', async () => {
    const file = exampleEvent();
    (file.stations as Array<Record<string, unknown>>)[0]!.heightM = 1e308;
    const response = await t
      .post('/api/events/import')
      .set(w.auth('coordinator'))
      .field('teamId', w.team.id)
      .attach('file', Buffer.from(JSON.stringify(file)), {
        filename: 'event.json',
        contentType: 'application/json',
      })
      .expect(400);
    expect(response.body.issues.map((i: { path: string }) => i.path)).toEqual(['stations[0].heightM']);
  });
});
