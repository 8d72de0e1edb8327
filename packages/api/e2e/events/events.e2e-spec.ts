import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Chord } from '../../src/chords/entities/chord.entity';
import { RingEvent } from '../../src/chords/entities/ring-event.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { User } from '../../src/users/entities/user.entity';
import { bootTestApp, type TestApp } from '../setup';
import {
  type Actor,
  createWorkspace,
  del,
  exampleEvent,
  importExample,
  patch,
  type Workspace,
} from './workspace';

describe('event routes', () => {
  let t: TestApp;
  let w: Workspace;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    await t.close();
  });

  const rowCounts = async () => {
    const em = t.orm.em.fork();
    return {
      events: await em.count(OccultationEvent, { team: w.team.id }),
      stations: await em.count(Station, { event: { team: w.team.id } }),
      chords: await em.count(Chord, { event: { team: w.team.id } }),
      ringEvents: await em.count(RingEvent, { event: { team: w.team.id } }),
    };
  };

  it('POST /api/events/import stores the event with its stations, chords and ring events', async () => {
    const file = exampleEvent();
    const id = await importExample(t, w, file);
    const em = t.orm.em.fork();
    const stored = await em.findOneOrFail(OccultationEvent, { id }, { populate: ['team'] });
    expect(stored.team.id).toBe(w.team.id);
    expect(stored.title).toBe(file.title);
    expect(await em.count(Station, { event: id })).toBe((file.stations as unknown[]).length);
    expect(await em.count(Chord, { event: id })).toBe((file.chords as unknown[]).length);
    expect(await em.count(RingEvent, { event: id })).toBe((file.ringEvents as unknown[]).length);
    expect(await em.count(AuditEntry, { eventId: id, action: 'event.import' })).toBe(1);
    const audit = await t.get(`/api/events/${id}/audit`).set(w.auth('coordinator')).expect(200);
    expect(audit.body).toEqual([
      expect.objectContaining({
        action: 'event.import',
        objectType: 'event',
        objectId: id,
        actorId: w.userIds.coordinator,
        actorName: (await em.findOneOrFail(User, { id: w.userIds.coordinator })).name,
      }),
    ]);
  });

  it('GET /api/events/:eventId/export gives back a file that imports to an equal event (round trip)', async () => {
    const id = await importExample(t, w);
    const first = await t.get(`/api/events/${id}/export`).set(w.auth('observer')).expect(200);
    const againId = await importExample(t, w, first.body as Record<string, unknown>);
    const second = await t.get(`/api/events/${againId}/export`).set(w.auth('observer')).expect(200);
    expect(second.body).toEqual(first.body);
    const original = exampleEvent();
    const exported = first.body as Record<string, unknown>;
    expect(exported.chords).toEqual(
      (original.chords as Array<Record<string, unknown>>).map((c) => ({ timeOffsetSeconds: 0, ...c })),
    );
    expect(exported.stations).toEqual(original.stations);
  });

  it('POST /api/events/import with an invalid file answers 400 naming every problem and writes nothing', async () => {
    const before = await rowCounts();
    const file = exampleEvent();
    const chords = file.chords as Array<Record<string, unknown>>;
    (chords[0] as { station: string }).station = 'nowhere';
    (chords[1] as Record<string, unknown>).type = 'grazing';
    (file.star as Record<string, unknown>).decDeg = 123;
    const response = await t
      .post('/api/events/import')
      .set(w.auth('coordinator'))
      .field('teamId', w.team.id)
      .attach('file', Buffer.from(JSON.stringify(file)), 'event.json')
      .expect(400);
    const paths = (response.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort();
    expect(paths).toEqual(['chords[0].station', 'chords[1].type', 'star.decDeg']);
    expect(await rowCounts()).toEqual(before);
  });

  it('POST /api/events/import with malformed JSON answers 400 on the file field', async () => {
    const response = await t
      .post('/api/events/import')
      .set(w.auth('coordinator'))
      .field('teamId', w.team.id)
      .attach('file', Buffer.from('{"format": "limbus-event/1",'), 'event.json')
      .expect(400);
    expect((response.body as { issues: Array<{ path: string }> }).issues[0]?.path).toBe('file');
  });

  it('POST /api/events/import needs the coordinator role in the named team', async () => {
    const send = (actor: 'modeller' | 'outsider') =>
      t
        .post('/api/events/import')
        .set(w.auth(actor))
        .field('teamId', w.team.id)
        .attach('file', Buffer.from(JSON.stringify(exampleEvent())), 'event.json');
    await send('modeller').expect(403);
    await send('outsider').expect(404);
  });

  it('GET /api/events lists the events of my teams with counts and no foreign ones', async () => {
    const id = await importExample(t, w);
    const mine = await t.get('/api/events?pageSize=100').set(w.auth('reviewer')).expect(200);
    const page = mine.body as { items: Array<Record<string, unknown>>; total: number; page: number };
    expect(page.page).toBe(1);
    const row = page.items.find((e) => e.id === id);
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id }, { populate: ['body'] });
    expect(row).toEqual({
      id,
      title: exampleEvent().title,
      teamId: w.team.id,
      bodyId: stored.body.id,
      bodyName: stored.body.name,
      // The earliest chord timing of the example, to the second.
      eventTimeUtc: '2028-03-14T02:10:00Z',
      deletedAt: null,
      star: { raDeg: 285.21437, decDeg: -21.38812 },
      counts: { stations: 11, chords: 11, reports: 0, fits: 0, myStations: 0, openReports: 0 },
      latestFit: null,
      fitsInReview: 0,
    });
    const theirs = await t.get('/api/events').set(w.auth('outsider')).expect(200);
    expect((theirs.body as { items: Array<{ id: string }> }).items.map((e) => e.id)).not.toContain(id);
  });

  it('POST /api/events creates an empty event; PATCH validates and names the field', async () => {
    const file = exampleEvent();
    const created = await t
      .post('/api/events')
      .set(w.auth('coordinator'))
      .send({
        teamId: w.team.id,
        title: 'Hand-made',
        star: file.star,
        ephemeris: file.ephemeris,
        earthRotation: {},
      })
      .expect(201);
    const id = (created.body as { id: string }).id;
    const bad = await patch(t, `/api/events/${id}`)
      .set(w.auth('modeller'))
      .send({ earthRotation: { dut1Seconds: 2 } })
      .expect(400);
    expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'earthRotation.dut1Seconds',
    ]);
    const patched = await patch(t, `/api/events/${id}`)
      .set(w.auth('modeller'))
      .send({ title: 'Renamed' })
      .expect(200);
    expect((patched.body as { title: string; earthRotation: unknown }).title).toBe('Renamed');
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id });
    expect(stored.title).toBe('Renamed');
    expect(stored.earthRotation).toEqual({ dut1Seconds: 0 });
    await patch(t, `/api/events/${id}`).set(w.auth('observer')).send({ title: 'x' }).expect(403);
  });

  it('DELETE /api/events/:eventId hides the event until a coordinator restores it', async () => {
    const id = await importExample(t, w);
    await del(t, `/api/events/${id}`).set(w.auth('coordinator')).expect(204);
    await t.get(`/api/events/${id}`).set(w.auth('coordinator')).expect(404);
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id });
    expect(stored.state).toBe('deleted');
    await t.post(`/api/events/${id}/restore`).set(w.auth('modeller')).expect(403);
    await t.post(`/api/events/${id}/restore`).set(w.auth('coordinator')).expect(200);
    const back = await t.get(`/api/events/${id}`).set(w.auth('observer')).expect(200);
    expect((back.body as { stations: unknown[] }).stations).toHaveLength(11);
  });
  // Last: it gives the team a second body, after which an event must name its body.
  it('GET /api/events pages, searches, sorts and filters in the database', async () => {
    const list = async (query: string, actor: Actor = 'coordinator') =>
      (await t.get(`/api/events?teamId=${w.team.id}&${query}`).set(w.auth(actor)).expect(200)).body as {
        items: Array<{ id: string; title: string; eventTimeUtc: string }>;
        total: number;
      };
    const titles = ['Paging early %_ event', 'Paging late event', 'Paging middle event'];
    const times = ['2030-01-01T00:00:00Z', '2030-03-01T00:00:00Z', '2030-02-01T00:00:00Z'];
    const ids: string[] = [];
    for (const [k, title] of titles.entries()) {
      const file = { ...exampleEvent(), title };
      const id = await importExample(t, w, file, { bodyName: 'Paging body' });
      await patch(t, `/api/events/${id}`)
        .set(w.auth('coordinator'))
        .send({ eventTimeUtc: times[k] })
        .expect(200);
      ids.push(id);
    }
    const found = await list('q=Paging&sort=date-asc&pageSize=2');
    expect(found.total).toBe(3);
    expect(found.items.map((e) => e.title)).toEqual(['Paging early %_ event', 'Paging middle event']);
    expect((await list('q=Paging&sort=date-asc&pageSize=2&page=2')).items.map((e) => e.title)).toEqual([
      'Paging late event',
    ]);
    expect((await list('q=Paging&sort=date-desc&pageSize=1')).items[0]?.title).toBe('Paging late event');
    // % and _ are matched as themselves, not as patterns.
    expect((await list('q=%25_')).items.map((e) => e.title)).toEqual(['Paging early %_ event']);
    // The body's name is searched too.
    expect((await list('q=Paging%20body')).total).toBe(3);
    expect((await list('q=Paging&fit=none')).total).toBe(3);
    expect((await list('q=Paging&fit=approved')).total).toBe(0);
    const bad = await t.get('/api/events?pageSize=101&sort=random').set(w.auth('coordinator')).expect(400);
    expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort()).toEqual([
      'pageSize',
      'sort',
    ]);
    // Archived events are listed for coordinators only.
    await del(t, `/api/events/${ids[0] ?? ''}`)
      .set(w.auth('coordinator'))
      .expect(204);
    expect((await list('q=Paging')).total).toBe(2);
    expect((await list('q=Paging&archived=true')).items.map((e) => e.id)).toEqual([ids[0]]);
    await t.get(`/api/events?teamId=${w.team.id}&archived=true`).set(w.auth('observer')).expect(403);
  });
});
