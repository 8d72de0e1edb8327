import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

const issuesOf = (response: request.Response) =>
  (response.body as { issues: Array<{ path: string; message: string }> }).issues;

describe("planning: planned stations and observers' proposed sites", () => {
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

  const propose = (code: string, fields: Record<string, unknown> = {}) =>
    t
      .post(`/api/events/${eventId}/site-proposals`)
      .set(w.auth('observer'))
      .send({ code, latDeg: -21.5, lonDeg: 134.25, heightM: 610, ...fields });

  it('POST …/site-proposals makes a proposed station with the proposer as its observer, audited, and tells the coordinators', async () => {
    const made = (await propose('ridge-proposal', { notes: 'Farm track; the owner agrees.' }).expect(201))
      .body as { id: string; status: string; observerId: string; notes: string };
    expect(made).toMatchObject({
      status: 'proposed',
      observerId: w.userIds.observer,
      notes: 'Farm track; the owner agrees.',
    });
    const stored = await t.orm.em.fork().findOneOrFail(Station, { id: made.id }, { populate: ['observer'] });
    expect([stored.status, stored.observer?.id, stored.latDeg]).toEqual([
      'proposed',
      w.userIds.observer,
      -21.5,
    ]);
    expect(await t.orm.em.fork().count(AuditEntry, { objectId: made.id, action: 'station.propose' })).toBe(1);
    const detail = (await t.get(`/api/events/${eventId}`).set(w.auth('reviewer')).expect(200)).body as {
      stations: Array<{ id: string; status: string }>;
    };
    expect(detail.stations.find((s) => s.id === made.id)?.status).toBe('proposed');
  });

  it('POST …/site-proposals refuses bad fields by name, and an id the event has with 409 naming `code`', async () => {
    const bad = await propose('', { latDeg: 91, lonDeg: 'east' }).expect(400);
    expect(
      issuesOf(bad)
        .map((i) => i.path)
        .sort(),
    ).toEqual(['code', 'latDeg', 'lonDeg']);
    const unknown = await propose('x1', { status: 'observing' }).expect(400);
    expect(issuesOf(unknown).map((i) => i.path)).toEqual(['(body)']);
    const existing = await propose('ridge-proposal').expect(409);
    expect(existing.body).toMatchObject({
      code: 'station-code-taken',
      detail: {
        issues: [{ path: 'code', message: 'station id "ridge-proposal" is already used in this event' }],
      },
    });
  });

  it('two proposals of one id at once give one 201 and one 409, never a 500', async () => {
    const answers = await Promise.all([propose('twin-site'), propose('twin-site')]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(await t.orm.em.fork().count(Station, { event: eventId, code: 'twin-site' })).toBe(1);
  });

  it('accept makes it planned (or observing); a second decision is 409; PATCH cannot decide a proposal', async () => {
    const id = ((await propose('accept-me').expect(201)).body as { id: string }).id;
    const refused = await patch(t, `/api/events/${eventId}/stations/${id}`)
      .set(w.auth('coordinator'))
      .send({ status: 'planned' })
      .expect(400);
    expect(issuesOf(refused).map((i) => i.path)).toEqual(['status']);
    const bad = await t
      .post(`/api/events/${eventId}/site-proposals/${id}/accept`)
      .set(w.auth('coordinator'))
      .send({ status: 'proposed' })
      .expect(400);
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['status']);
    const accepted = await t
      .post(`/api/events/${eventId}/site-proposals/${id}/accept`)
      .set(w.auth('coordinator'))
      .expect(200);
    expect((accepted.body as { status: string }).status).toBe('planned');
    expect((await t.orm.em.fork().findOneOrFail(Station, { id })).status).toBe('planned');
    await t.post(`/api/events/${eventId}/site-proposals/${id}/accept`).set(w.auth('coordinator')).expect(409);
    await t
      .post(`/api/events/${eventId}/site-proposals/${id}/decline`)
      .set(w.auth('coordinator'))
      .expect(409);
    // A planned station becomes observing through the station's own PATCH.
    await patch(t, `/api/events/${eventId}/stations/${id}`)
      .set(w.auth('coordinator'))
      .send({ status: 'observing' })
      .expect(200);
    expect((await t.orm.em.fork().findOneOrFail(Station, { id })).status).toBe('observing');
    const mail = await t.mailAbout(
      (await t.orm.em.fork().findOneOrFail(Station, { id }, { populate: ['observer'] })).observer?.email ??
        '',
      'Site accepted: accept-me',
    );
    expect(mail.text).toContain('accepted your proposed site accept-me');
  });

  it('decline removes the proposed station and audits the reason; accept and decline at once: one wins, one 409', async () => {
    const id = ((await propose('decline-me').expect(201)).body as { id: string }).id;
    await t
      .post(`/api/events/${eventId}/site-proposals/${id}/decline`)
      .set(w.auth('coordinator'))
      .send({ reason: 'Private land without permission.' })
      .expect(204);
    expect(await t.orm.em.fork().count(Station, { id })).toBe(0);
    const entry = await t.orm.em
      .fork()
      .findOneOrFail(AuditEntry, { objectId: id, action: 'station.proposal.decline' });
    expect(entry.detail).toMatchObject({ code: 'decline-me', reason: 'Private land without permission.' });
    const raced = ((await propose('race-me').expect(201)).body as { id: string }).id;
    const answers = await Promise.all([
      t
        .post(`/api/events/${eventId}/site-proposals/${raced}/accept`)
        .set(w.auth('coordinator'))
        .send({ status: 'observing' }),
      t.post(`/api/events/${eventId}/site-proposals/${raced}/decline`).set(w.auth('coordinator')).send({}),
    ]);
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 409)).toHaveLength(1);
    expect(statuses.filter((s) => s === 200 || s === 204)).toHaveLength(1);
    const decisions = await t.orm.em.fork().count(AuditEntry, {
      objectId: raced,
      action: { $in: ['station.proposal.accept', 'station.proposal.decline'] },
    });
    expect(decisions).toBe(1);
  });

  it("POST /api/events/:eventId/stations takes status planned; a planned site stays out of the fit's file and hash", async () => {
    const before = (await t.get(`/api/events/${eventId}`).set(w.auth('coordinator')).expect(200)).body as {
      dataSha256: string;
    };
    const made = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'planned-l120', latDeg: -22, lonDeg: 133.5, heightM: 500, status: 'planned' })
      .expect(201);
    expect((made.body as { status: string }).status).toBe('planned');
    const bad = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'p2', latDeg: -22, lonDeg: 133.5, heightM: 500, status: 'proposed' })
      .expect(400);
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['status']);
    const after = (await t.get(`/api/events/${eventId}`).set(w.auth('coordinator')).expect(200)).body as {
      dataSha256: string;
    };
    // Planned and proposed sites are not data a fit runs on: the event's data hash stays.
    expect(after.dataSha256).toBe(before.dataSha256);
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('observer')).expect(200))
      .body as {
      stations: Array<{ id: string }>;
    };
    expect(exported.stations.map((s) => s.id)).toContain('planned-l120');
  });

  it('decline refuses (409) a proposed site the observer has already reported from, and keeps the report', async () => {
    const id = ((await propose('reported-site').expect(201)).body as { id: string }).id;
    await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: id, result: 'clouded_out' })
      .expect(201);
    const refused = await t
      .post(`/api/events/${eventId}/site-proposals/${id}/decline`)
      .set(w.auth('coordinator'))
      .send({})
      .expect(409);
    expect((refused.body as { message: string }).message).toMatch(/already reported/);
    expect(await t.orm.em.fork().count(Station, { id })).toBe(1);
  });
});
