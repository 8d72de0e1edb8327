import { readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import {
  apiJson,
  apiToken,
  baseUrl,
  openBrowser,
  signIn,
  unexpectedFailures,
  type BrowserSession,
} from './browser';

// The team's whole loop, each step in the browser as the person whose job it is, with no API call to set
// anything up: a coordinator makes a body and its event and invites an observer; the observer joins from the
// e-mailed link, gets a station, and sends a light curve without times; the coordinator times it and
// accepts the timing into the chord; a modeller fits; a reviewer finds the fit in their queue and approves
// it; the e-mailed link of the approval opens the fit. The API is read only to check what the pages did.
const PASSWORD = 'limbus-demo';
const RUN = Date.now().toString(36);
const BODY = `Loop body ${RUN}`;
const OBSERVER_EMAIL = `loop-observer-${RUN}@example.org`;
const OBSERVER_NAME = `Loop Observer ${RUN}`;
const OBSERVER_PASSWORD = 'loop-observer-password';
const EXAMPLE_EVENT = resolve(
  dirname(fileURLToPath(import.meta.url)),
  '../../../docs/examples/event-example.json',
);
const STATION = 'amberfield';

interface ExampleChord {
  station: string;
  type: string;
  disappearance?: { time: string; sigmaSeconds: number };
  reappearance?: { time: string; sigmaSeconds: number };
}

const example = JSON.parse(readFileSync(EXAMPLE_EVENT, 'utf8')) as { title: string; chords: ExampleChord[] };
const amberfield = example.chords.find((c) => c.station === STATION);
const D_MS = Date.parse(amberfield?.disappearance?.time ?? '');
const R_MS = Date.parse(amberfield?.reappearance?.time ?? '');

/**
 * The light curve the observer sends: the star gone between the example's D and R of this station, sampled
 * every 0.1 s from 12 s before to 12 s after, with a small alternating ripple. Made here, independently of
 * the geometry package, so the timing is checked against how the curve was made.
 */
function squareWellCsv(): string {
  const rows = ['time,flux'];
  const start = D_MS - 12_000;
  const count = Math.round((R_MS - D_MS + 24_000) / 100);
  for (let k = 0; k < count; k++) {
    const t0 = start + k * 100 - 50;
    const t1 = t0 + 100;
    const hidden = Math.max(0, Math.min(t1, R_MS) - Math.max(t0, D_MS)) / 100;
    rows.push(
      `${new Date(start + k * 100).toISOString()},${(1 - hidden + (k % 2 === 0 ? 0.01 : -0.01)).toFixed(4)}`,
    );
  }
  return `${rows.join('\n')}\n`;
}

const sessions: BrowserSession[] = [];
async function browserAs(email: string, password = PASSWORD): Promise<BrowserSession> {
  const session = await openBrowser();
  sessions.push(session);
  await signIn(session.page, email, password);
  await session.page.waitForURL(`${baseUrl()}/events`);
  return session;
}

/** No console error and no refused request, except those a step expects (matched by status and path). */
function clean(session: BrowserSession, expected: Array<{ status: number; path: RegExp }> = []): void {
  expect(session.consoleErrors).toEqual([]);
  const failed = session.failedResponses.filter(
    (f) => !expected.some((e) => e.status === f.status && e.path.test(f.path)),
  );
  expect(unexpectedFailures(failed, [])).toEqual([]);
}

/** Finds this run's event through the list's search, however many events the team has by now. */
async function openEventFromList(page: Page): Promise<void> {
  await page.getByRole('searchbox', { name: 'Search title or body' }).fill(`loop ${RUN}`);
  await page.getByRole('button', { name: 'Search', exact: true }).click();
  await page.getByRole('link', { name: eventTitle }).click();
}

async function openSection(page: Page, name: string): Promise<void> {
  await page.getByRole('tab', { name }).click();
}

let eventId = '';
let eventTitle = '';
let fitId = '';

afterAll(async () => {
  for (const session of sessions) await session.close();
});

describe('the team loop in the browser', () => {
  it('a coordinator makes a body, imports its event into it and invites an observer by e-mail', async () => {
    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bodies' }).click();
    await page.getByRole('textbox', { name: 'Name' }).fill(BODY);
    await page.getByRole('textbox', { name: 'Designation' }).fill(`${RUN} L1`);
    await page.getByRole('button', { name: 'Add body' }).click();
    await page
      .getByRole('table', { name: /^Bodies of / })
      .getByRole('link', { name: BODY })
      .waitFor();

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Events' }).click();
    await page.getByRole('button', { name: 'New event…' }).click();
    const importForm = page.getByRole('form', { name: 'Import an event file' });
    const file = join(tmpdir(), `loop-event-${RUN}.json`);
    eventTitle = `${example.title} — loop ${RUN}`;
    writeFileSync(file, JSON.stringify({ ...example, title: eventTitle }));
    await importForm.getByLabel(/^Event file/).setInputFiles(file);
    await importForm.getByRole('combobox', { name: 'Body' }).selectOption({ label: `${BODY} (${RUN} L1)` });
    await importForm.getByRole('button', { name: 'Import' }).click();
    await page.waitForURL(/\/events\/[^/?]+/);
    eventId = new URL(page.url()).pathname.split('/')[2] ?? '';
    await page.getByRole('link', { name: new RegExp(`^${BODY}`) }).waitFor();
    await s.screenshot('loop-event-imported');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
    await page.getByRole('textbox', { name: 'E-mail' }).fill(OBSERVER_EMAIL);
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page
      .getByRole('table', { name: 'Pending invitations' })
      .getByRole('row')
      .filter({ hasText: OBSERVER_EMAIL })
      .waitFor();
    clean(s);
  }, 120_000);

  it('the invited observer joins through the link the admin finds in the outbox', async () => {
    const admin = await browserAs('admin@example.org');
    await admin.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
    await admin.page.getByRole('searchbox', { name: 'Recipient' }).fill(OBSERVER_EMAIL);
    const row = admin.page
      .getByRole('table', { name: 'Captured e-mails' })
      .getByRole('row')
      .filter({ hasText: OBSERVER_EMAIL })
      .first();
    await row.getByRole('button', { name: /^Show body of/ }).click();
    const link = admin.page.getByRole('link', { name: /\/invitations\// }).first();
    // Links into the client are drawn as client routes; the e-mail itself holds the absolute one.
    const href = new URL((await link.getAttribute('href')) ?? '', baseUrl()).toString();
    expect(href).toMatch(/\/invitations\/[A-Za-z0-9_-]+$/);
    await admin.screenshot('loop-outbox-invitation');
    clean(admin);

    const observer = await openBrowser();
    sessions.push(observer);
    await observer.page.goto(href);
    await observer.page.getByRole('textbox', { name: 'Your name' }).fill(OBSERVER_NAME);
    await observer.page.getByLabel('Password').fill(OBSERVER_PASSWORD);
    await observer.page.getByRole('button', { name: /^Join / }).click();
    await observer.page.waitForURL(`${baseUrl()}/events`);
    await observer.page.getByRole('banner').getByText(OBSERVER_NAME, { exact: true }).waitFor();
    clean(observer);
  }, 120_000);

  it('the coordinator assigns the new observer a station of the event', async () => {
    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await page.goto(`${baseUrl()}/events/${eventId}?section=stations`);
    await page.getByRole('button', { name: `Edit station ${STATION}` }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('combobox', { name: 'Observer' }).selectOption({ label: OBSERVER_NAME });
    await dialog.getByRole('button', { name: /^Save/ }).click();
    await dialog.waitFor({ state: 'detached' });
    await page
      .getByRole('table', { name: 'Stations' })
      .getByRole('row')
      .filter({ hasText: STATION })
      .filter({ hasText: OBSERVER_NAME })
      .waitFor();
    clean(s);
  }, 60_000);

  it('the observer sends a light curve without typed times', async () => {
    const s = await browserAs(OBSERVER_EMAIL, OBSERVER_PASSWORD);
    const { page } = s;
    await openEventFromList(page);
    await openSection(page, 'Stations & reports');
    await page
      .getByRole('table', { name: 'Stations' })
      .getByRole('row')
      .filter({ hasText: STATION })
      .waitFor();
    await page.getByRole('button', { name: 'New report' }).click();
    const form = page.getByRole('form', { name: 'Observer report' });
    await form.getByRole('radio', { name: /^Positive/ }).check();
    await form.getByRole('radio', { name: 'to be timed from my light curve' }).check();
    const csv = join(tmpdir(), `${STATION}-${RUN}.csv`);
    writeFileSync(csv, squareWellCsv());
    await form.getByLabel(/^Light curve file/).setInputFiles(csv);
    await form.getByRole('button', { name: 'Submit report' }).click();
    const mine = page.getByRole('article', { name: `Your report for ${STATION}` });
    await mine.waitFor();
    await mine.getByRole('img', { name: /^Light curve of/ }).waitFor();
    await s.screenshot('loop-light-curve-sent');
    clean(s);
  }, 60_000);

  it('the coordinator times the light curve and accepts the timing into the chord', async () => {
    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await page.goto(`${baseUrl()}/events/${eventId}?section=light-curves`);
    const form = page.getByRole('form', { name: 'Time this light curve' });
    await form.waitFor();
    // Speed and distance come from the event's geometry; this station has no exposure on record.
    const speed = form.getByRole('textbox', { name: 'Shadow speed (km/s)' });
    await expect.poll(() => speed.inputValue(), { timeout: 10_000 }).not.toBe('');
    await form.getByRole('textbox', { name: 'Exposure (s)' }).fill('0.1');
    await form.getByRole('button', { name: 'Time light curve' }).click();
    const times = page.getByRole('table', { name: 'Fitted times' });
    await times.waitFor({ timeout: 60_000 });
    const disappearance =
      (await times.getByRole('row').filter({ hasText: 'Disappearance' }).textContent()) ?? '';
    const fitted = /(\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d+)Z/.exec(disappearance)?.[1] ?? '';
    // The well was made from the example's own D of this station. The timing models diffraction: at the
    // event's 6e9 km the Fresnel scale √(λD/2) is about 1.2 km for λ = 0.5 µm, some 50 ms of shadow motion
    // at 24 km/s, so a sharp-edged well's edge may be placed up to that far off (common practice, no source).
    expect(Math.abs(Date.parse(`${fitted}Z`) - D_MS)).toBeLessThan(50);
    await page.getByRole('button', { name: 'Accept timing into chord' }).click();
    await page.getByText('Accepted into the chord.').waitFor();
    await openSection(page, 'Chords');
    const row = page.locator('[data-chord-row]').filter({ hasText: STATION });
    await expect(row.textContent()).resolves.toContain('light-curve timing');
    await openSection(page, 'Stations & reports');
    await page
      .getByRole('table', { name: 'Reports' })
      .getByRole('row')
      .filter({ hasText: STATION })
      .filter({ hasText: 'accepted' })
      .waitFor();
    await s.screenshot('loop-timing-accepted');
    clean(s);
  }, 120_000);

  it('an accept that would replace the timed chord asks first, and keeping it changes nothing', async () => {
    const observer = await browserAs(OBSERVER_EMAIL, OBSERVER_PASSWORD);
    await observer.page.goto(`${baseUrl()}/events/${eventId}?section=stations`);
    const mine = observer.page.getByRole('article', { name: `Your report for ${STATION}` });
    await mine.getByRole('button', { name: 'Ask to correct' }).click();
    const correction = observer.page.getByRole('form', { name: 'Correction request' });
    await correction.getByRole('radio', { name: 'typed below' }).check();
    await correction
      .getByRole('textbox', { name: 'Disappearance (UTC)' })
      .fill(amberfield?.disappearance?.time ?? '');
    await correction.getByRole('textbox', { name: 'Disappearance σ (s)' }).fill('0.5');
    await correction
      .getByRole('textbox', { name: 'Reappearance (UTC)' })
      .fill(amberfield?.reappearance?.time ?? '');
    await correction.getByRole('textbox', { name: 'Reappearance σ (s)' }).fill('0.5');
    await correction
      .getByRole('textbox', { name: 'Message to the coordinator' })
      .fill('My own stopwatch times, to compare.');
    await correction.getByRole('button', { name: 'Send the correction request' }).click();
    await mine
      .getByText(/pending/)
      .first()
      .waitFor();
    clean(observer);

    const coordinator = await browserAs('coordinator@example.org');
    const { page } = coordinator;
    await page.goto(`${baseUrl()}/events/${eventId}?section=stations`);
    const waiting = page.getByRole('region', { name: 'Corrections waiting for a decision' });
    await waiting.getByRole('button', { name: `Accept correction of ${OBSERVER_NAME}` }).click();
    const dialog = page.getByRole('alertdialog', { name: `Replace the better-timed chord of ${STATION}?` });
    await dialog.waitFor();
    await expect(dialog.textContent()).resolves.toContain('± 0.5 s');
    await coordinator.screenshot('loop-replace-asks-first');
    await dialog.getByRole('button', { name: 'Keep the current times' }).click();
    await dialog.waitFor({ state: 'detached' });
    await waiting.getByRole('button', { name: `Reject correction of ${OBSERVER_NAME}` }).click();
    await waiting
      .getByRole('textbox', { name: `Reason for rejecting the correction of ${OBSERVER_NAME}` })
      .fill('The timed light curve is better than the typed times.');
    await waiting.getByRole('button', { name: 'Send rejection' }).click();
    await openSection(page, 'Chords');
    await expect(
      page.locator('[data-chord-row]').filter({ hasText: STATION }).textContent(),
    ).resolves.toContain('light-curve timing');
    // The one refusal of this step is the question itself: 409 replaces-better-timing.
    clean(coordinator, [{ status: 409, path: /^\/api\/reports\/[^/]+\/corrections\/[^/]+\/accept$/ }]);
  }, 120_000);

  it('a modeller fits the event and asks for review', async () => {
    const s = await browserAs('modeller@example.org');
    const { page } = s;
    await openEventFromList(page);
    await openSection(page, 'Fits');
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.waitForURL(/[?&]fit=/);
    fitId = new URL(page.url()).searchParams.get('fit') ?? '';
    await page.getByRole('table', { name: 'Limb parameters' }).waitFor({ timeout: 120_000 });
    await openSection(page, 'Review');
    await page.getByRole('button', { name: 'Request review' }).click();
    const request = page.getByRole('dialog', { name: /^Ask for a review of the fit of / });
    await request
      .getByRole('textbox', { name: /Message to the reviewers/ })
      .fill('Amberfield now from its light curve.');
    await request.getByRole('button', { name: 'Send request' }).click();
    await page.getByText('Waiting for a reviewer.').waitFor();
    clean(s);
  }, 180_000);

  it('a reviewer finds the fit in their queue and approves it', async () => {
    const s = await browserAs('reviewer@example.org');
    const { page } = s;
    await page.getByRole('switch', { name: 'Awaiting my review' }).click();
    await page.waitForURL(/[?&]awaiting=true/);
    await page.getByRole('link', { name: eventTitle }).click();
    await openSection(page, 'Review');
    await page.getByRole('heading', { name: /^Under review: the fit of / }).waitFor();
    await expect(page.getByRole('list', { name: 'Review history' }).textContent()).resolves.toContain(
      'Amberfield now from its light curve.',
    );
    await page.getByRole('radio', { name: 'Approve (freezes the fit)' }).check();
    await page.getByRole('button', { name: 'Approve fit' }).click();
    await page.getByText('The fit is frozen: its options and solution no longer change.').waitFor();
    await s.screenshot('loop-approved');
    clean(s);
  }, 90_000);

  it('the link of the approval e-mail opens the fit', async () => {
    const admin = await browserAs('admin@example.org');
    await admin.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
    await admin.page.getByRole('searchbox', { name: 'Recipient' }).fill('modeller@example.org');
    await admin.page.getByRole('combobox', { name: 'Kind' }).selectOption('review-decided');
    const row = admin.page
      .getByRole('table', { name: 'Captured e-mails' })
      .getByRole('row')
      .filter({ hasText: `Fit approved: ${eventTitle}` })
      .first();
    await row.getByRole('button', { name: /^Show body of/ }).click();
    const link = admin.page.getByRole('link', { name: new RegExp(`/events/${eventId}/fits/${fitId}`) });
    const href = new URL((await link.getAttribute('href')) ?? '', baseUrl()).toString();
    clean(admin);

    const modeller = await browserAs('modeller@example.org');
    await modeller.page.goto(href);
    await modeller.page.waitForURL(new RegExp(`/events/${eventId}\\?section=fits&fit=${fitId}`));
    await modeller.page.getByText('Approved and frozen').waitFor();
    await modeller.page.getByRole('table', { name: 'Limb parameters' }).waitFor();
    await modeller.screenshot('loop-fit-link');
    clean(modeller);
  }, 90_000);

  it("the body's comparison holds its own fit only, and fits of two bodies are refused together", async () => {
    const s = await browserAs('modeller@example.org');
    const { page } = s;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bodies' }).click();
    await page
      .getByRole('table', { name: /^Bodies of / })
      .getByRole('link', { name: BODY })
      .click();
    const table = page.getByRole('table', { name: 'Parameters by event' });
    await table.locator(`[data-fit="${fitId}"]`).waitFor();
    await expect(table.locator('[data-fit]').count()).resolves.toBe(1);
    await s.screenshot('loop-body-page');
    clean(s);

    // The client never offers a mix; the API refuses one sent directly, naming the odd fit.
    const token = await apiToken('modeller@example.org', PASSWORD);
    const me = await apiJson<{ teams: Array<{ id: string }> }>(token, '/api/me');
    const teamId = me.teams[0]?.id ?? '';
    const page1 = await apiJson<{
      items: Array<{ id: string; bodyId: string; latestFit: { id: string } | null }>;
    }>(token, `/api/events?teamId=${teamId}&q=Quillon&fit=approved`);
    const quillonFit = page1.items.find((e) => e.latestFit !== null)?.latestFit?.id ?? '';
    expect(quillonFit).not.toBe('');
    const refused = await fetch(`${baseUrl()}/api/teams/${teamId}/joint-poles`, {
      method: 'POST',
      headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
      body: JSON.stringify({ fitIds: [fitId, quillonFit] }),
    });
    expect(refused.status).toBe(400);
    const body = (await refused.json()) as { issues: Array<{ path: string; message: string }> };
    expect(body.issues[0]?.path).toBe('fitIds.1');
    expect(body.issues[0]?.message).toMatch(/fits of different bodies cannot be combined/);
  }, 90_000);
});
