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
    await t.post(`/api/fits/${id}/review-request`).set(w.auth('modeller')).expect(200);
    const asked = await t.mailAbout(reviewerEmail, 'Review requested');
    expect(asked.text).toContain(`/events/${eventId}/fits/${id}`);
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
    expect((list.body as Array<{ decision: string }>).map((r) => r.decision)).toEqual(['return', 'approve']);
    expect(await t.orm.em.fork().count(Review, { fit: id })).toBe(2);
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
});
