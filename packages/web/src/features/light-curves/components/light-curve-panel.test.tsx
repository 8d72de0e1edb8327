import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LightCurvePanel } from './light-curve-panel';
import { TEST_ONE_EDGE_RESULT, TEST_TIMING } from './test-timing';
import { jsonResponse, renderWithProviders, stubFetch, type RecordedCall } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const { result: _result, ...SUMMARY } = TEST_TIMING;

function api() {
  return stubFetch((call) => {
    if (call.url === '/api/events/e1/reports/r1/timings' && call.method === 'GET')
      return jsonResponse(200, [SUMMARY]);
    if (call.url === '/api/events/e1/timings/tm1' && call.method === 'GET')
      return jsonResponse(200, TEST_TIMING);
    if (call.url === '/api/events/e1/timings/tm1/accept') return jsonResponse(200, { chordId: 'c1' });
    if (call.url === '/api/events/e1/timings/tm1/ring-events')
      return jsonResponse(201, { ringEventIds: ['re1'] });
    if (call.url === '/api/events/e1/reports/r1/timings')
      return jsonResponse(202, { ...SUMMARY, id: 'tm2', state: 'queued' });
    return jsonResponse(404, { message: 'unexpected' });
  });
}

describe('LightCurvePanel', () => {
  it('LightCurvePanel shows the newest timing with its times and 1σ, and accepts it into the chord', async () => {
    const calls = api();
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    await screen.findByRole('img', { name: /^Light curve of quillmoor/ });
    const table = screen.getByRole('table', { name: 'Fitted times' });
    expect(table).toHaveTextContent('2028-03-14T02:13:48.000250Z');
    expect(table).toHaveTextContent('± 0.1200');
    expect(table).toHaveTextContent('Dip 1 start');
    await user.click(screen.getByRole('button', { name: 'Accept timing into chord' }));
    expect(await screen.findByText('Accepted into the chord.')).toBeInTheDocument();
    expect(calls.some((c) => c.url === '/api/events/e1/timings/tm1/accept' && c.method === 'POST')).toBe(
      true,
    );
  });

  it('LightCurvePanel turns the dips into ring events under the ring name given', async () => {
    const calls = api();
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    await screen.findByRole('img', { name: /^Light curve/ });
    const ring = screen.getByRole('textbox', { name: 'Ring name' });
    await user.clear(ring);
    await user.click(screen.getByRole('button', { name: 'Dips to ring events' }));
    expect(await screen.findByText('ring name must not be empty')).toBeInTheDocument();
    await user.type(ring, 'R2');
    await user.click(screen.getByRole('button', { name: 'Dips to ring events' }));
    await screen.findByText('Ring events made from these dips.');
    expect(calls.find((c) => c.url.endsWith('/ring-events'))?.body).toEqual({ ring: 'R2' });
  });

  it('LightCurvePanel names the bad field of a new timing and of a hand-marked dip before sending', async () => {
    const calls = api();
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    await screen.findByRole('img', { name: /^Light curve/ });
    await user.type(screen.getByRole('textbox', { name: 'Shadow speed (km/s)' }), '-3');
    await user.type(screen.getByRole('textbox', { name: 'Distance (km)' }), '6e9');
    await user.type(screen.getByRole('textbox', { name: 'Exposure (s)' }), '0.1');
    await user.click(screen.getByRole('button', { name: 'Time light curve' }));
    expect(await screen.findByText('speedKmPerS must be greater than zero')).toBeInTheDocument();
    await user.type(screen.getByRole('textbox', { name: 'Dip start (UTC)' }), '2028-03-14T02:13:57Z');
    await user.type(screen.getByRole('textbox', { name: 'Dip end (UTC)' }), 'soon');
    await user.click(screen.getByRole('button', { name: 'Mark dip' }));
    expect(await screen.findByText(/^enter a UTC time such as 2028-03-14T02:14:31.0Z/)).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it("LightCurvePanel starts a new timing from the event's speed, distance and the station's exposure", async () => {
    const calls = stubFetch((call) => {
      if (call.url === '/api/events/e1/reports/r1/timing-defaults')
        return jsonResponse(200, {
          speedKmPerS: 21.98765,
          distanceKm: 6162349871.4,
          exposureSeconds: 0.2,
          atUtc: '2028-03-14T02:13:55.500Z',
          atFrom: 'report',
          edgeSpeeds: {
            disappearanceKmPerS: 21.98765,
            reappearanceKmPerS: 21.98765,
            from: 'full',
            fitId: null,
            note: 'the full 21.99 km/s for both edges: the event has no solved fit and no prediction settings. An edge crossed obliquely is longer than this assumes',
          },
          rings: [],
        });
      if (call.url === '/api/events/e1/reports/r1/timings' && call.method === 'GET')
        return jsonResponse(200, []);
      if (call.url === '/api/events/e1/reports/r1/timings')
        return jsonResponse(202, { ...SUMMARY, id: 'tm2', state: 'queued' });
      return jsonResponse(404, { message: 'unexpected' });
    });
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    const speed = screen.getByRole('textbox', { name: 'Shadow speed (km/s)' });
    expect(
      await screen.findByText(/at 02:13:55 UTC \(the report's own times\), exposure from the station/),
    ).toBeInTheDocument();
    expect(speed).toHaveValue('21.988');
    expect(screen.getByRole('textbox', { name: 'Distance (km)' })).toHaveValue('6162349871');
    expect(screen.getByRole('textbox', { name: 'Exposure (s)' })).toHaveValue('0.2');
    await user.clear(speed);
    await user.type(speed, '22.5');
    await user.click(screen.getByRole('button', { name: 'Time light curve' }));
    await vi.waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toMatchObject({
      speedKmPerS: 22.5,
      distanceKm: 6162349871,
      exposureSeconds: 0.2,
    });
  });

  it("LightCurvePanel takes each edge's speed and a ring's B from the latest fit, and says where they came from", async () => {
    const calls = stubFetch((call) => {
      if (call.url === '/api/events/e1/reports/r1/timing-defaults')
        return jsonResponse(200, {
          speedKmPerS: 20,
          distanceKm: 6162349871.4,
          exposureSeconds: 0.2,
          atUtc: '2028-03-14T02:13:55.500Z',
          atFrom: 'report',
          edgeSpeeds: {
            disappearanceKmPerS: 8.7178,
            reappearanceKmPerS: 11.2,
            from: 'fit',
            fitId: 'f1',
            note: "limb-normal components of the 20.00 km/s shadow velocity where this station's track crosses the limb of the latest solved fit",
          },
          rings: [{ ring: 'R1', openingAngleDeg: 33, openingAngleSigmaDeg: 0.8, fitId: 'f1' }],
        });
      if (call.url === '/api/events/e1/reports/r1/timings' && call.method === 'GET')
        return jsonResponse(200, []);
      if (call.url === '/api/events/e1/reports/r1/timings')
        return jsonResponse(202, { ...SUMMARY, id: 'tm2', state: 'queued' });
      return jsonResponse(404, { message: 'unexpected' });
    });
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    expect(
      await screen.findByText(/^Edge speeds from the latest solved fit: limb-normal components/),
    ).toBeInTheDocument();
    const d = screen.getByRole('textbox', { name: 'Disappearance edge speed (km/s)' });
    expect(d).toHaveValue('8.718');
    expect(screen.getByRole('textbox', { name: 'Reappearance edge speed (km/s)' })).toHaveValue('11.200');
    await user.selectOptions(
      screen.getByRole('combobox', { name: /Ring for the dips' normal optical depth/ }),
      'R1',
    );
    await user.click(screen.getByRole('button', { name: 'Time light curve' }));
    await vi.waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    expect(calls.find((c) => c.method === 'POST')?.body).toMatchObject({
      speedKmPerS: 20,
      speedDisappearanceKmPerS: 8.718,
      speedReappearanceKmPerS: 11.2,
      edgeSpeedsFrom: 'fit',
      ringOpeningAngleDeg: 33,
      ringOpeningAngleSigmaDeg: 0.8,
    });
    // A speed changed by hand is sent as entered.
    await user.clear(d);
    await user.type(d, '9');
    await user.click(screen.getByRole('button', { name: 'Time light curve' }));
    await vi.waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2));
    expect(calls.filter((c) => c.method === 'POST')[1]?.body).toMatchObject({
      speedDisappearanceKmPerS: 9,
      edgeSpeedsFrom: 'entered',
    });
  });

  it('LightCurvePanel shows a one-edge timing with its dip products ± 1σ and the lower limits it gives', async () => {
    const oneEdge = { ...TEST_TIMING, result: TEST_ONE_EDGE_RESULT };
    stubFetch((call) => {
      if (call.url === '/api/events/e1/reports/r1/timings' && call.method === 'GET')
        return jsonResponse(200, [SUMMARY]);
      if (call.url === '/api/events/e1/timings/tm1' && call.method === 'GET')
        return jsonResponse(200, oneEdge);
      return jsonResponse(404, { message: 'unexpected' });
    });
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    const times = await screen.findByRole('table', { name: 'Fitted times' });
    expect(times).toHaveTextContent('Disappearance (edge at 8.72 km/s)');
    expect(times).toHaveTextContent('not in this curve (it ends inside the event)');
    // One edge is a single-edge chord: the accept stays open.
    expect(screen.getByRole('button', { name: 'Accept timing into chord' })).toBeEnabled();
    const dips = screen.getByRole('table', { name: 'Dip products' });
    const row = within(dips).getAllByRole('row')[1];
    // σ to two significant digits, the value to the same place.
    expect(row).toHaveTextContent('0.600 ± 0.021');
    expect(row).toHaveTextContent('0.916 ± 0.052');
    expect(row).toHaveTextContent('0.499 ± 0.030');
    expect(row).toHaveTextContent('(lower limits)');
    expect(screen.getByText(/Dip 1 is narrower than the Fresnel scale/)).toHaveTextContent(
      'opacity ≥ 0.257, τ ≥ 0.297, τ·|sin B| ≥ 0.162, equivalent depth ≥ 0.416 km',
    );
  });

  it('LightCurvePanel for a reader shows the plot without the actions', async () => {
    api();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit={false} />,
    );
    await screen.findByRole('img', { name: /^Light curve/ });
    expect(screen.queryByRole('button', { name: 'Accept timing into chord' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Time this light curve' })).not.toBeInTheDocument();
  });

  it('LightCurvePanel says "In the chord" only while the chord holds the timing, and what replaced an accepted one', async () => {
    const show = (timing: typeof TEST_TIMING, chord: Parameters<typeof LightCurvePanel>[0]['chord']) => {
      const { result: _r, ...summary } = timing;
      stubFetch((call) =>
        call.url.endsWith('/timings') ? jsonResponse(200, [summary]) : jsonResponse(200, timing),
      );
      return renderWithProviders(
        <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={chord} canEdit={false} />,
      );
    };
    const first = show(TEST_TIMING, null);
    expect(await screen.findByText('Not in the chord.')).toBeInTheDocument();
    expect(screen.queryByText('In the chord')).not.toBeInTheDocument();
    first.unmount();

    const inChord = show(
      { ...TEST_TIMING, acceptedAt: '2028-03-15T10:00:05.000Z', inChord: true },
      {
        source: 'timing',
        timingId: 'tm1',
      },
    );
    expect(await screen.findByText('In the chord')).toBeInTheDocument();

    inChord.unmount();

    show(
      { ...TEST_TIMING, acceptedAt: '2028-03-15T10:00:05.000Z', inChord: false },
      {
        source: 'report',
        timingId: null,
      },
    );
    expect(
      await screen.findByText(
        "Accepted on 2028-03-15 10:00:05 UTC, since replaced by times typed in the observer's report.",
      ),
    ).toBeInTheDocument();
    expect(screen.queryByText('In the chord')).not.toBeInTheDocument();
  });

  it('LightCurvePanel asks before the accept replaces better-timed chord values and repeats it with replaceTimedChord', async () => {
    const accepts: RecordedCall[] = [];
    stubFetch((call) => {
      if (call.url === '/api/events/e1/reports/r1/timings') return jsonResponse(200, [SUMMARY]);
      if (call.url === '/api/events/e1/timings/tm1') return jsonResponse(200, TEST_TIMING);
      if (call.url === '/api/events/e1/timings/tm1/accept') {
        accepts.push(call);
        return (call.body as { replaceTimedChord: boolean }).replaceTimedChord
          ? jsonResponse(200, { chordId: 'c1' })
          : jsonResponse(409, {
              message: 'Accepting would replace times with a smaller σ',
              code: 'replaces-better-timing',
              detail: {
                chordId: 'c1',
                station: 'quillmoor',
                source: 'csv',
                timingId: null,
                current: {
                  disappearance: { time: '2028-03-14T02:13:48.01Z', sigmaSeconds: 0.02 },
                  reappearance: { time: '2028-03-14T02:13:52.02Z', sigmaSeconds: 0.02 },
                },
                incoming: {
                  disappearance: TEST_TIMING.result?.disappearance ?? null,
                  reappearance: TEST_TIMING.result?.reappearance ?? null,
                },
              },
            });
      }
      return jsonResponse(404, { message: 'unexpected' });
    });
    const user = userEvent.setup();
    renderWithProviders(
      <LightCurvePanel eventId="e1" reportId="r1" stationLabel="quillmoor" chord={null} canEdit />,
    );
    await user.click(await screen.findByRole('button', { name: 'Accept timing into chord' }));
    const dialog = await screen.findByRole('alertdialog', { name: /quillmoor/ });
    expect(dialog).toHaveTextContent('holds times from a CSV import');
    expect(dialog).toHaveTextContent('2028-03-14 02:13:48.01 UTC ± 0.02 s');
    expect(dialog).toHaveTextContent('2028-03-14 02:13:48.000250 UTC ± 0.12 s');
    await user.click(within(dialog).getByRole('button', { name: 'Replace' }));
    expect(await screen.findByText('Accepted into the chord.')).toBeInTheDocument();
    await waitFor(() =>
      expect(accepts.map((c) => c.body)).toEqual([{ replaceTimedChord: false }, { replaceTimedChord: true }]),
    );
  });
});
