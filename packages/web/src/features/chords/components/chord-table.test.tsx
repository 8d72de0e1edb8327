import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ChordTable } from './chord-table';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent's grid re-renders every cell per keystroke; in jsdom on a shared machine that takes seconds.
vi.setConfig({ testTimeout: 30_000 });

// An invented event: two positive chords and one negative, in the server's chord view.
const CHORDS = [
  {
    id: 'c1',
    station: 'kestrel-hill',
    type: 'positive',
    disappearance: { time: '2029-05-17T03:12:31.250Z', sigmaSeconds: 0.04 },
    reappearance: { time: '2029-05-17T03:12:49.900Z', sigmaSeconds: 0.05 },
    start: null,
    end: null,
    timeOffsetSeconds: 0,
    source: 'import',
  },
  {
    id: 'c2',
    station: 'brackenmoor',
    type: 'positive',
    disappearance: { time: '2029-05-17T03:12:30.100Z', sigmaSeconds: 0.08 },
    reappearance: { time: '2029-05-17T03:12:44.600Z', sigmaSeconds: 0.08 },
    start: null,
    end: null,
    timeOffsetSeconds: 0.12,
    source: 'timing',
  },
  {
    id: 'c3',
    station: 'tarn-end',
    type: 'negative',
    disappearance: null,
    reappearance: null,
    start: '2029-05-17T03:10:00Z',
    end: '2029-05-17T03:15:00Z',
    timeOffsetSeconds: 0,
    source: 'import',
  },
];
const STATIONS = ['kestrel-hill', 'brackenmoor', 'tarn-end'];

function stationsInOrder(): string[] {
  return [...document.querySelectorAll('[data-chord-row]')].map(
    (row) => row.getAttribute('data-chord-row') ?? '',
  );
}

describe('ChordTable', () => {
  it('ChordTable lists every chord with its times, sigmas and type', async () => {
    stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const grid = await screen.findByRole('grid', { name: 'Chord table' });
    expect(within(grid).getAllByRole('row')).toHaveLength(4);
    expect(within(grid).getByText('2029-05-17T03:12:31.250Z')).toBeInTheDocument();
    expect(within(grid).getByText('0.040')).toBeInTheDocument();
    expect(within(grid).getByText('negative')).toBeInTheDocument();
  });

  it("ChordTable says where each chord's times came from, and filters by it", async () => {
    stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const grid = await screen.findByRole('grid', { name: 'Chord table' });
    expect(within(grid).getByRole('columnheader', { name: /Times from/ })).toBeInTheDocument();
    const row = (station: string) => grid.querySelector(`[data-chord-row="${station}"]`);
    expect(row('kestrel-hill')).toHaveTextContent('from the event file');
    expect(row('brackenmoor')).toHaveTextContent('from a light-curve timing');
    await userEvent.setup().click(screen.getByRole('textbox', { name: 'Filter chords' }));
    await userEvent.setup().paste('light-curve timing');
    expect(stationsInOrder()).toEqual(['brackenmoor']);
  });

  it('ChordTable sorts by station when its header is clicked, and filters by text', async () => {
    stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    await screen.findByRole('grid', { name: 'Chord table' });
    expect(stationsInOrder()).toEqual(['kestrel-hill', 'brackenmoor', 'tarn-end']);
    const user = userEvent.setup();
    await user.click(screen.getByRole('columnheader', { name: /Station/ }));
    expect(stationsInOrder()).toEqual(['brackenmoor', 'kestrel-hill', 'tarn-end']);
    await user.click(screen.getByRole('textbox', { name: 'Filter chords' }));
    await user.paste('negative');
    expect(stationsInOrder()).toEqual(['tarn-end']);
  });

  it('ChordTable refuses a reappearance before the disappearance and sends nothing', async () => {
    const calls = stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit chord of kestrel-hill' }));
    const reappearance = screen.getByRole('textbox', { name: 'Reappearance, kestrel-hill' });
    await user.clear(reappearance);
    await user.paste('2029-05-17T03:12:20.000Z');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('reappearance must come after disappearance');
    expect(reappearance).toHaveAttribute('aria-invalid', 'true');
    expect(calls.filter((c) => c.method !== 'GET')).toHaveLength(0);
  });

  it('ChordTable saves an edited sigma and time offset with PATCH in the event-file shape', async () => {
    const calls = stubFetch((call) =>
      call.method === 'PATCH' ? jsonResponse(200, {}) : jsonResponse(200, CHORDS),
    );
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit chord of brackenmoor' }));
    const sigma = screen.getByRole('textbox', { name: 'Disappearance σ (s), brackenmoor' });
    await user.clear(sigma);
    await user.paste('0.2');
    const offset = screen.getByRole('textbox', { name: 'Time offset (s), brackenmoor' });
    await user.clear(offset);
    await user.paste('-0.35');
    await user.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    const patch = calls.find((c) => c.method === 'PATCH');
    expect(patch?.url).toBe('/api/chords/c2');
    expect(patch?.body).toEqual({
      station: 'brackenmoor',
      type: 'positive',
      disappearance: { time: '2029-05-17T03:12:30.100Z', sigmaSeconds: 0.2 },
      reappearance: { time: '2029-05-17T03:12:44.600Z', sigmaSeconds: 0.08 },
      timeOffsetSeconds: -0.35,
    });
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Save' })).not.toBeInTheDocument());
  });

  it('ChordTable shows a single-edge chord as one edge, and drops an edge cleared in the editor with null', async () => {
    const single = {
      ...CHORDS[0],
      id: 'c4',
      station: 'late-start',
      disappearance: null,
    };
    const calls = stubFetch((call) =>
      call.method === 'PATCH' ? jsonResponse(200, {}) : jsonResponse(200, [...CHORDS, single]),
    );
    renderWithProviders(<ChordTable eventId="e1" stationCodes={[...STATIONS, 'late-start']} canEdit />);
    const grid = await screen.findByRole('grid', { name: 'Chord table' });
    const row = grid.querySelector('[data-chord-row="late-start"]');
    expect(row).toHaveTextContent('one edge (reappearance only)');
    expect(row).toHaveTextContent('not observed');
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Edit chord of kestrel-hill' }));
    expect(screen.getByText(/gives a single-edge chord/)).toBeInTheDocument();
    await user.clear(screen.getByRole('textbox', { name: 'Disappearance, kestrel-hill' }));
    await user.clear(screen.getByRole('textbox', { name: 'Disappearance σ (s), kestrel-hill' }));
    await user.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    expect(calls.find((c) => c.method === 'PATCH')?.body).toEqual({
      station: 'kestrel-hill',
      type: 'positive',
      disappearance: null,
      reappearance: { time: '2029-05-17T03:12:49.900Z', sigmaSeconds: 0.05 },
      timeOffsetSeconds: 0,
    });
  });

  it('ChordTable refuses a positive chord with neither edge and sends nothing', async () => {
    const calls = stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add chord' }));
    await user.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'a positive chord needs a disappearance, a reappearance or both',
    );
    expect(calls.filter((c) => c.method !== 'GET')).toHaveLength(0);
  });

  it('ChordTable hides editing for a read-only role and says why "Add chord" is greyed out', async () => {
    const calls = stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit={false} />);
    await screen.findByRole('grid', { name: 'Chord table' });
    expect(screen.queryByRole('button', { name: /Edit chord/ })).not.toBeInTheDocument();
    const add = screen.getByRole('button', { name: 'Add chord' });
    expect(add).toHaveAttribute('aria-disabled', 'true');
    expect(add).toHaveAccessibleDescription('Only coordinators and modellers add chords');
    await userEvent.setup().click(add);
    expect(screen.queryByRole('combobox', { name: 'Station, new chord' })).not.toBeInTheDocument();
    expect(calls.filter((c) => c.method !== 'GET')).toHaveLength(0);
  });

  it('ChordTable on an event without stations greys out "Add chord" and points to the stations', async () => {
    stubFetch(() => jsonResponse(200, []));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={[]} canEdit />);
    const add = await screen.findByRole('button', { name: 'Add chord' });
    expect(add).toHaveAttribute('aria-disabled', 'true');
    expect(add).toHaveAccessibleDescription('Add a station first (Stations & reports)');
  });

  it('ChordTable offers "Add chord" with no reason when it can be used', async () => {
    stubFetch(() => jsonResponse(200, CHORDS));
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    const add = await screen.findByRole('button', { name: 'Add chord' });
    expect(add).not.toHaveAttribute('aria-disabled');
    expect(add).toHaveAccessibleDescription('');
    await userEvent.setup().click(add);
    expect(screen.getByRole('combobox', { name: 'Station, new chord' })).toBeInTheDocument();
  });

  it('ChordTable says what failed and retries', async () => {
    let attempts = 0;
    stubFetch(() => {
      attempts += 1;
      return attempts === 1 ? jsonResponse(503, { message: 'Database unavailable' }) : jsonResponse(200, []);
    });
    renderWithProviders(<ChordTable eventId="e1" stationCodes={STATIONS} canEdit />);
    expect(await screen.findByRole('alert')).toHaveTextContent('Could not load the chords');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Retry' }));
    expect(await screen.findByText(/No chords yet/)).toBeInTheDocument();
  });
});
