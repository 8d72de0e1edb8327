import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { eventDetailSchema, type EventDetail } from '../api/get-event';
import {
  PredictionSettingsForm,
  type OffsetFitCandidate,
  type PredictionSettingsFormProps,
} from './prediction-settings-form';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

// An invented event of the invented body Quillon with its prediction settings.
const EVENT: EventDetail = eventDetailSchema.parse({
  id: 'e2',
  title: 'Quillon, second night',
  teamId: 't1',
  bodyId: 'b1',
  bodyName: 'Quillon',
  bodyDesignation: null,
  eventTimeUtc: '2030-02-11T03:10:00Z',
  dataSha256: 'a'.repeat(64),
  star: { raDeg: 101.5, decDeg: 12.25 },
  ephemeris: {
    timeScale: 'TDB',
    rows: [0, 1, 2, 3].map((h) => ({
      time: `2030-02-11T0${h + 2}:00:00`,
      raDeg: 101.5 + h * 0.001,
      decDeg: 12.25,
      distanceKm: 6.1e9,
    })),
  },
  prediction: {
    bodyRadiusKm: 555,
    uncertaintyMas: { raCosDec: 8, dec: 12 },
    rings: [{ ring: 'R1', radiusKm: 4100 }],
  },
});

const CANDIDATE: OffsetFitCandidate = {
  fitId: 'fit-7',
  eventId: 'e1',
  eventTitle: 'Quillon, first night',
  eventTimeUtc: '2029-09-07T21:38:00Z',
  reviewState: 'approved',
  referenceTimeUtc: '2029-09-07T21:38:05.000Z',
  offsetMas: { raCosDec: 14.2, dec: -6.8 },
  uncertaintyMas: { raCosDec: 2.1, dec: 1.7 },
};

const PROPS: PredictionSettingsFormProps = {
  event: EVENT,
  canEdit: true,
  offsetFits: { candidates: [CANDIDATE], isPending: false, error: null },
  onOpenOffsetFits: () => undefined,
};

const box = (name: string | RegExp) => screen.getByRole('textbox', { name });

describe('PredictionSettingsForm', () => {
  it('PredictionSettingsForm refuses a missing radius, a step of 0 and a ring listed twice on their fields, sending nothing', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<PredictionSettingsForm {...PROPS} />);
    await user.clear(box(/^Body radius/));
    await user.clear(box(/^Time step/));
    await user.type(box(/^Time step/), '0');
    await user.click(screen.getByRole('button', { name: 'Save prediction settings' }));
    expect(await screen.findByText('give the body’s radius in km')).toBeVisible();
    expect(screen.getByText('stepSeconds must be at least 1')).toBeVisible();
    // The section's cross checks (a ring listed twice) run once each field reads.
    await user.type(box(/^Body radius/), '555');
    await user.clear(box(/^Time step/));
    await user.click(screen.getByRole('button', { name: 'Add ring' }));
    await user.type(box('Ring 2 label'), 'R1');
    await user.type(box('Ring 2 radius (km)'), '5200');
    await user.click(screen.getByRole('button', { name: 'Save prediction settings' }));
    expect(await screen.findByText('ring "R1" is listed twice (also rings[0])')).toBeVisible();
    expect(screen.queryByText('give the body’s radius in km')).toBeNull();
    expect(calls).toEqual([]);
  });

  it('PredictionSettingsForm sends the section, and shows the server’s refusal of `from` on its field keeping what was typed', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() =>
      jsonResponse(400, {
        message: 'Invalid event',
        issues: [{ path: 'prediction.from', message: 'from is before the first ephemeris row' }],
      }),
    );
    renderWithProviders(<PredictionSettingsForm {...PROPS} />);
    expect(box(/^Body radius/)).toHaveValue('555');
    await user.type(box(/^From \(UTC\)/), '2030-02-11 01:00');
    await user.click(screen.getByRole('button', { name: 'Save prediction settings' }));
    expect(await screen.findByText('from is before the first ephemeris row')).toBeVisible();
    expect(calls[0]).toMatchObject({
      url: '/api/events/e2',
      method: 'PATCH',
      body: {
        prediction: {
          bodyRadiusKm: 555,
          uncertaintyMas: { raCosDec: 8, dec: 12 },
          offsetMas: { raCosDec: 0, dec: 0 },
          rings: [{ ring: 'R1', radiusKm: 4100 }],
          stepSeconds: 10,
          from: '2030-02-11T01:00:00Z',
        },
      },
    });
    expect(box(/^From \(UTC\)/)).toHaveValue('2030-02-11 01:00');
    expect(
      screen.getByText(/Unless given: the first ephemeris row \(2030-02-11 02:00:00 TDB\)/),
    ).toBeVisible();
  });

  it('PredictionSettingsForm takes the offset of an earlier fit and says which fit it came from', async () => {
    const user = userEvent.setup();
    const onOpen = vi.fn();
    const calls = stubFetch(() =>
      jsonResponse(200, {
        prediction: {},
        offsetSource: {
          fitId: 'fit-7',
          eventId: 'e1',
          eventTitle: 'Quillon, first night',
          eventTimeUtc: '2029-09-07T21:38:00Z',
          referenceTimeUtc: '2029-09-07T21:38:05.000Z',
          reviewState: 'approved',
          offsetMas: { raCosDec: 14.2, dec: -6.8 },
          uncertaintyMas: { raCosDec: 2.1, dec: 1.7 },
          appliedAt: '2030-01-20T10:00:00.000Z',
          appliedById: 'u1',
          carriedDays: 156.2,
        },
        assumptions: ['The body’s offset is taken as constant for 156 days.'],
      }),
    );
    renderWithProviders(<PredictionSettingsForm {...PROPS} onOpenOffsetFits={onOpen} />);
    await user.click(screen.getByRole('button', { name: 'Use the offset of fit…' }));
    expect(onOpen).toHaveBeenCalled();
    const table = screen.getByRole('table', { name: 'Fits with an astrometric offset' });
    const row = within(table).getByRole('row', { name: /Quillon, first night/ });
    expect(row).toHaveTextContent('14.2 ± 2.1');
    expect(row).toHaveTextContent('-6.8 ± 1.7');
    await user.click(
      within(row).getByRole('button', { name: /^Use the offset of the fit of Quillon, first night/ }),
    );
    await waitFor(() => expect(box(/^Offset of the body, Δα·cos δ/)).toHaveValue('14.2'));
    expect(calls[0]).toMatchObject({
      url: '/api/events/e2/prediction/offset-from-fit',
      method: 'POST',
      body: { fitId: 'fit-7' },
    });
    expect(box(/^1σ of the offset, Δδ/)).toHaveValue('1.7');
    expect(screen.getByText(/come from the fit of “Quillon, first night”/)).toBeVisible();
    expect(screen.getByRole('list', { name: 'What taking the offset assumes' })).toHaveTextContent(
      'constant for 156 days',
    );
  });

  it('PredictionSettingsForm shows a modeller the settings without letting them change them', () => {
    renderWithProviders(<PredictionSettingsForm {...PROPS} canEdit={false} />);
    expect(box(/^Body radius/)).toBeDisabled();
    expect(box('Ring 1 radius (km)')).toHaveValue('4100');
    expect(screen.queryByRole('button', { name: 'Save prediction settings' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Use the offset of fit…' })).toBeNull();
  });
});
