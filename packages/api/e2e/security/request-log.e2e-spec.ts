import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

/**
 * The API logs pino JSON lines to standard output through sonic-boom, which writes with `fs.write` on
 * file descriptor 1. Those writes are captured here (and kept off the test's own output), so the test
 * reads exactly the lines an operator's log would get.
 */
const logLines: string[] = [];
type WriteCallback = (error: NodeJS.ErrnoException | null, written: number) => void;
const realWrite = fs.write.bind(fs) as (...args: unknown[]) => void;

describe('the request log', () => {
  let t: TestApp;
  beforeAll(async () => {
    vi.spyOn(fs, 'write').mockImplementation(((fd: number, data: unknown, ...rest: unknown[]) => {
      if (fd !== 1) return realWrite(fd, data, ...rest);
      const text = typeof data === 'string' ? data : Buffer.from(data as Uint8Array).toString('utf8');
      logLines.push(...text.split('\n').filter((line) => line !== ''));
      const callback = rest.at(-1) as WriteCallback;
      process.nextTick(() => callback(null, Buffer.byteLength(text)));
    }) as typeof fs.write);
    t = await bootTestApp({ LOG_LEVEL: 'info' });
  });
  afterAll(async () => {
    await t.close();
    vi.restoreAllMocks();
  });

  /** The logged URLs of requests, waiting up to 5 s for one that contains `marker`. */
  async function loggedUrls(marker: string): Promise<string[]> {
    const deadline = Date.now() + 5000;
    for (;;) {
      const urls = logLines
        .map((line) => JSON.parse(line) as { req?: { url?: string } })
        .map((entry) => entry.req?.url)
        .filter((url): url is string => url !== undefined);
      if (urls.some((url) => url.includes(marker)) || Date.now() > deadline) return urls;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
  }

  it('GET …/events?ticket= and ?access_token=: the request log keeps the route but not the values', async () => {
    const fitId = randomUUID();
    const ticket = `ticket-${randomUUID()}`;
    const accessToken = `eyJhbGciOiJIUzI1NiJ9.${randomUUID()}.signature`;
    await t.get(`/api/fits/${fitId}/events?ticket=${ticket}`).expect(401);
    await t.get(`/api/fits/${fitId}/events?access_token=${accessToken}&ticket=${ticket}`).expect(401);
    await t.get(`/api/me?access_token=${accessToken}`).expect(401);

    const urls = await loggedUrls('/api/me?');
    expect(urls).toEqual(
      expect.arrayContaining([
        `/api/fits/${fitId}/events?ticket=[redacted]`,
        `/api/fits/${fitId}/events?access_token=[redacted]&ticket=[redacted]`,
        '/api/me?access_token=[redacted]',
      ]),
    );
    const everything = logLines.join('\n');
    expect(everything).not.toContain(ticket);
    expect(everything).not.toContain(accessToken);
  });

  it('GET /api/invitations/:token: the request log does not keep the invitation token', async () => {
    const token = `invitation-${randomUUID()}`;
    await t.get(`/api/invitations/${token}`).expect(404);
    await t.post(`/api/invitations/${token}/accept`).send({ password: 'some-long-password' }).expect(404);
    const urls = await loggedUrls('/accept');
    expect(urls).toEqual(
      expect.arrayContaining(['/api/invitations/[redacted]', '/api/invitations/[redacted]/accept']),
    );
    expect(logLines.join('\n')).not.toContain(token);
  });
});
