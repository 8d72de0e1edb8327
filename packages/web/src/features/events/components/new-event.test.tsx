import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { BodyOption } from './body-chooser';
import { NewEvent } from './new-event';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const BODIES: BodyOption[] = [
  { id: 'b1', name: 'Quillon', designation: '2031 QL7' },
  { id: 'b2', name: 'Brask', designation: null },
];

const ROWS = [1, 2, 3, 4].map((h) => `2028-03-14T0${h}:00:00, 116.32${h}, 28.026, 5.98e9`).join('\n');

type User = ReturnType<typeof userEvent.setup>;

async function fill(user: User, name: RegExp, text: string) {
  const form = screen.getByRole('form', { name: 'Create an event' });
  await user.click(within(form).getByRole('textbox', { name }));
  await user.paste(text);
}

/** The multipart fields of each import sent, since the shared stub reads only JSON bodies. */
function stubImport(reply: () => Response): Array<Record<string, string>> {
  const sent: Array<Record<string, string>> = [];
  vi.stubGlobal('fetch', async (_input: RequestInfo | URL, init: RequestInit = {}) => {
    const form = init.body instanceof FormData ? init.body : new FormData();
    sent.push(
      Object.fromEntries(
        [...form.entries()].map(([k, v]) => [k, typeof v === 'string' ? v : `file:${v.name}`]),
      ),
    );
    return reply();
  });
  return sent;
}

const eventFile = (body?: { name: string }) =>
  new File(
    [JSON.stringify({ format: 'limbus-event/1', ...(body === undefined ? {} : { body }) })],
    'event.json',
    {
      type: 'application/json',
    },
  );

describe('NewEvent', () => {
  it('NewEvent reads a sexagesimal RA and Dec into degrees, shows them under the fields, and sends the chosen body', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'e5' }));
    const onDone = vi.fn();
    renderWithProviders(<NewEvent teamId="t1" bodies={BODIES} onDone={onDone} />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Create an event' });
    await fill(user, /^Title/, 'Quillon occults an invented star');
    await user.selectOptions(within(form).getByRole('combobox', { name: /^Body/ }), 'Brask');
    // Meeus, Astronomical Algorithms, 2nd ed., Example 13.a (Pollux): α = 7h45m18.946s = 116.328942°,
    // δ = +28°01′34.26″ = +28.026183°.
    await fill(user, /^Star RA/, '7h45m18.946s');
    await fill(user, /^Star Dec/, '+28°01′34.26″');
    expect(within(form).getByText('= 116.328942°')).toBeInTheDocument();
    expect(within(form).getByText('= 28.026183°')).toBeInTheDocument();
    await fill(user, /^Event time/, '2028-03-14 02:11:04');
    await fill(user, /^Ephemeris rows/, ROWS);
    await user.click(within(form).getByRole('button', { name: 'Create event' }));
    await waitFor(() => expect(onDone).toHaveBeenCalledWith('e5'));
    const sent = calls[0]?.body as {
      bodyId: string;
      star: { raDeg: number; decDeg: number };
      ephemeris: { rows: unknown[] };
    };
    expect(Math.abs(sent.star.raDeg - 116.328942)).toBeLessThan(1e-6);
    expect(Math.abs(sent.star.decDeg - 28.026183)).toBeLessThan(1e-6);
    expect(sent).toMatchObject({
      teamId: 't1',
      bodyId: 'b2',
      title: 'Quillon occults an invented star',
      eventTimeUtc: '2028-03-14T02:11:04Z',
      star: { catalogEpochJyear: 2016, pmRaCosDecMasPerYear: 0, pmDecMasPerYear: 0, parallaxMas: 0 },
      ephemeris: { timeScale: 'TDB' },
      earthRotation: { dut1Seconds: 0 },
    });
    expect(sent).not.toHaveProperty('newBody');
    expect(sent.ephemeris.rows[3]).toEqual({
      time: '2028-03-14T04:00:00',
      raDeg: 116.324,
      decDeg: 28.026,
      distanceKm: 5.98e9,
    });
  });

  it('NewEvent makes a new body with the event, and shows the server’s refusals on their fields, keeping what was typed', async () => {
    const calls = stubFetch(() =>
      jsonResponse(400, {
        statusCode: 400,
        message: 'Validation failed',
        issues: [
          { path: 'newBody.name', message: 'must not contain control characters' },
          { path: 'star.parallaxMas', message: 'parallaxMas must be a finite number' },
          { path: 'ephemeris.rows.2.time', message: 'rows must be in time order' },
        ],
      }),
    );
    const onDone = vi.fn();
    renderWithProviders(<NewEvent teamId="t1" bodies={BODIES} onDone={onDone} />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Create an event' });
    await fill(user, /^Title/, 'First event of a new body');
    await user.selectOptions(within(form).getByRole('combobox', { name: /^Body/ }), 'New body…');
    await fill(user, /^New body name/, 'Oru');
    await fill(user, /^New body designation/, '2033 OR');
    await fill(user, /^Star RA/, '116.328942');
    await fill(user, /^Star Dec/, '28:01:34.26');
    await fill(user, /^Ephemeris rows/, ROWS);
    await user.click(within(form).getByRole('button', { name: 'Create event' }));
    expect(await within(form).findByText('must not contain control characters')).toBeInTheDocument();
    expect(within(form).getByRole('textbox', { name: /^New body name/ })).toHaveAttribute(
      'aria-invalid',
      'true',
    );
    expect(within(form).getByRole('textbox', { name: /^Parallax/ })).toHaveAttribute('aria-invalid', 'true');
    expect(within(form).getByText('line 3: rows must be in time order')).toBeInTheDocument();
    expect(within(form).getByRole('textbox', { name: /^New body name/ })).toHaveValue('Oru');
    expect(within(form).getByRole('textbox', { name: /^Star Dec/ })).toHaveValue('28:01:34.26');
    expect(calls[0]?.body).toMatchObject({ newBody: { name: 'Oru', designation: '2033 OR' } });
    expect(calls[0]?.body).not.toHaveProperty('bodyId');
    expect(onDone).not.toHaveBeenCalled();
  });

  it('NewEvent names each field it cannot read and sends nothing: no body, a bad RA, DUT1 beyond ±0.9 s, a bad line', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'e5' }));
    renderWithProviders(<NewEvent teamId="t1" bodies={BODIES} onDone={() => undefined} />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Create an event' });
    await fill(user, /^Title/, 'An event');
    await fill(user, /^Star RA/, '25h00m00s');
    await fill(user, /^Star Dec/, '-8.2');
    const dut1 = within(form).getByRole('textbox', { name: /^DUT1/ });
    await user.clear(dut1);
    await user.paste('1.2');
    await fill(
      user,
      /^Ephemeris rows/,
      [1, 2, 3, 4].map((h) => `2028-03-14T0${h}:00:00, ${h === 2 ? 400 : 285.2}, -21.388, 5.98e9`).join('\n'),
    );
    await user.click(within(form).getByRole('button', { name: 'Create event' }));
    expect(
      await within(form).findByText('choose the body this event observes, or add a new one'),
    ).toBeInTheDocument();
    expect(within(form).getByRole('textbox', { name: /^Star RA/ })).toHaveAttribute('aria-invalid', 'true');
    expect(within(form).getByText('hours must be below 24')).toBeInTheDocument();
    expect(
      within(form).getByText('DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds'),
    ).toBeInTheDocument();
    expect(within(form).getByText('line 2: RA must be within 0–360°')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });

  it('NewEvent lists every problem of a refused event file by its JSON path', async () => {
    const sent = stubImport(() =>
      jsonResponse(400, {
        statusCode: 400,
        message: 'Validation failed',
        issues: [
          { path: 'chords[2].reappearance.time', message: 'reappearance must come after disappearance' },
          { path: 'ephemeris.rows', message: 'at least 4 rows are needed' },
        ],
      }),
    );
    const onDone = vi.fn();
    renderWithProviders(<NewEvent teamId="t1" bodies={BODIES} onDone={onDone} />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Import an event file' });
    await user.upload(within(form).getByLabelText(/^Event file/), eventFile());
    await user.selectOptions(within(form).getByRole('combobox', { name: /^Body/ }), 'Quillon (2031 QL7)');
    await user.click(within(form).getByRole('button', { name: 'Import' }));
    const list = await screen.findByRole('list', { name: 'Problems in the event file' });
    expect(list).toHaveTextContent('chords[2].reappearance.time: reappearance must come after disappearance');
    expect(list).toHaveTextContent('ephemeris.rows: at least 4 rows are needed');
    expect(sent).toEqual([{ file: 'file:event.json', teamId: 't1', bodyId: 'b1' }]);
    expect(onDone).not.toHaveBeenCalled();
  });

  it('NewEvent says which body an imported file names and imports into it, or into a new body named instead', async () => {
    const sent = stubImport(() => jsonResponse(201, { id: 'e7' }));
    const onDone = vi.fn();
    renderWithProviders(<NewEvent teamId="t1" bodies={BODIES} onDone={onDone} />);
    const user = userEvent.setup();
    const form = screen.getByRole('form', { name: 'Import an event file' });
    await user.upload(within(form).getByLabelText(/^Event file/), eventFile({ name: 'Quillon' }));
    expect(await within(form).findByText('The file names the body “Quillon”.')).toBeInTheDocument();
    expect(within(form).getByRole('combobox', { name: /^Body/ })).toHaveDisplayValue(
      'As the file says: Quillon',
    );
    await user.click(within(form).getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(onDone).toHaveBeenCalledWith('e7'));
    await user.selectOptions(within(form).getByRole('combobox', { name: /^Body/ }), 'New body…');
    await user.click(within(form).getByRole('button', { name: 'Import' }));
    expect(await within(form).findByText('name the new body')).toBeInTheDocument();
    await user.type(within(form).getByRole('textbox', { name: /^New body name/ }), 'Oru');
    await user.click(within(form).getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(sent).toHaveLength(2));
    expect(sent).toEqual([
      { file: 'file:event.json', teamId: 't1' },
      { file: 'file:event.json', teamId: 't1', bodyName: 'Oru' },
    ]);
  });
});
