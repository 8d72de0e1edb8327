import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { del, importExample, createWorkspace, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

describe('a deleted event’s audit, and Idempotency-Key reuse', () => {
  let t: TestApp;
  let w: Workspace;
  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/events/:eventId/audit answers 404 once the event is deleted, and 200 again once restored', async () => {
    const eventId = await importExample(t, w);
    await t.get(`/api/events/${eventId}/audit`).set(w.auth('coordinator')).expect(200);
    await del(t, `/api/events/${eventId}`).set(w.auth('coordinator')).expect(204);
    // The same answer as the event's other routes give once it is deleted.
    await t.get(`/api/events/${eventId}`).set(w.auth('coordinator')).expect(404);
    const refused = await t.get(`/api/events/${eventId}/audit`).set(w.auth('coordinator')).expect(404);
    expect(refused.body.statusCode).toBe(404);
    await t.get(`/api/events/${eventId}/audit`).set(w.auth('admin')).expect(404);
    await t.post(`/api/events/${eventId}/restore`).set(w.auth('coordinator')).expect(200);
    const audit = await t.get(`/api/events/${eventId}/audit`).set(w.auth('coordinator')).expect(200);
    expect(audit.body.map((e: { action: string }) => e.action)).toEqual(
      expect.arrayContaining(['event.delete', 'event.restore']),
    );
  });

  it('POST /api/events/:eventId/fits with a used Idempotency-Key: the same body returns the first fit, another answers 422', async () => {
    const eventId = await importExample(t, w);
    const submit = (body: unknown) =>
      t
        .post(`/api/events/${eventId}/fits`)
        .set(w.auth('modeller'))
        .set('Idempotency-Key', 'submit-once-42')
        .send(body as object);
    const first = await submit({ options: { limb: { modelErrorKm: 2 } } }).expect(202);
    // The same request again: the same fit.
    const again = await submit({ options: { limb: { modelErrorKm: 2 } } }).expect(202);
    expect(again.body.id).toBe(first.body.id);
    const other = await submit({ options: { limb: { modelErrorKm: 5 } } }).expect(422);
    expect(other.body.message).toMatch(/Idempotency-Key was already used for a fit with other options/);
    const rows = await t.orm.em.fork().find(FitRun, { event: eventId, idempotencyKey: 'submit-once-42' });
    expect(rows.map((r) => r.id)).toEqual([first.body.id]);
    // SHA-256 of the canonical JSON (keys sorted, no spaces) of the validated body, computed here with
    // node:crypto directly rather than through the server's helpers.
    const expected = createHash('sha256').update('{"options":{"limb":{"modelErrorKm":2}}}').digest('hex');
    expect(rows[0]?.requestSha256).toBe(expected);
  });

  it('POST /api/events/:eventId/fits with an Idempotency-Key and no body is the same request as with options {}', async () => {
    const eventId = await importExample(t, w);
    const submit = (body: unknown) =>
      t
        .post(`/api/events/${eventId}/fits`)
        .set(w.auth('modeller'))
        .set('Idempotency-Key', 'defaults-only')
        .send(body as object);
    const first = await submit({}).expect(202);
    const again = await submit({ options: {} }).expect(202);
    expect(again.body.id).toBe(first.body.id);
  });
});
