import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ReportsPanel } from './reports-panel';
import { testReport } from './test-report';
import { testLightCurveCsv } from '@/testing/test-light-curve';
import { jsonResponse, renderWithProviders, stubFetch, type RecordedCall } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const STATIONS = [
  { id: 's1', code: 'kestrel-hill' },
  { id: 's2', code: 'brackenmoor' },
];

const TIMED_CHORD = {
  id: 'c1',
  source: 'timing' as const,
  timingId: 'tm1',
  disappearance: { time: '2029-05-17T03:12:31.2140Z', sigmaSeconds: 0.012 },
  reappearance: { time: '2029-05-17T03:12:49.8710Z', sigmaSeconds: 0.015 },
};

const CONFLICT = {
  message: 'Accepting would replace times from a light-curve timing',
  code: 'replaces-better-timing',
  detail: {
    chordId: 'c1',
    station: 'kestrel-hill',
    source: 'timing',
    timingId: 'tm1',
    current: { disappearance: TIMED_CHORD.disappearance, reappearance: TIMED_CHORD.reappearance },
    incoming: {
      disappearance: { time: '2029-05-17T03:12:31.25Z', sigmaSeconds: 0.04 },
      reappearance: { time: '2029-05-17T03:12:49.9Z', sigmaSeconds: 0.05 },
    },
  },
};

const posts = (calls: RecordedCall[]) => calls.filter((c) => c.method === 'POST');

describe('ReportsPanel', () => {
  it('ReportsPanel says where accepted times came from, which reports wait for timing and which ask a correction', async () => {
    stubFetch(() =>
      jsonResponse(200, [
        testReport({ state: 'accepted', chord: TIMED_CHORD }),
        testReport({
          id: 'r2',
          stationId: 's2',
          station: 'brackenmoor',
          authorName: 'Bram Ostley',
          timesFromLightCurve: true,
          disappearance: null,
          reappearance: null,
        }),
        testReport({
          id: 'r3',
          stationId: 's3',
          station: 'fallowmere',
          state: 'accepted',
          chord: { ...TIMED_CHORD, id: 'c3', source: 'report', timingId: null },
          corrections: [
            {
              id: 'k1',
              reportId: 'r3',
              author: { id: 'u2', name: 'Wren Ashby' },
              changes: { notes: 'clock checked against GPS' },
              message: 'I forgot the clock note',
              state: 'pending',
              decidedBy: null,
              reason: null,
              createdAt: '2029-05-18T08:00:00.000Z',
              decidedAt: null,
            },
          ],
        }),
      ]),
    );
    renderWithProviders(<ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={[]} canDecide />);
    const table = await screen.findByRole('table', { name: 'Reports' });
    const row = (station: string) => within(table).getByRole('cell', { name: station }).closest('tr');
    expect(row('kestrel-hill')).toHaveTextContent('accepted — times from a light-curve timing');
    // The timed chord's times, not the report's typed ones, once the curve is timed into the chord.
    expect(row('kestrel-hill')).toHaveTextContent('03:12:31.2140');
    expect(row('kestrel-hill')).not.toHaveTextContent('03:12:31.25 ');
    expect(row('kestrel-hill')).toHaveTextContent('timed from the light curve');
    expect(row('brackenmoor')).toHaveTextContent('waiting for timing');
    expect(row('brackenmoor')).toHaveTextContent('to be timed from the light curve');
    expect(
      within(row('brackenmoor') as HTMLElement).queryByRole('button', {
        name: 'Accept report of Bram Ostley',
      }),
    ).not.toBeInTheDocument();
    expect(row('fallowmere')).toHaveTextContent("accepted — times typed in the observer's report");
    expect(row('fallowmere')).toHaveTextContent('correction requested');
    expect(row('kestrel-hill')).not.toHaveTextContent('correction requested');
  });

  function conflictingApi() {
    return stubFetch((call) => {
      if (call.method === 'GET') return jsonResponse(200, [testReport()]);
      const body = call.body as { replaceTimedChord?: boolean };
      return body.replaceTimedChord
        ? jsonResponse(200, testReport({ state: 'accepted' }))
        : jsonResponse(409, CONFLICT);
    });
  }

  it('ReportsPanel shows both sets of times before an accept replaces better-timed chord values, and Keep sends nothing more', async () => {
    const calls = conflictingApi();
    renderWithProviders(<ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={[]} canDecide />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Accept report of Wren Ashby' }));
    const dialog = await screen.findByRole('alertdialog', {
      name: /Replace the better-timed chord of kestrel-hill/,
    });
    expect(dialog).toHaveTextContent('holds times from a light-curve timing');
    const times = within(dialog).getByRole('table', { name: 'Times of the chord of kestrel-hill' });
    const d = within(times).getByRole('cell', { name: 'Disappearance (D)' }).closest('tr');
    expect(d).toHaveTextContent('2029-05-17 03:12:31.2140 UTC ± 0.012 s');
    expect(d).toHaveTextContent('2029-05-17 03:12:31.25 UTC ± 0.04 s');
    const r = within(times).getByRole('cell', { name: 'Reappearance (R)' }).closest('tr');
    expect(r).toHaveTextContent('2029-05-17 03:12:49.8710 UTC ± 0.015 s');
    expect(r).toHaveTextContent('2029-05-17 03:12:49.9 UTC ± 0.05 s');
    await user.click(within(dialog).getByRole('button', { name: 'Keep the current times' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(await screen.findByRole('button', { name: 'Accept report of Wren Ashby' })).toBeEnabled();
    expect(posts(calls).map((c) => c.body)).toEqual([{ replaceTimedChord: false }]);
  });

  it('ReportsPanel repeats the accept with replaceTimedChord when the coordinator chooses Replace', async () => {
    const calls = conflictingApi();
    renderWithProviders(<ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={[]} canDecide />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Accept report of Wren Ashby' }));
    const dialog = await screen.findByRole('alertdialog');
    await user.click(within(dialog).getByRole('button', { name: 'Replace' }));
    await waitFor(() => expect(posts(calls)).toHaveLength(2));
    expect(posts(calls).map((c) => [c.url, c.body])).toEqual([
      ['/api/reports/r1/accept', { replaceTimedChord: false }],
      ['/api/reports/r1/accept', { replaceTimedChord: true }],
    ]);
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
  });

  it("ReportsPanel shows the observer's own report: the raw light curve, the timing in the chord and where the chord's times came from", async () => {
    const report = testReport({
      state: 'accepted',
      timesFromLightCurve: true,
      disappearance: null,
      reappearance: null,
      lightCurve: { id: 'f1', name: 'kestrel-hill.csv', sizeBytes: 6000, sha256: 'ab'.repeat(32) },
      chord: TIMED_CHORD,
      latestTiming: {
        id: 'tm1',
        state: 'solved',
        disappearance: TIMED_CHORD.disappearance,
        reappearance: TIMED_CHORD.reappearance,
        inChord: true,
        finishedAt: '2029-05-18T10:00:02.000Z',
      },
    });
    const calls = stubFetch((call) =>
      call.url === '/api/reports/r1/light-curve'
        ? new Response(testLightCurveCsv(), { status: 200, headers: { 'Content-Type': 'text/csv' } })
        : jsonResponse(200, [report]),
    );
    renderWithProviders(
      <ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={['s1']} canDecide={false} />,
    );
    const own = await screen.findByRole('article', { name: 'Your report for kestrel-hill' });
    expect(
      await within(own).findByRole('img', {
        name: /^Light curve of kestrel-hill: 200 samples, disappearance at 2029-05-17T03:12:31.2140Z/,
      }),
    ).toBeInTheDocument();
    expect(own).toHaveTextContent('Timed on 2029-05-18 10:00:02 UTC: in the chord');
    expect(own).toHaveTextContent('The chord now holds these times, from a light-curve timing:');
    expect(own).toHaveTextContent('R 2029-05-17 03:12:49.8710 UTC ± 0.015 s');
    expect(calls.map((c) => c.url)).toContain('/api/reports/r1/light-curve');
  });

  it('ReportsPanel lets the observer ask to correct an accepted report with the changed fields and a message', async () => {
    const calls = stubFetch((call) =>
      call.method === 'POST'
        ? jsonResponse(201, {})
        : jsonResponse(200, [
            testReport({ state: 'accepted', chord: { ...TIMED_CHORD, source: 'report', timingId: null } }),
          ]),
    );
    renderWithProviders(
      <ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={['s1']} canDecide={false} />,
    );
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Ask to correct' }));
    const form = screen.getByRole('form', { name: 'Correction request' });
    await user.click(within(form).getByRole('button', { name: 'Send the correction request' }));
    expect(await within(form).findByText('say what is wrong with the accepted report')).toBeInTheDocument();
    const sigma = within(form).getByRole('textbox', { name: /^Reappearance σ/ });
    await user.clear(sigma);
    await user.type(sigma, '0.08');
    await user.click(within(form).getByRole('textbox', { name: /^Message to the coordinator/ }));
    await user.paste('The reappearance σ was underestimated; the camera dropped two frames.');
    await user.click(within(form).getByRole('button', { name: 'Send the correction request' }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]?.url).toBe('/api/reports/r1/corrections');
    expect(posts(calls)[0]?.body).toEqual({
      changes: { reappearance: { time: '2029-05-17T03:12:49.9Z', sigmaSeconds: 0.08 } },
      message: 'The reappearance σ was underestimated; the camera dropped two frames.',
    });
  });

  it('ReportsPanel shows a coordinator the proposed change beside the current value, and accepts it', async () => {
    const report = testReport({
      state: 'accepted',
      corrections: [
        {
          id: 'k1',
          reportId: 'r1',
          author: { id: 'u2', name: 'Wren Ashby' },
          changes: { reappearance: { time: '2029-05-17T03:12:49.9Z', sigmaSeconds: 0.08 } },
          message: 'Two frames were dropped.',
          state: 'pending',
          decidedBy: null,
          reason: null,
          createdAt: '2029-05-18T08:00:00.000Z',
          decidedAt: null,
        },
      ],
    });
    const calls = stubFetch((call) =>
      call.method === 'POST' ? jsonResponse(200, report) : jsonResponse(200, [report]),
    );
    renderWithProviders(<ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={[]} canDecide />);
    const waiting = await screen.findByRole('region', { name: 'Corrections waiting for a decision' });
    const changes = within(waiting).getByRole('table', {
      name: 'Changes asked for the report for kestrel-hill',
    });
    const row = within(changes).getByRole('cell', { name: 'Reappearance (UTC, 1σ)' }).closest('tr');
    expect(row).toHaveTextContent('2029-05-17 03:12:49.9 UTC ± 0.05 s');
    expect(row).toHaveTextContent('2029-05-17 03:12:49.9 UTC ± 0.08 s');
    expect(waiting).toHaveTextContent('Two frames were dropped.');
    const user = userEvent.setup();
    await user.click(within(waiting).getByRole('button', { name: 'Reject correction of Wren Ashby' }));
    await user.click(within(waiting).getByRole('button', { name: 'Send rejection' }));
    expect(
      await within(waiting).findByText('a reason is required so the observer knows what to fix'),
    ).toBeInTheDocument();
    await user.click(within(waiting).getByRole('button', { name: 'Cancel' }));
    await user.click(within(waiting).getByRole('button', { name: 'Accept correction of Wren Ashby' }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]?.url).toBe('/api/reports/r1/corrections/k1/accept');
    expect(posts(calls)[0]?.body).toEqual({ replaceTimedChord: false });
  });
});
