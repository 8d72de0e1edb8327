import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { EventSetupForm } from './event-setup-form';
import type { EventDetail } from '../api/get-event';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

// An invented event: a star and four ephemeris rows of an invented body.
const EVENT: EventDetail = {
  id: 'e1',
  title: 'Invented occultation, night one',
  teamId: 't1',
  bodyId: 'b1',
  bodyName: 'Quillon',
  bodyDesignation: null,
  eventTimeUtc: '2029-05-17T02:30:00Z',
  dataSha256: 'a'.repeat(64),
  star: {
    raDeg: 283.25,
    decDeg: -21.5,
    catalogEpochJyear: 2016,
    pmRaCosDecMasPerYear: 1.5,
    pmDecMasPerYear: -2.25,
    parallaxMas: 0.4,
  },
  ephemeris: {
    timeScale: 'TDB',
    rows: [0, 1, 2, 3].map((h) => ({
      time: `2029-05-17T0${h + 1}:00:00`,
      raDeg: 283.24 + h * 0.001,
      decDeg: -21.49,
      distanceKm: 6.1e9,
    })),
  },
  earthRotation: { dut1Seconds: 0.1 },
  stations: [],
};

describe('EventSetupForm', () => {
  it('EventSetupForm refuses a DUT1 beyond ±0.9 s and fewer than 4 ephemeris rows, sending nothing', async () => {
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<EventSetupForm event={EVENT} canEdit />);
    const user = userEvent.setup();
    const dut1 = screen.getByRole('textbox', { name: /DUT1/ });
    await user.clear(dut1);
    await user.paste('1.2');
    await user.click(screen.getByRole('button', { name: 'Remove ephemeris row 4' }));
    await user.click(screen.getByRole('button', { name: 'Save setup' }));
    expect(
      await screen.findByText('DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds'),
    ).toBeInTheDocument();
    expect(screen.getByText(/^at least 4 rows are needed/)).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });

  it('EventSetupForm saves the time scale, star and ephemeris with PATCH', async () => {
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<EventSetupForm event={EVENT} canEdit />);
    const user = userEvent.setup();
    await user.selectOptions(screen.getByRole('combobox', { name: /Time scale/ }), 'TT');
    await user.click(screen.getByRole('button', { name: 'Save setup' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.method).toBe('PATCH');
    expect(calls[0]?.url).toBe('/api/events/e1');
    expect(calls[0]?.body).toMatchObject({
      title: 'Invented occultation, night one',
      star: { raDeg: 283.25, decDeg: -21.5, pmDecMasPerYear: -2.25 },
      ephemeris: { timeScale: 'TT' },
      earthRotation: { dut1Seconds: 0.1 },
    });
    expect(await screen.findByText('Saved.')).toBeInTheDocument();
  });
});
