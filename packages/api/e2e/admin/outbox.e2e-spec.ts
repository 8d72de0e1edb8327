import { createTransport } from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NoticesService } from '../../src/mail/notices.service';
import { bootTestApp, type TestApp, uniqueEmail } from '../setup';

interface OutboxRow {
  id: string;
  to: string[];
  subject: string;
  date: string;
  kind: string | null;
}

describe('GET /api/admin/outbox', () => {
  let t: TestApp;
  let adminToken: string;

  beforeAll(async () => {
    t = await bootTestApp();
    const admin = await t.createUser({ isAdmin: true });
    adminToken = await t.signIn(admin.email, admin.password);
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/admin/outbox answers the caught messages newest first, each with its X-Limbus-Kind', async () => {
    const team = await t.createTeam();
    const coordinator = await t.createUser({ teams: [{ team, roles: ['coordinator'] }] });
    const token = await t.signIn(coordinator.email, coordinator.password);

    const invitee = uniqueEmail('outbox-invitee');
    await t
      .post(`/api/teams/${team.id}/invitations`)
      .set('Authorization', `Bearer ${token}`)
      .send({ email: invitee, roles: ['observer'] })
      .expect(201);
    await t.mailTo(invitee);

    await t.post('/api/auth/password-reset').send({ email: coordinator.email }).expect(202);
    await t.mailAbout(coordinator.email, 'Reset your Limbus password');

    const reviewer = await t.createUser();
    await t.app.get(NoticesService).deliver({
      kind: 'review-requested',
      to: [reviewer.user.id],
      subject: 'Review requested: Quillon',
      lines: ['A fit of Quillon awaits your review.'],
      link: { path: '/events', label: 'Open the events' },
    });

    // Mail Limbus did not send (no X-Limbus-Kind header), as a relay might pass on.
    const stranger = uniqueEmail('outbox-stranger');
    const transport = createTransport({ url: t.config.smtpUrl, ignoreTLS: true });
    await transport.sendMail({
      from: 'someone@example.org',
      to: stranger,
      subject: 'Not from Limbus',
      text: 'x',
    });
    transport.close();
    await t.mailTo(stranger);

    const response = await t
      .get('/api/admin/outbox')
      .set('Authorization', `Bearer ${adminToken}`)
      .expect(200);
    const all = response.body as OutboxRow[];
    const mine = all.filter((m) =>
      [invitee, coordinator.email, reviewer.email, stranger].some((address) => m.to.includes(address)),
    );
    expect(mine.map((m) => [m.to[0], m.kind])).toEqual([
      [stranger, null],
      [reviewer.email, 'review-requested'],
      [coordinator.email, 'password-reset'],
      [invitee, 'invitation'],
    ]);
    const dates = all.map((m) => m.date);
    expect([...dates].sort().reverse()).toEqual(dates);
  });
});
