import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  apiJson,
  apiToken,
  baseUrl,
  linkFromOutbox,
  openBrowser,
  signIn,
  unexpectedFailures,
  type BrowserSession,
} from './browser';

const DEMO_PASSWORD = 'limbus-demo';
// A fresh address per run, so the test never changes a demo user's password and can run again.
const newcomer = `newcomer-${Date.now()}@example.org`;
const TOLERATED = [{ status: 404, path: '/api/events' }];

let session: BrowserSession;
let adminToken: string;

beforeAll(async () => {
  session = await openBrowser();
  adminToken = await apiToken('admin@example.org', DEMO_PASSWORD);
});

afterAll(async () => {
  await session.close();
});

describe('invitations and password reset in the browser', () => {
  it('an invited person opens the e-mailed link, sets name and password and lands in the team', async () => {
    const coordinator = await apiToken('coordinator@example.org', DEMO_PASSWORD);
    const me = await apiJson<{ teams: Array<{ id: string; name: string }> }>(coordinator, '/api/me');
    const team = me.teams[0];
    expect(team).toBeDefined();
    await apiJson(coordinator, `/api/teams/${team?.id ?? ''}/invitations`, {
      method: 'POST',
      body: { email: newcomer, role: 'observer' },
    });
    const link = await linkFromOutbox(adminToken, newcomer, '/invitations/');
    const { page } = session;
    await page.goto(`${baseUrl()}${new URL(link).pathname}`);
    await page.getByText(`You are invited to join ${team?.name ?? ''} as observer`).waitFor();
    await page.getByRole('textbox', { name: 'Your name' }).fill('Wren Tallis');
    await page.getByLabel('Password').fill('first-password-1');
    await page.getByRole('button', { name: `Join ${team?.name ?? ''}` }).click();
    await page.waitForURL(`${baseUrl()}/events`);
    await page.getByRole('banner').getByText('Wren Tallis', { exact: true }).waitFor();
    await page.getByRole('banner').getByText('observer', { exact: true }).waitFor();
    await session.screenshot('invitation-accepted');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl()}/sign-in`);
    expect(session.consoleErrors).toEqual([]);
    expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
  });

  it('a forgotten password is reset through the e-mailed link and the new one signs in', async () => {
    const { page } = session;
    await page.goto(`${baseUrl()}/forgot-password`);
    await page.getByRole('textbox', { name: 'E-mail' }).fill(newcomer);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByRole('status').waitFor();
    const link = await linkFromOutbox(adminToken, newcomer, '/reset-password/');
    await page.goto(`${baseUrl()}${new URL(link).pathname}`);
    await page.getByLabel(/^New password/).fill('second-password-2');
    await page.getByLabel(/^Repeat the new password/).fill('second-password-2');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('Your password has been changed.').waitFor();
    await session.screenshot('password-reset-done');
    await signIn(page, newcomer, 'second-password-2');
    await page.waitForURL(`${baseUrl()}/events`);
    await page.getByRole('banner').getByText('Wren Tallis', { exact: true }).waitFor();
    expect(session.consoleErrors).toEqual([]);
    expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
  });
});
