import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { StationsPanel } from './stations-panel';
import { jsonResponse, renderWithProviders, stubFetch, type RecordedCall } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const MEMBERS = [
  {
    userId: 'u1',
    name: 'Aster Vell',
    email: 'aster@example.org',
    roles: ['coordinator'],
    joinedAt: '2029-01-02T00:00:00.000Z',
  },
  {
    userId: 'u2',
    name: 'Wren Ashby',
    email: 'wren@example.org',
    roles: ['observer'],
    joinedAt: '2029-01-03T00:00:00.000Z',
  },
  {
    userId: 'u3',
    name: 'Bram Ostley',
    email: 'bram@example.org',
    roles: ['modeller', 'observer'],
    joinedAt: '2029-01-04T00:00:00.000Z',
  },
];

const STATION = {
  id: 's1',
  code: 'kestrel-hill',
  latDeg: -30.5,
  lonDeg: -70.25,
  heightM: 2400,
  observerId: 'u2',
  observerName: null,
  apertureMm: 200,
  camera: 'QHY174M',
  exposureSeconds: 0.1,
  timeSource: 'GPS 1PPS',
};

/** Members on GET, the given answer for anything else. */
function api(answer: (call: RecordedCall) => Response = () => jsonResponse(201, { id: 's9' })) {
  return stubFetch((call) =>
    call.method === 'GET' && call.url === '/api/teams/t1/members' ? jsonResponse(200, MEMBERS) : answer(call),
  );
}

const writes = (calls: RecordedCall[]) => calls.filter((c) => c.method !== 'GET');

describe('StationsPanel', () => {
  it('StationsPanel refuses a latitude beyond 90° and adds a valid station', async () => {
    const calls = api();
    renderWithProviders(<StationsPanel eventId="e1" teamId="t1" stations={[]} canEdit />);
    const user = userEvent.setup();
    const fill = async (name: RegExp, text: string) => {
      const box = screen.getByRole('textbox', { name });
      await user.clear(box);
      await user.click(box);
      await user.paste(text);
    };
    await fill(/Station id/, 'heron-point');
    await fill(/Latitude/, '95');
    await fill(/Longitude/, '-70.25');
    await fill(/Height/, '2400');
    await user.click(screen.getByRole('button', { name: 'Add station' }));
    expect(await screen.findByText('latitude must be within ±90°')).toBeInTheDocument();
    expect(writes(calls)).toHaveLength(0);
    await fill(/Latitude/, '-30.5');
    await user.click(screen.getByRole('button', { name: 'Add station' }));
    await waitFor(() => expect(writes(calls)).toHaveLength(1));
    expect(writes(calls)[0]?.body).toEqual({
      code: 'heron-point',
      latDeg: -30.5,
      lonDeg: -70.25,
      heightM: 2400,
      observerId: null,
      observerName: null,
      apertureMm: null,
      camera: null,
      exposureSeconds: null,
      timeSource: null,
    });
  });

  it('StationsPanel picks the observer among the members, observers first, or takes a typed name', async () => {
    const calls = api();
    renderWithProviders(<StationsPanel eventId="e1" teamId="t1" stations={[]} canEdit />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Add station' });
    const observer = within(form).getByRole('combobox', { name: 'Observer' });
    await within(form).findByRole('option', { name: 'Wren Ashby' });
    expect(
      within(observer)
        .getAllByRole('option')
        .map((o) => o.textContent),
    ).toEqual(['No observer yet', 'Bram Ostley', 'Wren Ashby', 'Aster Vell', 'Observer without an account']);
    const fill = async (name: RegExp, text: string) => {
      await user.click(within(form).getByRole('textbox', { name }));
      await user.paste(text);
    };
    await fill(/Station id/, 'heron-point');
    await fill(/Latitude/, '-30.5');
    await fill(/Longitude/, '-70.25');
    await fill(/Height/, '2400');
    await user.selectOptions(observer, 'Wren Ashby');
    await user.click(within(form).getByRole('button', { name: 'Add station' }));
    await waitFor(() => expect(writes(calls)).toHaveLength(1));
    expect(writes(calls)[0]?.body).toMatchObject({ observerId: 'u2', observerName: null });

    await fill(/Station id/, 'brackenmoor');
    await fill(/Latitude/, '-31');
    await fill(/Longitude/, '-70');
    await fill(/Height/, '800');
    await user.selectOptions(observer, 'Observer without an account');
    await user.click(within(form).getByRole('button', { name: 'Add station' }));
    expect(await within(form).findByText(/type the observer’s name/)).toBeInTheDocument();
    expect(writes(calls)).toHaveLength(1);
    await fill(/Observer name/, 'Ilse Morrow');
    await user.click(within(form).getByRole('button', { name: 'Add station' }));
    await waitFor(() => expect(writes(calls)).toHaveLength(2));
    expect(writes(calls)[1]?.body).toMatchObject({ observerId: null, observerName: 'Ilse Morrow' });
  });

  it('StationsPanel shows the observer and equipment and edits a station in place with PATCH', async () => {
    let refused = false;
    const calls = api(() => {
      if (!refused) {
        refused = true;
        return jsonResponse(400, {
          message: 'Validation failed',
          issues: [{ path: 'exposureSeconds', message: 'exposureSeconds must be greater than zero' }],
        });
      }
      return jsonResponse(200, {});
    });
    renderWithProviders(
      <StationsPanel
        eventId="e1"
        teamId="t1"
        stations={[
          STATION,
          { ...STATION, id: 's2', code: 'brackenmoor', observerId: null, observerName: 'Ilse Morrow' },
        ]}
        canEdit
      />,
    );
    const table = screen.getByRole('table', { name: 'Stations' });
    const row = (await within(table).findByRole('cell', { name: 'Wren Ashby' })).closest('tr');
    expect(row).toHaveTextContent('QHY174M');
    expect(row).toHaveTextContent('GPS 1PPS');
    expect(within(table).getByRole('cell', { name: 'Ilse Morrow (no account)' })).toBeInTheDocument();

    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Edit station kestrel-hill' }));
    const dialog = await screen.findByRole('dialog');
    const form = within(dialog).getByRole('form', { name: 'Edit station kestrel-hill' });
    expect(within(form).getByRole('combobox', { name: 'Observer' })).toHaveValue('member:u2');
    const replace = async (name: RegExp, text: string) => {
      const box = within(form).getByRole('textbox', { name });
      await user.clear(box);
      await user.click(box);
      await user.paste(text);
    };
    await replace(/Aperture/, '254');
    await replace(/Camera/, 'ZWO ASI2600MM');
    await replace(/Exposure/, '0.05');
    await replace(/Time source/, 'GPS 1PPS + NTP');
    await user.click(within(form).getByRole('button', { name: 'Save station' }));
    expect(await within(form).findByText('exposureSeconds must be greater than zero')).toBeInTheDocument();
    await user.click(within(form).getByRole('button', { name: 'Save station' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    const patches = writes(calls);
    expect(patches.map((c) => `${c.method} ${c.url}`)).toEqual([
      'PATCH /api/events/e1/stations/s1',
      'PATCH /api/events/e1/stations/s1',
    ]);
    expect(patches[1]?.body).toEqual({
      code: 'kestrel-hill',
      latDeg: -30.5,
      lonDeg: -70.25,
      heightM: 2400,
      observerId: 'u2',
      observerName: null,
      apertureMm: 254,
      camera: 'ZWO ASI2600MM',
      exposureSeconds: 0.05,
      timeSource: 'GPS 1PPS + NTP',
    });
  });

  it('StationsPanel tells an observer without a station of this event whom to ask', async () => {
    api();
    renderWithProviders(
      <StationsPanel eventId="e1" teamId="t1" stations={[]} eventStationCount={3} canEdit={false} />,
    );
    expect(
      screen.getByText(
        "None of this event's 3 stations is assigned to you yet; ask the event's coordinator to assign you one.",
      ),
    ).toBeInTheDocument();
    expect(screen.queryByText('No stations yet.')).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Add station' })).not.toBeInTheDocument();
  });
});
