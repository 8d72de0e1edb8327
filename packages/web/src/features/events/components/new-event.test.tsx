import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { NewEvent } from './new-event';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

describe('NewEvent', () => {
  it('NewEvent lists every problem of a refused event file by its JSON path', async () => {
    stubFetch(() =>
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
    renderWithProviders(<NewEvent teamId="t1" onDone={onDone} />);
    const user = userEvent.setup();
    await user.upload(
      screen.getByLabelText('Event file (limbus-event/1 JSON)'),
      new File(['{"format":"limbus-event/1"}'], 'event.json', { type: 'application/json' }),
    );
    await user.click(screen.getByRole('button', { name: 'Import' }));
    const list = await screen.findByRole('list', { name: 'Problems in the event file' });
    expect(list).toHaveTextContent('chords[2].reappearance.time: reappearance must come after disappearance');
    expect(list).toHaveTextContent('ephemeris.rows: at least 4 rows are needed');
    expect(onDone).not.toHaveBeenCalled();
  });

  it('NewEvent creates an event from the form, reading one ephemeris row per line', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'e5' }));
    const onDone = vi.fn();
    renderWithProviders(<NewEvent teamId="t1" onDone={onDone} />);
    const user = userEvent.setup();
    const fill = async (name: RegExp, text: string) => {
      await user.click(screen.getByRole('textbox', { name }));
      await user.paste(text);
    };
    await fill(/^Title/, 'Invented body occults an invented star');
    await fill(/^Star RA/, '285.2');
    await fill(/^Star Dec/, '-21.4');
    await fill(
      /^Ephemeris rows/,
      [1, 2, 3, 4].map((h) => `2028-03-14T0${h}:00:00, 285.21${h}, -21.388, 5.98e9`).join('\n'),
    );
    await user.click(screen.getByRole('button', { name: 'Create event' }));
    await waitFor(() => expect(onDone).toHaveBeenCalledWith('e5'));
    expect(calls[0]?.body).toMatchObject({
      teamId: 't1',
      title: 'Invented body occults an invented star',
      star: { raDeg: 285.2, decDeg: -21.4 },
      ephemeris: { timeScale: 'TDB' },
    });
    expect((calls[0]?.body as { ephemeris: { rows: unknown[] } }).ephemeris.rows[3]).toEqual({
      time: '2028-03-14T04:00:00',
      raDeg: 285.214,
      decDeg: -21.388,
      distanceKm: 5.98e9,
    });
  });

  it('NewEvent names the bad ephemeris line and refuses fewer than 4 rows, sending nothing', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 'e5' }));
    renderWithProviders(<NewEvent teamId="t1" onDone={() => undefined} />);
    const user = userEvent.setup();
    const rows = screen.getByRole('textbox', { name: /^Ephemeris rows/ });
    await user.click(rows);
    await user.paste(
      [1, 2, 3, 4].map((h) => `2028-03-14T0${h}:00:00, ${h === 2 ? 400 : 285.2}, -21.388, 5.98e9`).join('\n'),
    );
    await user.click(screen.getByRole('button', { name: 'Create event' }));
    expect(await screen.findByText('line 2: RA must be within 0–360°')).toBeInTheDocument();
    await user.clear(rows);
    await user.paste('2028-03-14T01:00:00, 285.2, -21.388, 5.98e9');
    await user.click(screen.getByRole('button', { name: 'Create event' }));
    expect(await screen.findByText(/^at least 4 rows are needed/)).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });
});
