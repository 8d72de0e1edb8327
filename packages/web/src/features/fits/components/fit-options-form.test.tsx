import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FitOptionsForm } from './fit-options-form';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

describe('FitOptionsForm', () => {
  it('FitOptionsForm sends the fixed values, model error, fitted clock offsets and ring centre', async () => {
    const calls = stubFetch(() => jsonResponse(202, { id: 'f9' }));
    const onQueued = vi.fn();
    renderWithProviders(
      <FitOptionsForm eventId="e1" stationCodes={['kestrel-hill', 'brackenmoor']} onQueued={onQueued} />,
    );
    const user = userEvent.setup();
    await user.click(screen.getByRole('checkbox', { name: 'Fix Oblateness' }));
    await user.click(screen.getByRole('textbox', { name: 'Fixed value of Oblateness' }));
    await user.paste('0.1');
    const modelError = screen.getByRole('textbox', { name: /Model error \(km\)/ });
    await user.clear(modelError);
    await user.paste('2.5');
    await user.click(screen.getByRole('checkbox', { name: 'brackenmoor' }));
    await user.click(screen.getByRole('radio', { name: 'Fitted freely' }));
    await user.click(screen.getByRole('button', { name: 'Run fit' }));
    await waitFor(() => expect(onQueued).toHaveBeenCalledWith('f9'));
    expect(calls[0]?.url).toBe('/api/events/e1/fits');
    expect(calls[0]?.body).toEqual({
      options: {
        limb: { fixed: { oblateness: 0.1 }, modelErrorKm: 2.5, fitTimeOffsets: ['brackenmoor'] },
        ring: { centerFrom: 'free' },
      },
    });
  });

  it('FitOptionsForm refuses a fixed parameter left blank and an oblateness of 1, sending nothing', async () => {
    const calls = stubFetch(() => jsonResponse(202, { id: 'f9' }));
    renderWithProviders(<FitOptionsForm eventId="e1" stationCodes={[]} onQueued={() => undefined} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('checkbox', { name: 'Fix Equatorial radius (km)' }));
    await user.click(screen.getByRole('checkbox', { name: 'Fix Oblateness' }));
    await user.click(screen.getByRole('textbox', { name: 'Fixed value of Oblateness' }));
    await user.paste('1');
    await user.click(screen.getByRole('button', { name: 'Run fit' }));
    expect(await screen.findByText('oblateness must be in [0, 1)')).toBeInTheDocument();
    expect(screen.getByText('enter a number')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });
});
