import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, openBrowser, signIn, unexpectedFailures, type BrowserSession } from './browser';

// The demo users the seed creates in demo mode (shared runtime contract).
const DEMO_PASSWORD = 'limbus-demo';
const DEMO_USERS = [
  { role: 'admin', email: 'admin@example.org', name: 'Mara Quell', roles: 'site admin, coordinator' },
  { role: 'coordinator', email: 'coordinator@example.org', name: 'Tomas Reyne', roles: 'coordinator' },
  { role: 'observer', email: 'observer@example.org', name: 'Ilse Darrow', roles: 'observer' },
  { role: 'modeller', email: 'modeller@example.org', name: 'Noor Calder', roles: 'modeller' },
  { role: 'reviewer', email: 'reviewer@example.org', name: 'Piet Ansel', roles: 'reviewer' },
] as const;

// Nothing is refused on these pages: a signed-out page sends no request that needs a session (the client
// sees no session cookie), and a reload refreshes before it asks for anything.
const TOLERATED: Array<{ status: number; path: string }> = [];

let session: BrowserSession;

beforeAll(async () => {
  session = await openBrowser();
});

afterAll(async () => {
  await session.close();
});

afterEach(async () => {
  expect(session.consoleErrors).toEqual([]);
  await session.context.clearCookies();
  session.failedResponses.length = 0;
});

describe('sign-in in the browser', () => {
  for (const user of DEMO_USERS) {
    it(`signIn() as the demo ${user.role} shows ${user.name} and their roles in the header`, async () => {
      const { page } = session;
      await signIn(page, user.email, DEMO_PASSWORD);
      await page.waitForURL(`${baseUrl()}/events`);
      const banner = page.getByRole('banner');
      // waitFor fails the test on timeout: the header appears only once /api/me has answered.
      await banner.getByText(user.name, { exact: true }).waitFor({ timeout: 10_000 });
      await banner.getByText(user.roles, { exact: true }).waitFor({ timeout: 10_000 });
      await page.getByText('No events yet').or(page.getByRole('table')).first().waitFor();
      await session.screenshot(`events-${user.role}`);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(`${baseUrl()}/sign-in`);
      expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
    });
  }

  it('signIn() with a wrong password shows the error and stays on /sign-in', async () => {
    const { page } = session;
    await signIn(page, 'reviewer@example.org', 'certainly-not-the-password');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toContain('Wrong e-mail or password');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await session.screenshot('sign-in-wrong-password');
    expect(
      unexpectedFailures(session.failedResponses, [...TOLERATED, { status: 401, path: '/api/auth/login' }]),
    ).toEqual([]);
  });

  it('a signed-out visit to /events lands on /sign-in, and after sign-out a reload stays signed out', async () => {
    const { page } = session;
    await page.goto(`${baseUrl()}/events`);
    await page.waitForURL(/\/sign-in\?next=%2Fevents$/);
    await signIn(page, 'observer@example.org', DEMO_PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.reload();
    // The access token lives in memory only; the reload proves the refresh cookie restores the session,
    // refreshed before the first request (no 401 on the way).
    await page.getByRole('banner').getByText('Ilse Darrow', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl()}/sign-in`);
    await page.goto(`${baseUrl()}/events`);
    await page.waitForURL(/\/sign-in/);
    expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
  });

  it('the admin opens the outbox and sees the captured e-mails', async () => {
    const { page } = session;
    // Ask for a reset first so the outbox has at least one message to show.
    await page.goto(`${baseUrl()}/forgot-password`);
    await page.getByRole('textbox', { name: 'E-mail' }).fill('modeller@example.org');
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByRole('status').waitFor();
    await signIn(page, 'admin@example.org', DEMO_PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.waitForURL(`${baseUrl()}/admin/outbox`);
    const table = page.getByRole('table', { name: 'Captured e-mails' });
    // Mail leaves through the queue, so the message may take a moment to reach the catcher.
    for (let attempt = 0; attempt < 20; attempt += 1) {
      if ((await table.getByText('modeller@example.org').count()) > 0) break;
      await page.waitForTimeout(500);
      await page.getByRole('button', { name: 'Refresh' }).click();
    }
    await page.getByRole('searchbox', { name: 'Recipient' }).fill('modeller@example.org');
    await page.getByRole('combobox', { name: 'Kind' }).selectOption('password-reset');
    const row = table.getByRole('row').filter({ hasText: 'modeller@example.org' }).first();
    await row.waitFor();
    await expect(row.textContent()).resolves.toMatch(/password-reset/);
    await expect(row.textContent()).resolves.toMatch(/\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC/);
    await row.getByRole('button', { name: /^Show body of/ }).click();
    // The reset link in the plain-text body is a real link into the app.
    await page
      .getByRole('link', { name: /\/reset-password\// })
      .first()
      .waitFor();
    await session.screenshot('admin-outbox');
    expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
  });

  it('the sign-in page works at a narrow width', async () => {
    const narrow = await openBrowser({ width: 390, height: 800 });
    try {
      await signIn(narrow.page, 'coordinator@example.org', DEMO_PASSWORD);
      await narrow.page.waitForURL(`${baseUrl()}/events`);
      await narrow.page.getByRole('button', { name: 'Sign out' }).waitFor();
      await narrow.screenshot('events-narrow');
      expect(narrow.consoleErrors).toEqual([]);
    } finally {
      await narrow.close();
    }
  });
});
