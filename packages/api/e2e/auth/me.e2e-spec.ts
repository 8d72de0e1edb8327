import type { Server } from 'node:http';
import { NOTICE_KINDS } from '@limbus/schema';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NoticesService } from '../../src/mail/notices.service';
import { User } from '../../src/users/entities/user.entity';
import { bootTestApp, type TestApp } from '../setup';

describe('GET /api/me and PUT /api/me/notices', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  const put = (url: string) =>
    request(t.app.getHttpServer() as Server)
      .put(url)
      .set('X-Forwarded-For', t.address);

  it('GET /api/me answers the user, their teams and the notice kinds they turned off', async () => {
    const team = await t.createTeam();
    const { user, email, password } = await t.createUser({
      teams: [{ team, roles: ['reviewer', 'observer'] }],
    });
    const token = await t.signIn(email, password);
    const response = await t.get('/api/me').set('Authorization', `Bearer ${token}`).expect(200);
    expect(response.body).toEqual({
      id: user.id,
      email,
      name: user.name,
      isAdmin: false,
      teams: [{ id: team.id, name: team.name, roles: ['observer', 'reviewer'] }],
      noticeOptOuts: [],
    });
  });

  it('GET /api/me lists several teams by name with the roles of each, and none for a user in no team', async () => {
    const suffix = Date.now().toString(36);
    const later = await t.createTeam(`Zenith Occultation Circle ${suffix}`);
    const earlier = await t.createTeam(`Aphelion Timing Club ${suffix}`);
    const member = await t.createUser({
      teams: [
        { team: later, roles: ['observer'] },
        { team: earlier, roles: ['coordinator'] },
      ],
    });
    const token = await t.signIn(member.email, member.password);
    const response = await t.get('/api/me').set('Authorization', `Bearer ${token}`).expect(200);
    expect((response.body as { teams: unknown[] }).teams).toEqual([
      { id: earlier.id, name: earlier.name, roles: ['coordinator'] },
      { id: later.id, name: later.name, roles: ['observer'] },
    ]);

    const loner = await t.createUser();
    const alone = await t
      .get('/api/me')
      .set('Authorization', `Bearer ${await t.signIn(loner.email, loner.password)}`)
      .expect(200);
    expect(alone.body).toMatchObject({ id: loner.user.id, teams: [], noticeOptOuts: [] });
  });

  it('PUT /api/me/notices stores the opt-outs, sorted and without repeats, and answers the me view', async () => {
    const { user, email, password } = await t.createUser();
    const token = await t.signIn(email, password);
    const response = await put('/api/me/notices')
      .set('Authorization', `Bearer ${token}`)
      .send({ optOut: ['review-requested', 'fit-finished', 'review-requested'] })
      .expect(200);
    expect(response.body).toMatchObject({ id: user.id, noticeOptOuts: ['fit-finished', 'review-requested'] });
    const stored = await t.orm.em.fork().findOneOrFail(User, { id: user.id });
    expect(stored.noticeOptOuts).toEqual(['fit-finished', 'review-requested']);

    const session = await t.post('/api/auth/login').send({ email, password }).expect(200);
    expect(session.body.user.noticeOptOuts).toEqual(['fit-finished', 'review-requested']);

    await put('/api/me/notices').set('Authorization', `Bearer ${token}`).send({ optOut: [] }).expect(200);
    expect((await t.orm.em.fork().findOneOrFail(User, { id: user.id })).noticeOptOuts).toEqual([]);
  });

  it('PUT /api/me/notices answers 400 naming the field for an unknown kind or a missing list, and 401 anonymous', async () => {
    const { user, email, password } = await t.createUser();
    const token = await t.signIn(email, password);
    const unknown = await put('/api/me/notices')
      .set('Authorization', `Bearer ${token}`)
      .send({ optOut: ['invitation'] })
      .expect(400);
    expect(unknown.body.issues.map((i: { path: string }) => i.path)).toEqual(['optOut.0']);
    const missing = await put('/api/me/notices').set('Authorization', `Bearer ${token}`).send({}).expect(400);
    expect(missing.body.issues.map((i: { path: string }) => i.path)).toEqual(['optOut']);
    await put('/api/me/notices').send({ optOut: [] }).expect(401);
    expect((await t.orm.em.fork().findOneOrFail(User, { id: user.id })).noticeOptOuts).toEqual([]);
  });

  it('PUT /api/me/notices is honoured: an opted-out kind is not sent, other kinds and other users still are', async () => {
    const optedOut = await t.createUser();
    const other = await t.createUser();
    const token = await t.signIn(optedOut.email, optedOut.password);
    await put('/api/me/notices')
      .set('Authorization', `Bearer ${token}`)
      .send({ optOut: ['review-requested'] })
      .expect(200);
    const notices = t.app.get(NoticesService);
    const notice = (kind: (typeof NOTICE_KINDS)[number], subject: string) => ({
      kind,
      to: [optedOut.user.id, other.user.id],
      subject,
      lines: ['A fit of Quillon awaits your review.'],
      link: { path: '/events', label: 'Open the events' },
    });
    expect(await notices.deliver(notice('review-requested', 'Review requested: Quillon'))).toBe(1);
    expect(await notices.deliver(notice('review-decided', 'Fit approved: Quillon'))).toBe(2);

    const toOther = await t.mailAbout(other.email, 'Review requested: Quillon');
    expect(toOther.kind).toBe('review-requested');
    const decided = await t.mailAbout(optedOut.email, 'Fit approved: Quillon');
    expect(decided.kind).toBe('review-decided');
    const mine = await t.mailTo(optedOut.email, 0);
    expect(mine.map((m) => m.subject)).toEqual(['Fit approved: Quillon']);
  });
});
