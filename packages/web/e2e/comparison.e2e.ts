import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  apiJson,
  apiToken,
  baseUrl,
  openBrowser,
  signIn,
  unexpectedFailures,
  type BrowserSession,
} from './browser';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
// Invented events of one ring seen from two star directions (docs/examples and the CLI's joint fixtures).
const EVENT_FILES = ['docs/examples/event-example.json', 'tools/cli/test/fixtures/joint-2031.json'];

let session: BrowserSession;
let modellerToken = '';
const fitIds: string[] = [];
// A body of this test's own, so that its comparison holds exactly the two fits made here.
const BODY = `Comparison body ${Date.now().toString(36)}`;

async function importEvent(token: string, teamId: string, file: string): Promise<string> {
  const form = new FormData();
  form.append('teamId', teamId);
  form.append('bodyName', BODY);
  form.append(
    'file',
    new Blob([readFileSync(resolve(ROOT, file))], { type: 'application/json' }),
    'event.json',
  );
  const response = await fetch(`${baseUrl()}/api/events/import`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${token}` },
    body: form,
  });
  if (!response.ok) throw new Error(`import of ${file} failed: ${response.status} ${await response.text()}`);
  return ((await response.json()) as { id: string }).id;
}

async function solvedFit(token: string, eventId: string): Promise<string> {
  const { id } = await apiJson<{ id: string }>(token, `/api/events/${eventId}/fits`, {
    method: 'POST',
    body: { options: {} },
  });
  for (let attempt = 0; attempt < 300; attempt++) {
    const { state } = await apiJson<{ state: string }>(token, `/api/fits/${id}`);
    if (state === 'solved') return id;
    if (state === 'failed') throw new Error(`fit ${id} failed`);
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`fit ${id} did not finish`);
}

beforeAll(async () => {
  const coordinator = await apiToken('coordinator@example.org', 'limbus-demo');
  const modeller = await apiToken('modeller@example.org', 'limbus-demo');
  modellerToken = modeller;
  const me = await apiJson<{ teams: Array<{ id: string }> }>(coordinator, '/api/me');
  const teamId = me.teams[0]?.id;
  if (teamId === undefined) throw new Error('the demo coordinator has no team');
  for (const file of EVENT_FILES)
    fitIds.push(await solvedFit(modeller, await importEvent(coordinator, teamId, file)));
  session = await openBrowser();
  await signIn(session.page, 'modeller@example.org', 'limbus-demo');
  await session.page.waitForURL(`${baseUrl()}/events`);
});

afterAll(async () => {
  await session.close();
});

describe('comparison in the browser', () => {
  it("the body page compares its events' fits, shows the pole chart and fits the joint pole of two events", async () => {
    const { page } = session;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bodies' }).click();
    await page.getByRole('link', { name: BODY }).click();
    await page.getByRole('heading', { name: /^Comparison of fits/ }).waitFor();
    // These fits are not reviewed; the comparison shows the latest approved fit of each event unless asked.
    await page.getByRole('radio', { name: 'Every solved fit, approved or not' }).check();
    const table = page.getByRole('table', { name: 'Parameters by event' });
    for (const id of fitIds) await table.locator(`[data-fit="${id}"]`).waitFor();
    await expect(table.locator(`[data-fit="${fitIds[0]}"]`).textContent()).resolves.toMatch(
      /\d+\.\d+ ± \d+\.\d+/,
    );
    await expect(table.locator('[data-fit]').count()).resolves.toBe(2);
    const chart = page.getByRole('img', { name: /^Pole candidates of ring R1/ });
    await chart.waitFor();
    await expect(chart.locator('[data-pole]').count()).resolves.toBeGreaterThanOrEqual(4);
    await page.getByRole('button', { name: 'Fit joint pole of ring R1 (2 events)' }).click();
    const status = page.getByRole('status', { name: 'Joint pole' });
    await status.waitFor({ timeout: 30_000 });
    await expect(status.textContent()).resolves.toMatch(/Joint pole of ring R1: RA \d+\.\d\d° ± \d+\.\d\d°/);
    await chart.locator('[data-role="joint-pole"] ellipse').waitFor();
    // The downloaded figure is the file the API serves for the same request, byte for byte.
    const [download, served] = await Promise.all([
      page.waitForEvent('download'),
      page.waitForResponse((r) => r.url().includes('/comparison/figure?')),
      page.getByRole('button', { name: 'Download comparison figure' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('limbus-comparison-180mm.pdf');
    const downloaded = readFileSync(await download.path());
    expect(downloaded.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const direct = await fetch(served.url(), { headers: { Authorization: `Bearer ${modellerToken}` } });
    expect(Buffer.from(await direct.arrayBuffer()).equals(downloaded)).toBe(true);
    await session.screenshot('comparison');
    expect(session.consoleErrors).toEqual([]);
    expect(unexpectedFailures(session.failedResponses, [])).toEqual([]);
  });
});
