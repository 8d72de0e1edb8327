import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { StationsPanel } from './stations-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

describe('StationsPanel', () => {
  it('StationsPanel refuses a latitude beyond 90° and adds a valid station', async () => {
    const calls = stubFetch(() => jsonResponse(201, { id: 's9' }));
    renderWithProviders(<StationsPanel eventId="e1" stations={[]} canEdit />);
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
    expect(calls).toHaveLength(0);
    await fill(/Latitude/, '-30.5');
    await user.click(screen.getByRole('button', { name: 'Add station' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.body).toEqual({
      code: 'heron-point',
      latDeg: -30.5,
      lonDeg: -70.25,
      heightM: 2400,
      observerName: null,
    });
  });
});
