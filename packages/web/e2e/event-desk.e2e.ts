import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { apiSession, baseUrl, openBrowser, signIn, unexpectedFailures, type BrowserSession } from './browser';

// The event desk against the real API and worker. The flows share one event: the demo event when the
// seed has one, else the invented example event file imported by the coordinator.
const PASSWORD = 'limbus-demo';
const EXAMPLE_EVENT = resolve(
  dirname(fileURLToPath(import.meta.url)),
  '../../../docs/examples/event-example.json',
);
const OBSERVER_STATION = `e2e-observer-${Date.now().toString(36)}`;
const REVIEW_MESSAGE = 'Clock offsets left free; please look at the limb residuals.';

// Opening a desk URL directly reloads the app, which keeps its access token only in memory; the client
// sees the session cookie and refreshes before its first request, so no 401 is expected anywhere.

let eventId = '';
let watchFromUtc = '';
let watchToUtc = '';
let disappearanceUtc = '';
let reappearanceUtc = '';
let tooEarlyUtc = '';
let chordCount = 0;
let fitId = '';
let session: BrowserSession | null = null;

beforeAll(async () => {
  const coordinator = await apiSession('coordinator@example.org', PASSWORD);
  const me = await coordinator.call<{ teams: Array<{ id: string }> }>('GET', '/api/me');
  const teamId = me.teams[0]?.id ?? '';
  const events = await coordinator.call<{ items: Array<{ id: string; teamId: string }> }>(
    'GET',
    `/api/events?teamId=${teamId}&sort=created-desc&pageSize=100`,
  );
  eventId = events.items.find((e) => e.teamId === teamId)?.id ?? '';
  if (eventId === '') {
    const form = new FormData();
    form.append('file', new Blob([readFileSync(EXAMPLE_EVENT)], { type: 'application/json' }), 'event.json');
    form.append('teamId', teamId);
    form.append('bodyName', 'Quillon');
    eventId = (await coordinator.call<{ id: string }>('POST', '/api/events/import', form)).id;
  }
  // The observer reports only for a station they observe from; give them one of their own.
  const members = await coordinator.call<Array<{ userId: string; email: string }>>(
    'GET',
    `/api/teams/${teamId}/members`,
  );
  const observerId = members.find((m) => m.email === 'observer@example.org')?.userId;
  // Near the event's own stations and inside its own night, so the accepted report is a plausible chord
  // and later fits of the same event stay sound.
  const detail = await coordinator.call<{ stations: Array<{ latDeg: number; lonDeg: number }> }>(
    'GET',
    `/api/events/${eventId}`,
  );
  const near = detail.stations[0] ?? { latDeg: -30.25, lonDeg: -70.5 };
  await coordinator.call('POST', `/api/events/${eventId}/stations`, {
    code: OBSERVER_STATION,
    latDeg: Math.max(-89, Math.min(89, near.latDeg + 0.35)),
    lonDeg: near.lonDeg > 179 ? near.lonDeg - 0.35 : near.lonDeg + 0.35,
    heightM: 210,
    observerId,
  });
  const chords = await coordinator.call<
    Array<{
      disappearance: { time: string } | null;
      reappearance: { time: string } | null;
      start: string | null;
      end: string | null;
    }>
  >('GET', `/api/events/${eventId}/chords`);
  chordCount = chords.length;
  const timesMs = chords
    .flatMap((c) => [c.disappearance?.time, c.reappearance?.time, c.start, c.end])
    .filter((t): t is string => typeof t === 'string')
    .map((t) => Date.parse(t));
  const iso = (ms: number) => new Date(ms).toISOString().replace('.000Z', 'Z');
  watchFromUtc = iso(Math.min(...timesMs) - 120_000);
  watchToUtc = iso(Math.max(...timesMs) + 120_000);
  disappearanceUtc = iso(Math.min(...timesMs) + 5_000);
  reappearanceUtc = iso(Math.min(...timesMs) + 15_000);
  tooEarlyUtc = iso(Math.min(...timesMs) - 5_000);
}, 60_000);

afterEach(async () => {
  await session?.close();
  session = null;
});

async function openDesk(email: string, query: string): Promise<BrowserSession> {
  session = await openBrowser();
  await signIn(session.page, email, PASSWORD);
  await session.page.waitForURL(`${baseUrl()}/events`);
  await session.page.goto(`${baseUrl()}/events/${eventId}${query}`);
  await session.page.getByRole('tablist', { name: 'Event sections' }).waitFor();
  return session;
}

describe('event desk in the browser', () => {
  it('a modeller opens the event, runs a fit, sees progress reach solved and the parameters, and asks for review', async () => {
    session = await openBrowser();
    const s = session;
    const { page } = s;
    await signIn(page, 'modeller@example.org', PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.locator(`a[href="/events/${eventId}"]`).click();
    await page.getByRole('tablist', { name: 'Event sections' }).waitFor();
    await page.getByRole('grid', { name: 'Chord table' }).waitFor();
    await expect(page.locator('[data-chord-row]').count()).resolves.toBe(chordCount);
    await s.screenshot('event-desk-chords');

    await page.getByRole('tab', { name: 'Fits' }).click();
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.waitForURL(/[?&]fit=/);
    fitId = new URL(page.url()).searchParams.get('fit') ?? '';
    expect(fitId).not.toBe('');
    // The bar shows while the worker runs; a fast solve may finish before it is drawn.
    const table = page.getByRole('table', { name: 'Limb parameters' });
    await table.waitFor({ timeout: 120_000 });
    // Each value is rounded by its σ (two significant digits of the σ), so the decimals vary.
    await expect(
      table.getByRole('row').filter({ hasText: 'Equatorial radius' }).textContent(),
    ).resolves.toMatch(/\d+(\.\d+)? ± \d+(\.\d+)?\s*km/);
    await expect(page.getByText(/degrees of freedom/).count()).resolves.toBeGreaterThan(0);
    await s.screenshot('event-desk-fit');

    await page.getByRole('tab', { name: 'Sky plane' }).click();
    const plot = page.getByRole('img', { name: /^Sky-plane plot/ });
    await plot.waitFor();
    await expect(plot.locator('[data-chord]').count()).resolves.toBe(chordCount);
    await s.screenshot('event-desk-sky-plane');

    await page.getByRole('tab', { name: 'Review' }).click();
    await page.getByRole('table', { name: 'Numbers of the fit under review' }).waitFor();
    await page.getByRole('button', { name: 'Request review' }).click();
    const request = page.getByRole('dialog', { name: /^Ask for a review of the fit of / });
    await request.getByRole('textbox', { name: /Message to the reviewers/ }).fill(REVIEW_MESSAGE);
    await request.getByRole('button', { name: 'Send request' }).click();
    await page.getByText('Waiting for a reviewer.').waitFor();
    await expect(page.getByRole('list', { name: 'Review history' }).textContent()).resolves.toContain(
      'asked for review of the fit of',
    );
    expect(s.consoleErrors).toEqual([]);
    expect(unexpectedFailures(s.failedResponses, [])).toEqual([]);
  }, 180_000);

  it('a reviewer approves the fit and it shows as frozen', async () => {
    expect(fitId).not.toBe('');
    const s = await openDesk('reviewer@example.org', `?section=review&fit=${fitId}`);
    const { page } = s;
    await page.getByRole('heading', { name: /^Under review: the fit of / }).waitFor();
    await expect(page.getByRole('list', { name: 'Review history' }).textContent()).resolves.toContain(
      `“${REVIEW_MESSAGE}”`,
    );
    // Nothing is chosen for the reviewer: the decision is theirs to make.
    await expect(page.getByRole('radio', { name: 'Approve (freezes the fit)' }).isChecked()).resolves.toBe(
      false,
    );
    await page.getByRole('radio', { name: 'Approve (freezes the fit)' }).check();
    await page.getByRole('button', { name: 'Approve fit' }).click();
    await page.getByText('The fit is frozen: its options and solution no longer change.').waitFor();
    await expect(page.getByRole('list', { name: 'Review history' }).textContent()).resolves.toMatch(
      /approved/,
    );
    await page.getByRole('tab', { name: 'Fits' }).click();
    await page.getByText('Approved and frozen').waitFor();
    await s.screenshot('event-desk-review');
    expect(s.consoleErrors).toEqual([]);
    expect(unexpectedFailures(s.failedResponses, [])).toEqual([]);
  }, 90_000);

  it("an author downloads the approved fit's figure and table, the very files the API serves", async () => {
    expect(fitId).not.toBe('');
    const s = await openDesk('modeller@example.org', `?section=figures&fit=${fitId}`);
    const { page } = s;
    const api = await apiSession('modeller@example.org', PASSWORD);
    const [figure, served] = await Promise.all([
      page.waitForEvent('download'),
      page.waitForResponse((r) => r.url().includes(`/api/fits/${fitId}/figure?`)),
      page.getByRole('button', { name: 'Download fit figure' }).click(),
    ]);
    expect(figure.suggestedFilename()).toMatch(/-sky-plane-180mm\.pdf$/);
    const downloaded = readFileSync(await figure.path());
    expect(downloaded.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const direct = await fetch(served.url(), { headers: { Authorization: `Bearer ${api.token}` } });
    expect(Buffer.from(await direct.arrayBuffer()).equals(downloaded)).toBe(true);
    const [table] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download fit table as LaTeX' }).click(),
    ]);
    expect(table.suggestedFilename()).toMatch(/-parameters\.tex$/);
    expect(readFileSync(await table.path(), 'utf8')).toContain(fitId);
    await s.screenshot('event-desk-figures');
    expect(s.consoleErrors).toEqual([]);
    expect(unexpectedFailures(s.failedResponses, [])).toEqual([]);
  }, 90_000);

  it('an observer submits a report for their own station and a coordinator accepts it', async () => {
    const observer = await openDesk('observer@example.org', '?section=stations');
    await observer.page.getByRole('button', { name: 'New report' }).click();
    const form = observer.page.getByRole('form', { name: 'Observer report' });
    await form.getByRole('combobox', { name: 'Station' }).selectOption({ label: OBSERVER_STATION });
    await form.getByRole('radio', { name: /^Negative/ }).check();
    await form.getByRole('textbox', { name: 'Watched from (UTC)' }).fill(watchFromUtc);
    await form.getByRole('textbox', { name: 'Watched to (UTC)' }).fill(watchToUtc);
    await form.getByLabel(/^Light curve file/).setInputFiles({
      name: `${OBSERVER_STATION}.csv`,
      mimeType: 'text/csv',
      // UTC mid-exposure times, as the upload check and the timing job require (docs/file-formats.md).
      buffer: Buffer.from(
        [
          'time,flux',
          ...[1.0, 0.99, 1.01, 0.98, 1.0, 1.02, 0.99, 1.0].map(
            (flux, k) =>
              `${new Date(Date.UTC(2028, 2, 14, 2, 0, 0) + 40 * k).toISOString()},${flux.toFixed(2)}`,
          ),
        ].join('\n'),
      ),
    });
    await form.getByRole('button', { name: 'Submit report' }).click();
    // The form closes only once the light curve is stored too.
    await form.waitFor({ state: 'detached' });
    await observer.page.getByRole('cell', { name: OBSERVER_STATION }).first().waitFor();
    await observer.screenshot('event-desk-observer-report');
    expect(observer.consoleErrors).toEqual([]);
    await observer.close();
    session = null;

    const coordinator = await openDesk('coordinator@example.org', '?section=stations');
    const { page } = coordinator;
    const row = page.getByRole('row').filter({ hasText: OBSERVER_STATION }).filter({ hasText: 'negative' });
    await row.getByRole('button', { name: /^Accept report of/ }).click();
    await row.getByText('accepted').waitFor();
    await coordinator.screenshot('event-desk-reports');

    // The accepted report changed the event's chords: the approved fit now rests on older data, and the
    // desk says so where the fit is exported and in the list of fits.
    await page.getByRole('tab', { name: 'Figures' }).click();
    await page.getByText('Based on older data').waitFor();
    await page.getByRole('tab', { name: 'Fits' }).click();
    await page.getByRole('table', { name: 'Fits' }).getByText('based on older data').first().waitFor();

    // The coordinator's audit log tells the story, newest first.
    await page.getByRole('tab', { name: 'Audit' }).click();
    const log = page.getByRole('table', { name: 'Audit log' });
    await log.waitFor();
    const logText = (await log.textContent()) ?? '';
    expect(logText).toContain('accepted a report');
    expect(logText).toContain('approved a fit');
    expect(logText.indexOf('accepted a report')).toBeLessThan(logText.indexOf('approved a fit'));
    await coordinator.screenshot('event-desk-audit');
    expect(coordinator.consoleErrors).toEqual([]);
    expect(unexpectedFailures(coordinator.failedResponses, [])).toEqual([]);
  }, 120_000);

  it('a CSV import with a bad row shows the row error and writes nothing', async () => {
    const s = await openDesk('coordinator@example.org', '?section=chords');
    const { page } = s;
    await page.getByRole('grid', { name: 'Chord table' }).waitFor();
    const before = await page.locator('[data-chord-row]').count();
    await page.getByRole('button', { name: 'Import CSV…' }).click();
    const csv = [
      'station,type,disappearance_utc,disappearance_sigma_s,reappearance_utc,reappearance_sigma_s',
      `${OBSERVER_STATION},positive,${disappearanceUtc},0.05,${reappearanceUtc},0.05`,
      `${OBSERVER_STATION},positive,${disappearanceUtc},0.05,${tooEarlyUtc},0.05`,
    ].join('\n');
    await page
      .getByLabel('CSV file')
      .setInputFiles({ name: 'chords.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    const problems = page.getByRole('list', { name: 'Row problems' });
    await problems.waitFor();
    await expect(problems.textContent()).resolves.toMatch(/Row 3/);
    await expect(page.getByRole('button', { name: 'Import', exact: true }).isDisabled()).resolves.toBe(true);
    await s.screenshot('event-desk-csv-error');
    await page.getByRole('button', { name: 'Cancel' }).click();
    await page.reload();
    await page.getByRole('grid', { name: 'Chord table' }).waitFor();
    await expect(page.locator('[data-chord-row]').count()).resolves.toBe(before);
    expect(s.consoleErrors).toEqual([]);
    // The preview's 400 is the expected answer to a bad file.
    expect(
      unexpectedFailures(s.failedResponses, [{ status: 400, path: `/api/events/${eventId}/chords/import` }]),
    ).toEqual([]);
  }, 90_000);

  it('importing an event file with mistakes lists each problem by its JSON path and creates nothing', async () => {
    session = await openBrowser();
    const { page } = session;
    await signIn(page, 'coordinator@example.org', PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.locator(`a[href="/events/${eventId}"]`).waitFor();
    const before = await page.locator('a[href^="/events/"]').count();
    await page.getByRole('button', { name: 'New event…' }).click();
    const example = JSON.parse(readFileSync(EXAMPLE_EVENT, 'utf8')) as { earthRotation?: unknown };
    const broken = { ...example, earthRotation: { dut1Seconds: 1.5 } };
    await page.getByLabel('Event file (limbus-event/1 JSON)').setInputFiles({
      name: 'broken-event.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify(broken)),
    });
    // Other tests may have given the team more bodies; the event is for the demo's.
    await page
      .getByRole('form', { name: 'Import an event file' })
      .getByRole('combobox', { name: 'Body' })
      .selectOption({ label: 'Quillon (2027 QL88)' });
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    const problems = page.getByRole('list', { name: 'Problems in the event file' });
    await problems.waitFor();
    await expect(problems.textContent()).resolves.toMatch(/earthRotation\.dut1Seconds/);
    await session.screenshot('event-desk-import-error');
    await page.reload();
    await page.locator(`a[href="/events/${eventId}"]`).waitFor();
    await expect(page.locator('a[href^="/events/"]').count()).resolves.toBe(before);
    expect(session.consoleErrors).toEqual([]);
    expect(
      unexpectedFailures(session.failedResponses, [{ status: 400, path: '/api/events/import' }]),
    ).toEqual([]);
  }, 60_000);

  it('the event desk works in a narrow window', async () => {
    session = await openBrowser({ width: 420, height: 860 });
    await signIn(session.page, 'modeller@example.org', PASSWORD);
    await session.page.waitForURL(`${baseUrl()}/events`);
    await session.page.goto(`${baseUrl()}/events/${eventId}?section=fits`);
    await session.page.getByRole('button', { name: 'Run fit' }).waitFor();
    // Eight section tabs do not fit 420 px: the tab list says it scrolls.
    await session.page
      .getByRole('region', { name: 'Section tabs' })
      .locator('xpath=..')
      .getByText('Scroll sideways for more →')
      .waitFor();
    await session.screenshot('event-desk-narrow');
    expect(session.consoleErrors).toEqual([]);
  }, 60_000);
});
