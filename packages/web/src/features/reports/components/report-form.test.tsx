import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ReportForm } from './report-form';
import { ReportsPanel } from './reports-panel';
import { testReport } from './test-report';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const STATIONS = [
  { id: 's1', code: 'kestrel-hill' },
  { id: 's2', code: 'brackenmoor' },
];

describe('ReportForm', () => {
  it('ReportForm submits a positive report with both timings and their sigmas', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'r7' }));
    const onSaved = vi.fn();
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} onSaved={onSaved} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('textbox', { name: /^Disappearance \(UTC\)/ }));
    await user.paste('2029-05-17T03:12:31.25Z');
    await user.click(screen.getByRole('textbox', { name: /^Disappearance σ/ }));
    await user.paste('0.04');
    await user.click(screen.getByRole('textbox', { name: /^Reappearance \(UTC\)/ }));
    await user.paste('2029-05-17T03:12:49.9Z');
    await user.click(screen.getByRole('textbox', { name: /^Reappearance σ/ }));
    await user.paste('0.05');
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledWith('r7'));
    expect(calls[0]?.url).toBe('/api/events/e1/reports');
    expect(calls[0]?.body).toEqual({
      stationId: 's1',
      result: 'positive',
      notes: null,
      timesFromLightCurve: false,
      disappearance: { time: '2029-05-17T03:12:31.25Z', sigmaSeconds: 0.04 },
      reappearance: { time: '2029-05-17T03:12:49.9Z', sigmaSeconds: 0.05 },
      ringDips: [],
    });
  });

  it('ReportForm uploads the chosen light curve to the report it has just created', async () => {
    const calls = stubFetch((call) =>
      call.url.endsWith('/light-curve') ? jsonResponse(201, {}) : jsonResponse(201, { id: 'r9' }),
    );
    const onSaved = vi.fn();
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} onSaved={onSaved} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: 'Technical failure' }));
    await user.upload(
      screen.getByLabelText(/^Light curve file/),
      new File(['t,flux\n0,1.00\n0.04,0.98\n'], 'kestrel-hill.csv', { type: 'text/csv' }),
    );
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledWith('r9'));
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      'POST /api/events/e1/reports',
      'POST /api/reports/r9/light-curve',
    ]);
  });

  it("ReportForm puts the server's refusal of a positive without times on the time fields", async () => {
    const calls = stubFetch(() =>
      jsonResponse(400, {
        message: 'Validation failed',
        issues: [
          { path: 'disappearance', message: 'a positive report needs the disappearance' },
          { path: 'reappearance', message: 'a positive report needs the reappearance' },
        ],
      }),
    );
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Submit report' }));
    expect(await screen.findByText('a positive report needs the disappearance')).toBeInTheDocument();
    expect(screen.getByText('a positive report needs the reappearance')).toBeInTheDocument();
    expect(calls).toHaveLength(1);
  });

  it('ReportForm sends a clouded-out report without any times', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'r8' }));
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: 'Clouded out' }));
    expect(screen.queryByRole('textbox', { name: /Disappearance/ })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.body).toEqual({ stationId: 's1', result: 'clouded_out', notes: null });
  });

  it('ReportForm edits a submitted report with PATCH and leaves an accepted one read-only', async () => {
    const calls = stubFetch(() => jsonResponse(200, {}));
    const submitted = testReport({
      id: 'r3',
      stationId: 's2',
      station: 'brackenmoor',
      result: 'negative',
      disappearance: null,
      reappearance: null,
      observedFromUtc: '2029-05-17T03:10:00Z',
      observedToUtc: '2029-05-17T03:15:00Z',
    });
    const { unmount } = renderWithProviders(
      <ReportForm eventId="e1" stations={STATIONS} report={submitted} />,
    );
    await userEvent.setup().click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.method).toBe('PATCH');
    expect(calls[0]?.url).toBe('/api/reports/r3');
    unmount();
    renderWithProviders(
      <ReportForm eventId="e1" stations={STATIONS} report={{ ...submitted, state: 'accepted' }} />,
    );
    expect(screen.queryByRole('button', { name: 'Save changes' })).not.toBeInTheDocument();
  });
  it('ReportForm sends a positive to be timed from its light curve without times, and uploads the file', async () => {
    const calls = stubFetch((call) =>
      call.url.endsWith('/light-curve') ? jsonResponse(201, {}) : jsonResponse(201, { id: 'r9' }),
    );
    const onSaved = vi.fn();
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} onSaved={onSaved} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: 'to be timed from my light curve' }));
    expect(screen.getByRole('textbox', { name: /^Disappearance \(UTC\), optional/ })).not.toBeRequired();
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    expect(
      await screen.findByText('a report timed from its light curve needs the light-curve file'),
    ).toBeInTheDocument();
    expect(calls).toHaveLength(0);
    await user.upload(
      screen.getByLabelText(/^Light curve file/),
      new File(['time,flux\n2029-05-17T03:12:00Z,1.00\n'], 'kestrel-hill.csv', { type: 'text/csv' }),
    );
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledWith('r9'));
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      'POST /api/events/e1/reports',
      'POST /api/reports/r9/light-curve',
    ]);
    expect(calls[0]?.body).toEqual({
      stationId: 's1',
      result: 'positive',
      notes: null,
      timesFromLightCurve: true,
      disappearance: null,
      reappearance: null,
      ringDips: [],
    });
  });

  it('ReportForm sends the ring dips entered, row by row, and shows a refused dip time on its field', async () => {
    let refused = false;
    const calls = stubFetch(() => {
      if (refused) return jsonResponse(201, { id: 'r5' });
      refused = true;
      return jsonResponse(400, {
        message: 'Validation failed',
        issues: [{ path: 'ringDips.0.end.time', message: 'end must come after start' }],
      });
    });
    const onSaved = vi.fn();
    renderWithProviders(<ReportForm eventId="e1" stations={STATIONS} report={null} onSaved={onSaved} />);
    const user = userEvent.setup();
    const fill = async (name: string | RegExp, text: string) => {
      const box = screen.getByRole('textbox', { name });
      await user.clear(box);
      await user.click(box);
      await user.paste(text);
    };
    await user.click(screen.getByRole('radio', { name: /^Negative/ }));
    await fill('Watched from (UTC)', '2029-05-17T03:10:00Z');
    await fill('Watched to (UTC)', '2029-05-17T03:15:00Z');
    await user.click(screen.getByRole('button', { name: 'Add a ring dip' }));
    await user.click(screen.getByRole('button', { name: 'Add a ring dip' }));
    await user.click(screen.getByRole('button', { name: 'Remove dip 1' }));
    expect(screen.queryByRole('textbox', { name: 'Dip 2 ring label' })).not.toBeInTheDocument();
    await fill('Dip 1 ring label', 'R1');
    await fill('Dip 1 start (UTC)', '2029-05-17T03:11:02.4Z');
    await fill('Dip 1 start σ (s)', 'fast');
    await fill('Dip 1 end (UTC)', '2029-05-17T03:11:02.9Z');
    await fill('Dip 1 end σ (s)', '0.06');
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    expect(await screen.findByText('enter a number of seconds')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
    await fill('Dip 1 start σ (s)', '0.05');
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    expect(await screen.findByText('end must come after start')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Submit report' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalledWith('r5'));
    expect(calls[1]?.body).toEqual({
      stationId: 's1',
      result: 'negative',
      notes: null,
      observedFromUtc: '2029-05-17T03:10:00Z',
      observedToUtc: '2029-05-17T03:15:00Z',
      ringDips: [
        {
          ring: 'R1',
          start: { time: '2029-05-17T03:11:02.4Z', sigmaSeconds: 0.05 },
          end: { time: '2029-05-17T03:11:02.9Z', sigmaSeconds: 0.06 },
        },
      ],
    });
  });
});

describe('ReportsPanel', () => {
  it('ReportsPanel lets a coordinator accept a report and refuses a rejection without a reason', async () => {
    const calls = stubFetch((call) =>
      call.method === 'POST'
        ? jsonResponse(200, {})
        : jsonResponse(200, [
            testReport({
              stationId: 's2',
              station: 'brackenmoor',
              result: 'clouded_out',
              disappearance: null,
              reappearance: null,
            }),
          ]),
    );
    renderWithProviders(<ReportsPanel eventId="e1" stations={STATIONS} ownStationIds={[]} canDecide />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Reject report of Wren Ashby' }));
    await user.click(screen.getByRole('button', { name: 'Send rejection' }));
    expect(
      await screen.findByText('a reason is required so the observer knows what to fix'),
    ).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    await user.click(screen.getByRole('button', { name: 'Accept report of Wren Ashby' }));
    await waitFor(() => expect(calls.map((c) => c.url)).toContain('/api/reports/r1/accept'));
    expect(screen.queryByRole('button', { name: 'New report' })).not.toBeInTheDocument();
  });
});
