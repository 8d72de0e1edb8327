import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Comparison, ComparisonFit } from '../api/get-comparison';
import type { JointPoleJob } from '../api/joint-pole';
import { ComparisonView } from './comparison-view';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Invented numbers for an invented body; only their formatting and placement are under test.
function fit(
  id: string,
  date: string,
  approved: boolean,
  withLimb = true,
  eventId = `e-${id}`,
): ComparisonFit {
  return {
    fitId: id,
    eventId,
    eventTitle: `Event ${eventId.slice(2)}`,
    eventDateUtc: date,
    reviewState: approved ? 'approved' : 'none',
    finishedAt: date,
    inputMatchesEvent: true,
    limb: withLimb
      ? {
          centerFKm: { value: 1.234, sigma: 0.51 },
          centerGKm: { value: -2.5, sigma: 0.4 },
          equatorialRadiusKm: { value: 401.23, sigma: 1.84 },
          oblateness: { value: 0.1, sigma: 0.0123 },
          positionAngleDeg: { value: 35.2, sigma: 0.31 },
          equivalentRadiusKm: { value: 380.4, sigma: 1.2 },
          chi2: 3.1,
          dof: 10,
        }
      : null,
    rings: [
      {
        ring: 'R1',
        radiusKm: { value: 1080.04, sigma: 2.3 },
        openingAngleDeg: { value: 31.8, sigma: 0.08 },
        positionAngleDeg: { value: 70.7, sigma: 0.055 },
        poles: [
          { raDeg: 41.1, decDeg: 27.2 },
          { raDeg: 80.3, decDeg: -5.4 },
        ],
      },
    ],
  };
}

// The latest approved fit of each event; b ran on data that has changed since. Event a also has an
// older approved fit (a0), which "every approved fit" adds.
const LATEST: Comparison = {
  selection: 'latest-approved',
  ringLabels: ['R1'],
  fits: [
    { ...fit('a', '2028-03-14T02:11:00.000Z', true), finishedAt: '2028-04-02T00:00:00.000Z' },
    { ...fit('b', '2031-07-02T20:00:00.000Z', true), inputMatchesEvent: false },
  ],
};
const APPROVED: Comparison = {
  selection: 'approved',
  ringLabels: ['R1'],
  fits: [
    { ...fit('a0', '2028-03-14T02:11:00.000Z', true, true, 'e-a'), finishedAt: '2028-03-20T00:00:00.000Z' },
    ...LATEST.fits,
  ],
};
const ALL: Comparison = {
  ...APPROVED,
  selection: 'all',
  fits: [...APPROVED.fits, fit('c', '2036-01-09T04:00:00.000Z', false, false)],
};
const JOB: JointPoleJob = {
  id: 'j1',
  state: 'solved',
  fitIds: ['a', 'b', 'c'],
  ring: 'R1',
  issues: [],
  createdAt: '2036-02-01T00:00:00.000Z',
  result: {
    format: 'limbus-joint/1',
    ring: 'R1',
    pole: { raDeg: 41.02, decDeg: 26.97 },
    uncertainty: { raDeg: 0.12, decDeg: 0.08, correlation: -0.4 },
    radiusKm: 1080.1,
    radiusSigmaKm: 0.9,
    chi2: 31.2,
    dof: 35,
    reducedChi2: 31.2 / 35,
    sigmaScale: 1,
    familyDeltaChi2: 381.5,
    // The notes as the geometry writes them (packages/geometry/src/joint/joint-fit.ts).
    notes: [
      'χ² = 31.2 for 35 degrees of freedom (χ²/dof = 0.89): the 1-sigma are not rescaled.',
      "The other pole family's best χ² differs by +381.5, more than 9: it is ruled out.",
    ],
    events: [],
    ambiguityResolved: true,
    alternativePole: { raDeg: 80.1, decDeg: -5.2, chi2: 412.7 },
  },
};

function server() {
  return stubFetch((call) => {
    if (call.url === '/api/bodies/b1/comparison?fits=latest-approved') return jsonResponse(200, LATEST);
    if (call.url === '/api/bodies/b1/comparison?fits=approved') return jsonResponse(200, APPROVED);
    if (call.url === '/api/bodies/b1/comparison?fits=all') return jsonResponse(200, ALL);
    if (call.url === '/api/bodies/b1/joint-poles' && call.method === 'POST')
      return jsonResponse(202, { id: 'j1' });
    if (call.url.endsWith('/joint-poles/j1')) return jsonResponse(200, JOB);
    return jsonResponse(404, { message: 'no route' });
  });
}

describe('ComparisonView', () => {
  it('ComparisonView shows each pole with its 1σ and correlation in the table, and its 1σ region on the chart', async () => {
    const withSigma: Comparison = {
      ...LATEST,
      fits: LATEST.fits.map((f, i) =>
        i === 0
          ? {
              ...f,
              rings: f.rings.map((r) => ({
                ...r,
                poles: [
                  {
                    raDeg: 41.1,
                    decDeg: 27.2,
                    uncertainty: { raDeg: 0.35, decDeg: 0.22, correlation: 0.91 },
                  },
                  {
                    raDeg: 80.3,
                    decDeg: -5.4,
                    uncertainty: { raDeg: 0.41, decDeg: 0.18, correlation: -0.87 },
                  },
                ],
              })),
            }
          : f,
      ),
    };
    stubFetch(() => jsonResponse(200, withSigma));
    renderWithProviders(<ComparisonView bodyId="b1" canFitJointPole />);
    const table = await screen.findByRole('table', { name: 'Parameters by event' });
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('41.10 ± 0.35, 27.20 ± 0.22 (ρ 0.91)');
    // A fit stored before pole 1σ shows its values alone.
    expect(rows[2]).toHaveTextContent('41.10, 27.20');
    const chart = screen.getByRole('img', { name: /Pole candidates of ring R1/ });
    expect(chart.querySelectorAll('[data-pole-sigma]')).toHaveLength(2);
  });

  it('ComparisonView tables the latest approved fit of each event with ± 1σ against the event date, from the body route', async () => {
    const calls = server();
    renderWithProviders(<ComparisonView bodyId="b1" canFitJointPole />);
    const table = await screen.findByRole('table', { name: 'Parameters by event' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveAttribute('data-fit', 'a');
    expect(rows[1]).toHaveTextContent('2028-03-14 02:11:00 UTC');
    expect(rows[1]).toHaveTextContent('401.2 ± 1.8');
    expect(rows[1]).toHaveTextContent('0.100 ± 0.012');
    expect(rows[1]).toHaveTextContent('1080.0 ± 2.3');
    expect(rows[1]).not.toHaveTextContent('based on older data');
    expect(rows[2]).toHaveTextContent('based on older data');
    expect(calls[0]?.url).toBe('/api/bodies/b1/comparison?fits=latest-approved');
    expect(
      screen.getByRole('img', { name: 'Centred overlay of 2 limb and 2 ring ellipses' }),
    ).toBeInTheDocument();
    const chart = screen.getByRole('img', { name: 'Pole candidates of ring R1: 4 event solutions' });
    expect(chart.querySelectorAll('[data-pole]')).toHaveLength(4);
  });

  it('ComparisonView shows every approved fit, then every solved fit, on request; an event without a limb shows dashes', async () => {
    server();
    renderWithProviders(<ComparisonView bodyId="b1" canFitJointPole />);
    await screen.findByRole('table', { name: 'Parameters by event' });
    await userEvent.click(screen.getByRole('radio', { name: 'Every approved fit' }));
    await waitFor(() => expect(screen.getAllByRole('row')).toHaveLength(4));
    await userEvent.click(screen.getByRole('radio', { name: 'Every solved fit, approved or not' }));
    await waitFor(() => expect(screen.getAllByRole('row')).toHaveLength(5));
    const last = screen.getAllByRole('row')[4];
    expect(last).toHaveTextContent('not approved');
    expect(last).toHaveTextContent('—');
  });

  it('ComparisonView queues the joint pole over the chosen events and says which pole survives', async () => {
    const calls = server();
    renderWithProviders(<ComparisonView bodyId="b1" canFitJointPole />);
    await screen.findByRole('table', { name: 'Parameters by event' });
    await userEvent.click(screen.getByRole('checkbox', { name: 'Use Event b in the joint pole' }));
    await userEvent.click(screen.getByRole('button', { name: /Fit joint pole of ring R1 \(1 event\)/ }));
    const status = await screen.findByRole('status', { name: 'Joint pole' });
    expect(status).toHaveTextContent('RA 41.02° ± 0.12°, Dec 26.97° ± 0.08°');
    expect(status).toHaveTextContent('(χ²/dof = 0.89)');
    expect(within(status).getByRole('list', { name: 'Joint pole notes' })).toHaveTextContent(
      "The other pole family's best χ² differs by +381.5, more than 9: it is ruled out.",
    );
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ fitIds: ['a'], ring: 'R1' });
    const chart = screen.getByRole('img', { name: /and the joint pole$/ });
    expect(chart.querySelector('[data-role="joint-pole"] ellipse')).not.toBeNull();
  });

  it('ComparisonView lets only modellers and coordinators fit the joint pole', async () => {
    server();
    renderWithProviders(<ComparisonView bodyId="b1" canFitJointPole={false} />);
    await screen.findByRole('table', { name: 'Parameters by event' });
    expect(screen.getByRole('button', { name: /Fit joint pole/ })).toBeDisabled();
  });
});
