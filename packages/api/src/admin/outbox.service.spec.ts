import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { UnavailableError } from '../common/domain-errors';
import { loadConfig } from '../config/app-config';
import { OutboxService } from './outbox.service';

/** A stand-in mail catcher answering GET /messages with a fixed document. */
async function catcherAnswering(document: unknown): Promise<{ server: Server; url: string }> {
  const server = createServer((_req, res) => {
    res.writeHead(200, { 'content-type': 'application/json' });
    res.end(JSON.stringify(document));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

const outboxReading = (url: string) =>
  new OutboxService(loadConfig({ LIMBUS_DEMO: '1', MAIL_CATCHER_URL: url }));

const message = (id: string, date: string) => ({
  id,
  from: 'Limbus <no-reply@limbus.invalid>',
  to: ['observer@example.org'],
  subject: `Message ${id}`,
  text: 'Hello',
  html: '<p>Hello</p>',
  date,
});

describe('OutboxService', () => {
  const servers: Server[] = [];
  afterEach(async () => {
    await Promise.all(servers.splice(0).map((s) => new Promise((resolve) => s.close(resolve))));
  });

  it('messages() answers newest first, keeping each kind', async () => {
    const { server, url } = await catcherAnswering([
      { ...message('a', '2026-12-01T10:00:00.000Z'), kind: 'invitation' },
      { ...message('b', '2026-12-01T11:00:00.000Z'), kind: null },
    ]);
    servers.push(server);
    const messages = await outboxReading(url).messages();
    expect(messages.map((m) => [m.id, m.kind])).toEqual([
      ['b', null],
      ['a', 'invitation'],
    ]);
  });

  it('messages() reads a catcher that predates kinds, giving kind null', async () => {
    const { server, url } = await catcherAnswering([message('old', '2026-01-02T03:04:05.000Z')]);
    servers.push(server);
    expect(await outboxReading(url).messages()).toEqual([
      { ...message('old', '2026-01-02T03:04:05.000Z'), kind: null },
    ]);
  });

  it('messages() answers 503 for a document that is not a message list', async () => {
    const { server, url } = await catcherAnswering({ messages: [] });
    servers.push(server);
    await expect(outboxReading(url).messages()).rejects.toBeInstanceOf(UnavailableError);
  });
});
