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
// Nothing is refused along the way, not even a 401 on a page load.
const TOLERATED: Array<{ status: number; path: string }> = [];

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
  it('a coordinator invites with two roles on the Team page, and the invited person joins through the e-mailed link', async () => {
    const coordinator = await apiToken('coordinator@example.org', DEMO_PASSWORD);
    const me = await apiJson<{ teams: Array<{ id: string; name: string }> }>(coordinator, '/api/me');
    const teamName = me.teams[0]?.name ?? '';
    expect(teamName).not.toBe('');
    const { page } = session;
    await signIn(page, 'coordinator@example.org', DEMO_PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }).click();
    await page.waitForURL(`${baseUrl()}/team`);
    await page.getByRole('table', { name: `Members of ${teamName}` }).waitFor();
    await page.getByRole('textbox', { name: 'E-mail' }).fill(newcomer);
    const roles = page.getByRole('group', { name: 'Roles', exact: true });
    await expect(roles.getByRole('checkbox', { name: 'observer' }).isChecked()).resolves.toBe(true);
    await roles.getByRole('checkbox', { name: 'reviewer' }).check();
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await page
      .getByRole('status')
      .filter({ hasText: `Invitation sent to ${newcomer}` })
      .waitFor();
    const pending = page.getByRole('table', { name: 'Pending invitations' });
    const row = pending.getByRole('row').filter({ hasText: newcomer });
    await row.waitFor();
    await expect(row.textContent()).resolves.toContain('observer, reviewer');
    await session.screenshot('team-invited');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl()}/sign-in`);

    const link = await linkFromOutbox(adminToken, newcomer, '/invitations/');
    await page.goto(`${baseUrl()}${new URL(link).pathname}`);
    await page.getByText(`You are invited to join ${teamName} as observer and reviewer`).waitFor();
    await page.getByRole('textbox', { name: 'Your name' }).fill('Wren Tallis');
    await page.getByLabel('Password').fill('first-password-1');
    await page.getByRole('button', { name: `Join ${teamName}` }).click();
    await page.waitForURL(`${baseUrl()}/events`);
    await page.getByRole('banner').getByText('Wren Tallis', { exact: true }).waitFor();
    await page.getByRole('banner').getByText('observer, reviewer', { exact: true }).waitFor();
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
