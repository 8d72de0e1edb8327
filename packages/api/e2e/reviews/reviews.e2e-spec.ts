import type { INestApplicationContext } from '@nestjs/common';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { Review } from '../../src/reviews/entities/review.entity';
import { User } from '../../src/users/entities/user.entity';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootWorker } from '../fits/worker';

describe('review and sign-off of fits', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let authorEmail: string;
  let reviewerEmail: string;
  let selfReviewer: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    eventId = await importExample(t, w);
    const em = t.orm.em.fork();
    authorEmail = (await em.findOneOrFail(User, { id: w.userIds.modeller })).email;
    reviewerEmail = (await em.findOneOrFail(User, { id: w.userIds.reviewer })).email;
    const both = await t.createUser({ teams: [{ team: w.team, roles: ['modeller', 'reviewer'] }] });
    selfReviewer = await t.signIn(both.email, both.password);
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  const solvedFit = async (token: string): Promise<string> => {
    const response = await t
      .post(`/api/events/${eventId}/fits`)
      .set('Authorization', `Bearer ${token}`)
      .send({})
      .expect(202);
    const id = (response.body as { id: string }).id;
    const deadline = Date.now() + 30_000;
    while (Date.now() < deadline) {
      const fit = await t.orm.em.fork().findOneOrFail(FitRun, { id });
      if (fit.state === 'solved') return id;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new Error('fit not solved in 30 s');
  };

  it('a fit goes solved → in review → returned → in review → approved, with a notice at each step', async () => {
    const id = await solvedFit(w.tokens.modeller);
    await t.post(`/api/fits/${id}/reviews`).set(w.auth('reviewer')).send({ decision: 'approve' }).expect(409);
    await t.post(`/api/fits/${id}/review-request`).set(w.auth('coordinator')).expect(403);
    await t
      .post(`/api/fits/${id}/review-request`)
      .set(w.auth('modeller'))
      .send({ message: 'Limb now with the clock offset of the second station fitted.' })
      .expect(200);
    const asked = await t.mailAbout(reviewerEmail, 'Review requested');
    expect(asked.text).toContain(`/events/${eventId}/fits/${id}`);
    expect(asked.text).toContain('clock offset of the second station fitted');
    await t.post(`/api/fits/${id}/reviews`).set(w.auth('modeller')).send({ decision: 'approve' }).expect(403);
    const noComment = await t
      .post(`/api/fits/${id}/reviews`)
      .set(w.auth('reviewer'))
      .send({ decision: 'return' })
      .expect(400);
    expect((noComment.body as { issues: Array<{ path: string }> }).issues[0]?.path).toBe('comment');
    await t
      .post(`/api/fits/${id}/reviews`)
      .set(w.auth('reviewer'))
      .send({ decision: 'return', comment: 'fit the clock offset of the second station' })
      .expect(201);
    expect((await t.orm.em.fork().findOneOrFail(FitRun, { id })).reviewState).toBe('returned');
    const returned = await t.mailAbout(authorEmail, 'Fit returned');
    expect(returned.text).toContain('clock offset');
    await t.post(`/api/fits/${id}/review-request`).set(w.auth('modeller')).expect(200);
    await t
      .post(`/api/fits/${id}/reviews`)
      .set(w.auth('reviewer'))
      .send({ decision: 'approve', comment: 'good' })
      .expect(201);
    const fit = await t.get(`/api/fits/${id}`).set(w.auth('observer')).expect(200);
    expect((fit.body as { reviewState: string }).reviewState).toBe('approved');
    await t.post(`/api/fits/${id}/review-request`).set(w.auth('modeller')).expect(409);
    await t
      .post(`/api/fits/${id}/reviews`)
      .set(w.auth('reviewer'))
      .send({ decision: 'return', comment: 'x' })
      .expect(409);
    const list = await t.get(`/api/fits/${id}/reviews`).set(w.auth('observer')).expect(200);
    const entries = list.body as Array<{ decision: string; comment: string; reviewer: { id: string } }>;
    expect(entries.map((r) => r.decision)).toEqual(['request', 'return', 'request', 'approve']);
    expect(entries[0]).toMatchObject({
      comment: 'Limb now with the clock offset of the second station fitted.',
      reviewer: { id: w.userIds.modeller },
    });
    expect(entries[2]?.comment).toBe('');
    expect(await t.orm.em.fork().count(Review, { fit: id })).toBe(4);
    await t.mailAbout(authorEmail, 'Fit approved');
  });

  it('POST /api/fits/:fitId/reviews refuses the fit author even when they hold the reviewer role', async () => {
    const id = await solvedFit(selfReviewer);
    await t.post(`/api/fits/${id}/review-request`).set('Authorization', `Bearer ${selfReviewer}`).expect(200);
    const own = await t
      .post(`/api/fits/${id}/reviews`)
      .set('Authorization', `Bearer ${selfReviewer}`)
      .send({ decision: 'approve' })
      .expect(403);
    expect((own.body as { message: string }).message).toBe('A fit cannot be reviewed by its own author');
    await t.post(`/api/fits/${id}/reviews`).set(w.auth('outsider')).send({ decision: 'approve' }).expect(404);
  });

  it('GET /api/events/:eventId/reviews keeps the history of an earlier fit after a re-run', async () => {
    const first = await solvedFit(w.tokens.modeller);
    await t.post(`/api/fits/${first}/review-request`).set(w.auth('modeller')).expect(200);
    await t
      .post(`/api/fits/${first}/reviews`)
      .set(w.auth('reviewer'))
      .send({ decision: 'return', comment: 'add the negative chord of the northern station' })
      .expect(201);
    const second = await solvedFit(w.tokens.modeller);
    await t
      .post(`/api/fits/${second}/review-request`)
      .set(w.auth('modeller'))
      .send({ message: 'negative added' })
      .expect(200);
    const history = await t.get(`/api/events/${eventId}/reviews`).set(w.auth('observer')).expect(200);
    const entries = history.body as Array<{
      fitId: string;
      fitCreatedAt: string;
      decision: string;
      comment: string;
    }>;
    const ofRun = (fitId: string) =>
      entries.filter((e) => e.fitId === fitId).map((e) => [e.decision, e.comment]);
    expect(ofRun(first)).toEqual([
      ['request', ''],
      ['return', 'add the negative chord of the northern station'],
    ]);
    expect(ofRun(second)).toEqual([['request', 'negative added']]);
    const stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: first });
    expect(entries.find((e) => e.fitId === first)?.fitCreatedAt).toBe(stored.createdAt.toISOString());
    await t.get(`/api/events/${eventId}/reviews`).set(w.auth('outsider')).expect(404);
    await t.get(`/api/events/${eventId}/reviews`).expect(401);
  });

  it('POST /api/fits/:fitId/review-request refuses a message with control characters, naming the field', async () => {
    const id = await solvedFit(w.tokens.modeller);
    const response = await t
      .post(`/api/fits/${id}/review-request`)
      .set(w.auth('modeller'))
      .send({ message: 'look \u001b[31mhere' })
      .expect(400);
    expect((response.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'message',
    ]);
    expect((await t.orm.em.fork().findOneOrFail(FitRun, { id })).reviewState).toBe('none');
  });
});
