import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const SCREENSHOT_DIR = resolve(
  dirname(fileURLToPath(import.meta.url)),
  '../../../artifacts/screenshots',
);

export function baseUrl(): string {
  const url = process.env.LIMBUS_BASE_URL;
  if (url === undefined || url === '') {
    throw new Error(
      'LIMBUS_BASE_URL is not set: point it at a running Limbus stack seeded with the demo users',
    );
  }
  return url.replace(/\/$/, '');
}

export interface FailedResponse {
  status: number;
  method: string;
  path: string;
}

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** Console errors and uncaught page errors, apart from chromium's echo of non-2xx responses. */
  consoleErrors: string[];
  /** Every response with status >= 400; tests say which of them they expected. */
  failedResponses: FailedResponse[];
  screenshot(name: string): Promise<void>;
  close(): Promise<void>;
}

// Chromium logs every 4xx/5xx fetch as a console error. Those are checked through failedResponses, where a
// test can tell an expected 401 (wrong password) from a real failure.
const RESOURCE_ECHO = /^Failed to load resource: the server responded with a status of \d{3}/;

export async function openBrowser(viewport = { width: 1280, height: 800 }): Promise<BrowserSession> {
  const profileDir = mkdtempSync(join(tmpdir(), 'limbus-e2e-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleErrors: string[] = [];
  const failedResponses: FailedResponse[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error' && !RESOURCE_ECHO.test(message.text())) consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(`uncaught: ${error.message}`));
  page.on('response', (response) => {
    if (response.status() >= 400) {
      failedResponses.push({
        status: response.status(),
        method: response.request().method(),
        path: new URL(response.url()).pathname,
      });
    }
  });
  return {
    context,
    page,
    consoleErrors,
    failedResponses,
    async screenshot(name) {
      mkdirSync(SCREENSHOT_DIR, { recursive: true });
      await page.screenshot({ path: join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
    },
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/** Responses a signed-out or not-yet-built path legitimately answers with; anything else is a failure. */
export function unexpectedFailures(
  failed: FailedResponse[],
  expected: Array<{ status: number; path: string }>,
): FailedResponse[] {
  return failed.filter((f) => !expected.some((e) => e.status === f.status && e.path === f.path));
}

export async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in over HTTP (not through the page) and returns the access token, for setting up a test. */
export async function apiToken(email: string, password: string): Promise<string> {
  const response = await fetch(`${baseUrl()}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  if (!response.ok)
    throw new Error(`sign-in of ${email} failed: ${response.status} ${await response.text()}`);
  const body = (await response.json()) as { accessToken: string };
  return body.accessToken;
}

export interface ApiSession {
  token: string;
  /** One API call with this session's token: JSON in and out, or a FormData upload; throws on non-2xx. */
  call<T>(method: string, path: string, body?: unknown): Promise<T>;
}

/** Signs in over HTTP and returns a session for setting up a test through the API. */
export async function apiSession(email: string, password: string): Promise<ApiSession> {
  const token = await apiToken(email, password);
  return {
    token,
    async call<T>(method: string, path: string, body?: unknown): Promise<T> {
      const isForm = body instanceof FormData;
      const res = await fetch(`${baseUrl()}${path}`, {
        method,
        headers: {
          Authorization: `Bearer ${token}`,
          ...(body === undefined || isForm ? {} : { 'Content-Type': 'application/json' }),
        },
        body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      });
      if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
      return (res.status === 204 ? undefined : await res.json()) as T;
    },
  };
}

export async function apiJson<T>(
  token: string,
  path: string,
  init: { method?: string; body?: unknown } = {},
): Promise<T> {
  const response = await fetch(`${baseUrl()}${path}`, {
    method: init.method ?? 'GET',
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (!response.ok)
    throw new Error(`${init.method ?? 'GET'} ${path} failed: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}

/**
 * The newest link to a client route (e.g. "/invitations/") in an e-mail to the address, read through the
 * admin outbox. Mail goes out through the queue, so it polls for a while.
 */
export async function linkFromOutbox(adminToken: string, to: string, routePrefix: string): Promise<string> {
  const pattern = new RegExp(`https?://[^\\s"'<>]*${routePrefix.replace(/\//g, '\\/')}[^\\s"'<>]+`);
  for (let attempt = 0; attempt < 40; attempt++) {
    const messages = await apiJson<Array<{ to: string[]; text: string; html: string; date: string }>>(
      adminToken,
      '/api/admin/outbox',
    );
    // Newest first by date: a resent invitation's old link is dead.
    const newestFirst = [...messages].sort((a, b) => Date.parse(b.date) - Date.parse(a.date));
    for (const message of newestFirst) {
      if (!message.to.includes(to)) continue;
      const found = pattern.exec(`${message.text} ${message.html}`);
      if (found !== null) return found[0];
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`no e-mail to ${to} with a ${routePrefix} link reached the outbox`);
}
