import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createTransport } from 'nodemailer';
import { afterEach, describe, expect, it } from 'vitest';
import { startSmtpCatcher, type CaughtMessage, type SmtpCatcher } from './smtp-catcher-server';

async function send(
  catcher: SmtpCatcher,
  subject: string,
  headers: Record<string, string> = {},
): Promise<void> {
  const transport = createTransport({ url: catcher.smtpUrl, ignoreTLS: true });
  await transport.sendMail({
    headers,
    from: 'Limbus <no-reply@limbus.invalid>',
    to: 'observer@example.org',
    bcc: 'archive@example.org',
    subject,
    text: 'Open http://127.0.0.1:8080/invitations/abc to join.',
    html: '<p>Open <a href="http://127.0.0.1:8080/invitations/abc">the invitation</a>.</p>',
  });
  transport.close();
}

async function fetchMessages(catcher: SmtpCatcher): Promise<CaughtMessage[]> {
  const res = await fetch(`${catcher.httpUrl}/messages`);
  expect(res.status).toBe(200);
  return (await res.json()) as CaughtMessage[];
}

describe('smtp catcher', () => {
  const open: SmtpCatcher[] = [];
  const dirs: string[] = [];
  afterEach(async () => {
    await Promise.all(open.splice(0).map((c) => c.close()));
    await Promise.all(dirs.splice(0).map((d) => rm(d, { recursive: true, force: true })));
  });

  it('startSmtpCatcher() serves a message sent with nodemailer at GET /messages, newest last', async () => {
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0 });
    open.push(catcher);
    await send(catcher, 'First');
    await send(catcher, 'Invitation to Outer Belt Timing Group');

    const messages = await fetchMessages(catcher);
    expect(messages.map((m) => m.subject)).toEqual(['First', 'Invitation to Outer Belt Timing Group']);
    const last = messages[1];
    expect(last?.from).toBe('"Limbus" <no-reply@limbus.invalid>');
    // The envelope recipients include Bcc, which a header-based list would miss.
    expect(last?.to).toEqual(['observer@example.org', 'archive@example.org']);
    expect(last?.text).toContain('/invitations/abc');
    expect(last?.html).toContain('<a href="http://127.0.0.1:8080/invitations/abc">');
    expect(Number.isNaN(Date.parse(last?.date ?? ''))).toBe(false);
    expect(messages[0]?.id).not.toBe(last?.id);
    expect(last?.kind).toBeNull();
  });

  it('startSmtpCatcher() records the X-Limbus-Kind header as the message kind', async () => {
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0 });
    open.push(catcher);
    await send(catcher, 'You are invited', { 'X-Limbus-Kind': 'invitation' });
    await send(catcher, 'Review requested', { 'x-limbus-kind': 'review-requested' });
    expect((await fetchMessages(catcher)).map((m) => m.kind)).toEqual(['invitation', 'review-requested']);
  });

  it('startSmtpCatcher() reads messages stored before it recorded kinds, with kind null', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'limbus-catcher-'));
    dirs.push(dir);
    const old = {
      id: 'b7d1c1de-0000-4000-8000-000000000001',
      from: 'Limbus <no-reply@limbus.invalid>',
      to: ['observer@example.org'],
      subject: 'Stored long ago',
      text: 'Hello',
      html: '',
      date: '2026-01-02T03:04:05.000Z',
    };
    await writeFile(join(dir, 'messages.jsonl'), `${JSON.stringify(old)}\n`);
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0, dir });
    open.push(catcher);
    await send(catcher, 'Sent now', { 'X-Limbus-Kind': 'password-reset' });
    expect(await fetchMessages(catcher)).toEqual([
      { ...old, kind: null },
      expect.objectContaining({ subject: 'Sent now', kind: 'password-reset' }),
    ]);
  });

  it('startSmtpCatcher() empties the list on DELETE /messages', async () => {
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0 });
    open.push(catcher);
    await send(catcher, 'To be cleared');
    const res = await fetch(`${catcher.httpUrl}/messages`, { method: 'DELETE' });
    expect(res.status).toBe(204);
    expect(await fetchMessages(catcher)).toEqual([]);
  });

  it('startSmtpCatcher() reloads messages from CATCHER_DIR after a restart', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'limbus-catcher-'));
    dirs.push(dir);
    const first = await startSmtpCatcher({ smtpPort: 0, httpPort: 0, dir });
    await send(first, 'Kept across restarts');
    await first.close();

    const second = await startSmtpCatcher({ smtpPort: 0, httpPort: 0, dir });
    open.push(second);
    expect((await fetchMessages(second)).map((m) => m.subject)).toEqual(['Kept across restarts']);
  });

  it('startSmtpCatcher() answers 404 outside /messages', async () => {
    const catcher = await startSmtpCatcher({ smtpPort: 0, httpPort: 0 });
    open.push(catcher);
    expect((await fetch(`${catcher.httpUrl}/other`)).status).toBe(404);
  });
});
