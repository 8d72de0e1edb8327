import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiSession, baseUrl, openBrowser, signIn, unexpectedFailures, type BrowserSession } from './browser';

// The light-curve view against the real API and worker, on an event of its own (the invented example
// event, imported here and deleted at the end) so that the chord it accepts touches no other test's event.
const PASSWORD = 'limbus-demo';
const EXAMPLE_EVENT = resolve(
  dirname(fileURLToPath(import.meta.url)),
  '../../../docs/examples/event-example.json',
);
const STATION = `lc-${Date.now().toString(36)}`;

// A geometric square well, 02:14:02.0–02:14:18.0 UTC, sampled every 0.1 s with a small alternating ripple:
// independent of the geometry package, so the fitted times are checked against how the curve was made.
function squareWellCsv(): string {
  const rows = ['time,flux'];
  const origin = Date.UTC(2028, 2, 14, 2, 13, 50);
  for (let k = 0; k < 400; k++) {
    const t = k * 0.1;
    const inside = Math.max(0, Math.min(t + 0.05, 28) - Math.max(t - 0.05, 12)) / 0.1;
    rows.push(
      `${new Date(origin + k * 100).toISOString()},${(1 - inside + (k % 2 === 0 ? 0.01 : -0.01)).toFixed(4)}`,
    );
  }
  return rows.join('\n') + '\n';
}

async function api(email: string) {
  return (await apiSession(email, PASSWORD)).call;
}

let eventId = '';
let stationId = '';
let coordinator: Awaited<ReturnType<typeof api>>;
let session: BrowserSession | null = null;

beforeAll(async () => {
  coordinator = await api('coordinator@example.org');
  const me = await coordinator<{ teams: Array<{ id: string }> }>('GET', '/api/me');
  const teamId = me.teams[0]?.id ?? '';
  const form = new FormData();
  form.append('file', new Blob([readFileSync(EXAMPLE_EVENT)], { type: 'application/json' }), 'event.json');
  form.append('teamId', teamId);
  form.append('bodyName', 'Quillon');
  eventId = (await coordinator<{ id: string }>('POST', '/api/events/import', form)).id;
  const members = await coordinator<Array<{ userId: string; email: string }>>(
    'GET',
    `/api/teams/${teamId}/members`,
  );
  const observerId = members.find((m) => m.email === 'observer@example.org')?.userId;
  stationId = (
    await coordinator<{ id: string }>('POST', `/api/events/${eventId}/stations`, {
      code: STATION,
      latDeg: -31.5,
      lonDeg: -69.25,
      heightM: 1800,
      observerId,
    })
  ).id;
  const observer = await api('observer@example.org');
  const report = await observer<{ id: string }>('POST', `/api/events/${eventId}/reports`, {
    stationId,
    result: 'positive',
    disappearance: { time: '2028-03-14T02:14:02.1Z', sigmaSeconds: 0.2 },
    reappearance: { time: '2028-03-14T02:14:17.9Z', sigmaSeconds: 0.2 },
  });
  const upload = new FormData();
  upload.append('file', new Blob([squareWellCsv()], { type: 'text/csv' }), `${STATION}.csv`);
  await observer('POST', `/api/reports/${report.id}/light-curve`, upload);
}, 90_000);

afterAll(async () => {
  await session?.close();
  if (eventId !== '') await coordinator('DELETE', `/api/events/${eventId}`);
});

describe('light-curve view in the browser', () => {
  it('a modeller times an uploaded light curve, sees the fit drawn and accepts it into the chord', async () => {
    session = await openBrowser();
    const { page } = session;
    await signIn(page, 'modeller@example.org', PASSWORD);
    await page.waitForURL(`${baseUrl()}/events`);
    await page.goto(`${baseUrl()}/events/${eventId}?section=light-curves`);
    const form = page.getByRole('form', { name: 'Time this light curve' });
    await form.waitFor();
    await form.getByRole('textbox', { name: 'Shadow speed (km/s)' }).fill('20');
    await form.getByRole('textbox', { name: 'Distance (km)' }).fill('1e6');
    await form.getByRole('textbox', { name: 'Exposure (s)' }).fill('0.1');
    await form.getByRole('button', { name: 'Time light curve' }).click();
    const plot = page.getByRole('img', { name: new RegExp(`^Light curve of ${STATION}: 400 samples`) });
    await plot.waitFor({ timeout: 60_000 });
    await session.screenshot('light-curve-view');
    const times = page.getByRole('table', { name: 'Fitted times' });
    const disappearance =
      (await times.getByRole('row').filter({ hasText: 'Disappearance' }).textContent()) ?? '';
    const fitted = /2028-03-14T02:14:(\d+\.\d+)Z/.exec(disappearance)?.[1];
    // The well starts at 02:14:02.0. At 1e6 km the Fresnel scale is 18 m (1 ms of shadow motion), so
    // the diffraction model agrees with the geometric well; 0.01 s is a tenth of a sample.
    expect(Math.abs(Number(fitted) - 2.0)).toBeLessThan(0.01);

    await page.getByRole('button', { name: 'Zoom to D' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: 'Accept timing into chord' }).click();
    await page.getByText('Accepted into the chord.').waitFor();
    const chords = await coordinator<Array<{ station: string; disappearance?: { time: string } | null }>>(
      'GET',
      `/api/events/${eventId}/chords`,
    );
    const chord = chords.find((c) => c.station === STATION);
    expect(chord?.disappearance?.time).toBe(`2028-03-14T02:14:${fitted}Z`);
    expect(session.consoleErrors).toEqual([]);
    expect(unexpectedFailures(session.failedResponses, [])).toEqual([]);
  });
});
