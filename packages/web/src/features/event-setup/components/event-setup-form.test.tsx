import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { EventDetail } from '../api/get-event';
import { EventSetupForm, type EventSetupFormProps } from './event-setup-form';
import { withFocusableLayout } from '@/testing/focusable-layout';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());
withFocusableLayout();

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

const PROPS: EventSetupFormProps = {
  event: EVENT,
  canEdit: true,
  canDelete: false,
  bodies: [
    { id: 'b1', name: 'Quillon' },
    { id: 'b2', name: 'Brask' },
  ],
  onDeleted: () => undefined,
};

describe('EventSetupForm', () => {
  it('EventSetupForm refuses a DUT1 beyond ±0.9 s and fewer than 4 ephemeris rows, sending nothing', async () => {
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<EventSetupForm {...PROPS} />);
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

  it('EventSetupForm saves the body, the event time, a sexagesimal RA and Dec, the time scale and ephemeris with PATCH', async () => {
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<EventSetupForm {...PROPS} />);
    const user = userEvent.setup();
    expect(screen.getByRole('textbox', { name: /^Event time \(UTC\)/ })).toHaveValue('2029-05-17 02:30:00');
    await user.selectOptions(screen.getByRole('combobox', { name: /^Body/ }), 'Brask');
    const time = screen.getByRole('textbox', { name: /^Event time \(UTC\)/ });
    await user.clear(time);
    await user.paste('2029-05-17 03:12');
    // 18h53m00s = 18.883 h × 15 = 283.25°; −21°30′00″ = −21.5° (arithmetic).
    const ra = screen.getByRole('textbox', { name: /^Right ascension/ });
    await user.clear(ra);
    await user.paste('18h53m00s');
    expect(screen.getByText('= 283.250000°')).toBeInTheDocument();
    const dec = screen.getByRole('textbox', { name: /^Declination/ });
    await user.clear(dec);
    await user.paste('-21:30:00');
    await user.selectOptions(screen.getByRole('combobox', { name: /Time scale/ }), 'TT');
    await user.click(screen.getByRole('button', { name: 'Save setup' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]?.method).toBe('PATCH');
    expect(calls[0]?.url).toBe('/api/events/e1');
    expect(calls[0]?.body).toMatchObject({
      title: 'Invented occultation, night one',
      bodyId: 'b2',
      eventTimeUtc: '2029-05-17T03:12:00Z',
      star: { raDeg: 283.25, decDeg: -21.5, pmDecMasPerYear: -2.25 },
      ephemeris: { timeScale: 'TT' },
      earthRotation: { dut1Seconds: 0.1 },
    });
    expect(await screen.findByText('Saved.')).toBeInTheDocument();
  });

  it('EventSetupForm shows the server’s refusal of the body and a bad event time on their fields', async () => {
    const calls = stubFetch(() =>
      jsonResponse(400, {
        statusCode: 400,
        message: 'Validation failed',
        issues: [{ path: 'bodyId', message: 'no such body in this team' }],
      }),
    );
    renderWithProviders(<EventSetupForm {...PROPS} />);
    const user = userEvent.setup();
    const time = screen.getByRole('textbox', { name: /^Event time \(UTC\)/ });
    await user.clear(time);
    await user.paste('17/05/2029');
    await user.click(screen.getByRole('button', { name: 'Save setup' }));
    expect(await screen.findByText('not a UTC time (e.g. 2028-03-14 02:11:04)')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
    await user.clear(time);
    await user.paste('2029-05-17 03:12:00');
    await user.click(screen.getByRole('button', { name: 'Save setup' }));
    expect(await screen.findByText('no such body in this team')).toBeInTheDocument();
    expect(screen.getByRole('combobox', { name: /^Body/ })).toHaveAttribute('aria-invalid', 'true');
  });

  it('EventSetupForm lets a coordinator delete the event after a confirmation that says it can be restored', async () => {
    const calls = stubFetch(() => new Response(null, { status: 204 }));
    const onDeleted = vi.fn();
    renderWithProviders(<EventSetupForm {...PROPS} canDelete onDeleted={onDeleted} />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Delete event' }));
    const dialog = await screen.findByRole('alertdialog', {
      name: 'Delete Invented occultation, night one?',
    });
    expect(dialog).toHaveTextContent('A coordinator can restore it from Archived events on the events list.');
    expect(calls).toHaveLength(0);
    await user.click(within(dialog).getByRole('button', { name: 'Delete' }));
    await waitFor(() => expect(onDeleted).toHaveBeenCalled());
    expect(calls).toEqual([expect.objectContaining({ method: 'DELETE', url: '/api/events/e1' })]);
  });

  it('EventSetupForm offers deleting to coordinators only, and sends nothing when they keep the event', async () => {
    const calls = stubFetch(() => new Response(null, { status: 204 }));
    const { unmount } = renderWithProviders(<EventSetupForm {...PROPS} />);
    expect(screen.queryByRole('button', { name: 'Delete event' })).not.toBeInTheDocument();
    unmount();
    renderWithProviders(<EventSetupForm {...PROPS} canDelete />);
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Delete event' }));
    const dialog = await screen.findByRole('alertdialog', { name: /^Delete / });
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(calls).toHaveLength(0);
  });
});
