import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, openBrowser, signIn, unexpectedFailures, type BrowserSession } from './browser';

const TOLERATED = [{ status: 404, path: '/api/events' }];
const CHORDS = 200;
const RUNS = 5;

let session: BrowserSession;

beforeAll(async () => {
  session = await openBrowser();
  await signIn(session.page, 'modeller@example.org', 'limbus-demo');
  await session.page.waitForURL(`${baseUrl()}/events`);
});

afterAll(async () => {
  await session.close();
});

describe('plots in the browser', () => {
  it('the plot preview draws the sky-plane and residuals plots from a lazy chunk without console errors', async () => {
    const { page } = session;
    await page.getByRole('link', { name: 'Plot preview' }).click();
    const sky = page.getByRole('img', { name: /^Sky-plane plot: 6 positive and 1 negative chords/ });
    await sky.waitFor();
    await expect(sky.locator('[data-chord]').count()).resolves.toBe(7);
    await page.getByRole('img', { name: /^Residuals plot/ }).waitFor();
    await page.locator('[data-chord]').first().focus();
    await expect(page.getByRole('status').textContent()).resolves.toMatch(/Residual \(disappearance\)/);
    await session.screenshot('plots-preview');
    expect(session.consoleErrors).toEqual([]);
    expect(unexpectedFailures(session.failedResponses, TOLERATED)).toEqual([]);
  });

  it(`the sky-plane plot with ${CHORDS} chords is drawn within a second of navigating to it`, async () => {
    const { page } = session;
    await page.goto(`${baseUrl()}/plots/preview?chords=${CHORDS}`);
    await page
      .locator('[data-chord]')
      .nth(CHORDS - 1)
      .waitFor();
    const timesMs: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      timesMs.push(
        await page.evaluate(async (count) => {
          // Client-side navigation through the router (it listens to popstate), chunks already cached:
          // leave the preview, then time React render + D3 draw of a fresh plot up to the next frame.
          const go = (url: string) => {
            window.history.pushState({}, '', url);
            window.dispatchEvent(new PopStateEvent('popstate'));
          };
          const until = (ready: () => boolean) =>
            new Promise<void>((done) => {
              const check = () => (ready() ? done() : requestAnimationFrame(check));
              check();
            });
          const plotChords = () =>
            document
              .querySelector('[role="img"][aria-label^="Sky-plane plot"]')
              ?.querySelectorAll('[data-chord]').length ?? 0;
          go('/events');
          await until(() => plotChords() === 0);
          const start = performance.now();
          go(`/plots/preview?chords=${count}`);
          await until(() => plotChords() >= count);
          await new Promise((frame) => requestAnimationFrame(frame));
          return performance.now() - start;
        }, CHORDS),
      );
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;
    console.log(
      `plot render in chromium, ${CHORDS} chords: median ${median(timesMs).toFixed(0)} ms (runs: ${timesMs.map((t) => t.toFixed(0)).join(', ')})`,
    );
    await session.screenshot(`plots-preview-${CHORDS}`);
    expect(median(timesMs)).toBeLessThan(1000);
    expect(session.consoleErrors).toEqual([]);
  });
});
