import { readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { apiSession, baseUrl, openBrowser, signIn, unexpectedFailures, type BrowserSession } from './browser';

// Planning an event in the browser, each step as the person whose job it is: the demo event's shadow path
// on its map; then, on an event of its own (the demo event's file under a new title and a new body, so no
// other test's data is touched), a coordinator sets the prediction in Setup, makes a placement suggestion
// a planned station, gives it an observer and sends the briefing, which the admin finds in the outbox and
// the observer reads on the event's page. The API is read only, to learn a name and to check the outbox.
const PASSWORD = 'limbus-demo';
const RUN = Date.now().toString(36);
const BODY = `Path body ${RUN}`;
const DEMO_EVENT = resolve(dirname(fileURLToPath(import.meta.url)), '../../api/src/demo/quillon-event.json');
const demo = JSON.parse(readFileSync(DEMO_EVENT, 'utf8')) as {
  title: string;
  stations: Array<{ id: string }>;
};
const EVENT_TITLE = `${demo.title} — path ${RUN}`;
/** The body's radius for this test's prediction: the demo body's equivalent radius (invented, ~365 km). */
const BODY_RADIUS_KM = '365';

const sessions: BrowserSession[] = [];
async function browserAs(email: string): Promise<BrowserSession> {
  const session = await openBrowser();
  sessions.push(session);
  await signIn(session.page, email, PASSWORD);
  await session.page.waitForURL(`${baseUrl()}/events`);
  return session;
}

/** No console error and no refused request. */
function clean(session: BrowserSession): void {
  expect(session.consoleErrors).toEqual([]);
  expect(unexpectedFailures(session.failedResponses, [])).toEqual([]);
}

/** Finds an event through the list's search, however many events the team has by now. */
async function openEventFromList(page: Page, search: string, title: string): Promise<void> {
  await page.getByRole('searchbox', { name: 'Search title or body' }).fill(search);
  await page.getByRole('button', { name: 'Search', exact: true }).click();
  await page.getByRole('link', { name: title, exact: true }).click();
  await page.waitForURL(/\/events\/[^/?]+/);
}

function shadowPathMap(page: Page) {
  return page.getByRole('img', { name: /^Shadow path map / });
}

let eventId = '';
let plannedCode = '';
let observerName = '';

afterAll(async () => {
  for (const session of sessions) await session.close();
});

describe('the shadow path in the browser', () => {
  it('the demo event’s map shows the central line, both limits and its stations', async () => {
    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await openEventFromList(page, 'demo scenario', demo.title);
    await page.getByRole('tab', { name: 'Shadow path' }).click();
    const map = shadowPathMap(page);
    await map.waitFor({ timeout: 60_000 });
    for (const line of ['central', 'left', 'right'])
      expect(await map.locator(`[data-path-line="${line}"]`).count()).toBeGreaterThan(0);
    expect(await map.locator('[data-path-line="central"]').first().getAttribute('d')).toMatch(/^M/);
    for (const station of demo.stations) await map.locator(`[data-station="${station.id}"]`).waitFor();
    // The buttons move the view, for anyone without a mouse.
    const layer = map.locator('g.zoom-layer');
    const before = await layer.getAttribute('transform');
    await page.getByRole('group', { name: 'Map view' }).getByRole('button', { name: 'Zoom in' }).click();
    expect(await layer.getAttribute('transform')).not.toBe(before);
    await page.getByRole('img', { name: /^Coverage on the sky plane/ }).waitFor();
    await page.getByRole('table', { name: 'Predicted chords' }).waitFor();
    await s.screenshot('shadow-path-demo-map');
    clean(s);
  }, 120_000);

  it('a coordinator predicts a new event and makes a placement suggestion a planned station on the map', async () => {
    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bodies' }).click();
    await page.getByRole('textbox', { name: 'Name' }).fill(BODY);
    await page.getByRole('button', { name: 'Add body' }).click();
    await page
      .getByRole('table', { name: /^Bodies of / })
      .getByRole('link', { name: BODY })
      .waitFor();

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Events' }).click();
    await page.getByRole('button', { name: 'New event…' }).click();
    const importForm = page.getByRole('form', { name: 'Import an event file' });
    const file = join(tmpdir(), `path-event-${RUN}.json`);
    writeFileSync(
      file,
      JSON.stringify({ ...JSON.parse(readFileSync(DEMO_EVENT, 'utf8')), title: EVENT_TITLE }),
    );
    await importForm.getByLabel(/^Event file/).setInputFiles(file);
    await importForm.getByRole('combobox', { name: 'Body' }).selectOption({ label: BODY });
    await importForm.getByRole('button', { name: 'Import' }).click();
    await page.waitForURL(/\/events\/[^/?]+/);
    eventId = new URL(page.url()).pathname.split('/')[2] ?? '';

    await page.getByRole('tab', { name: 'Setup' }).click();
    const settings = page.getByRole('form', { name: 'Prediction settings' });
    await settings.getByRole('textbox', { name: /^Body radius \(km\)/ }).fill(BODY_RADIUS_KM);
    await settings.getByRole('textbox', { name: /^1σ of the offset, Δα·cos δ/ }).fill('8');
    await settings.getByRole('textbox', { name: /^1σ of the offset, Δδ/ }).fill('12');
    await settings.getByRole('button', { name: 'Save prediction settings' }).click();
    await settings.getByText('Prediction settings saved.').waitFor();

    await page.getByRole('tab', { name: 'Shadow path' }).click();
    const map = shadowPathMap(page);
    await map.waitFor({ timeout: 60_000 });
    await map.locator('[data-path-line="central"]').first().waitFor();

    const placement = page.getByRole('form', { name: 'Suggest sites' });
    await placement.getByRole('textbox', { name: /^How many more sites/ }).fill('2');
    await placement.getByRole('button', { name: 'Suggest sites' }).click();
    const suggestions = page.getByRole('table', { name: 'Suggested sites' });
    await suggestions.waitFor({ timeout: 60_000 });
    await page.getByText(/Each ground point is at night with the star up/).waitFor();
    const make = suggestions.getByRole('button', { name: /^Make a planned station / }).first();
    plannedCode = ((await make.getAttribute('aria-label')) ?? '').replace('Make a planned station ', '');
    expect(plannedCode).not.toBe('');
    await make.click();
    await suggestions
      .getByRole('status')
      .filter({ hasText: `Planned as ${plannedCode}` })
      .waitFor();
    await map.locator(`[data-station="${plannedCode}"][data-status="planned"]`).waitFor({ timeout: 60_000 });
    await page
      .getByRole('table', { name: 'Predicted chords' })
      .getByRole('row')
      .filter({ hasText: plannedCode })
      .waitFor();
    await s.screenshot('shadow-path-planned-station');
    clean(s);
  }, 180_000);

  it('the coordinator briefs the planned station’s observer, and the e-mail reaches the outbox', async () => {
    const coordinatorApi = await apiSession('coordinator@example.org', PASSWORD);
    const me = await coordinatorApi.call<{ teams: Array<{ id: string }> }>('GET', '/api/me');
    const members = await coordinatorApi.call<Array<{ email: string; name: string }>>(
      'GET',
      `/api/teams/${me.teams[0]?.id ?? ''}/members`,
    );
    observerName = members.find((m) => m.email === 'observer@example.org')?.name ?? '';
    expect(observerName).not.toBe('');

    const s = await browserAs('coordinator@example.org');
    const { page } = s;
    await page.goto(`${baseUrl()}/events/${eventId}?section=stations`);
    await page.getByRole('button', { name: `Edit station ${plannedCode}` }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('combobox', { name: 'Observer' }).selectOption({ label: observerName });
    await dialog.getByRole('button', { name: /^Save/ }).click();
    await dialog.waitFor({ state: 'detached' });

    await page.getByRole('tab', { name: 'Briefing' }).click();
    await page.getByRole('button', { name: 'Send the briefing to every observer' }).click();
    const confirm = page.getByRole('alertdialog', { name: 'Send the briefing to 1 observer?' });
    await confirm.getByRole('button', { name: 'Send to 1 observer' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Briefing sent to ${observerName} (${plannedCode})` })
      .waitFor({ timeout: 60_000 });
    await s.screenshot('shadow-path-briefing-sent');
    clean(s);

    const admin = await browserAs('admin@example.org');
    await admin.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
    await admin.page.getByRole('searchbox', { name: 'Recipient' }).fill('observer@example.org');
    const row = admin.page
      .getByRole('table', { name: 'Captured e-mails' })
      .getByRole('row')
      .filter({ hasText: `Briefing: ${EVENT_TITLE}` })
      .first();
    await row.waitFor({ timeout: 30_000 });
    await row.getByRole('button', { name: /^Show body of/ }).click();
    const link = admin.page
      .getByRole('link', { name: new RegExp(`/events/${eventId}\\?section=briefing`) })
      .first();
    const href = new URL((await link.getAttribute('href')) ?? '', baseUrl()).toString();
    expect(href).toContain(`/events/${eventId}?section=briefing`);
    await admin.screenshot('shadow-path-briefing-outbox');
    clean(admin);

    const observer = await browserAs('observer@example.org');
    await observer.page.goto(href);
    const card = observer.page.getByRole('group', { name: `Briefing for ${plannedCode}` });
    await card.waitFor({ timeout: 60_000 });
    await expect(card.textContent()).resolves.toMatch(/Record from … to \(3σ\)/);
    await observer.page.getByRole('list', { name: 'Safety' }).waitFor();
    await observer.page.getByRole('list', { name: 'About the prediction' }).waitFor();
    await observer.screenshot('shadow-path-observer-briefing');
    clean(observer);
  }, 180_000);
});
