import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ReviewPanel, type ReviewedFit } from './review-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';
import { TEST_SOLUTION } from '@/testing/test-solution';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const AUTHOR = { id: 'u2', name: 'Noor Calder' };
const REVIEWER_ID = 'u4';

// The fit in review: the invented solution with one ring added, run with the oblateness held fixed.
const FIT: ReviewedFit = {
  id: 'f2',
  state: 'solved',
  reviewState: 'in_review',
  createdAt: '2029-05-19T08:30:00.000Z',
  inputMatchesEvent: true,
  createdBy: AUTHOR,
  options: {
    limb: { fixed: { oblateness: 0.082 }, modelErrorKm: 2.5, fitTimeOffsets: ['brackenmoor'] },
    ring: { centerFrom: 'free' },
  },
  solution: {
    ...TEST_SOLUTION,
    rings: [
      {
        ring: 'alpha',
        centerFKm: 1.25,
        centerGKm: -3.5,
        radiusKm: 391.2,
        openingAngleDeg: 28.4,
        positionAngleDeg: 121.7,
        uncertainty: { radiusKm: 0.8, openingAngleDeg: 0.35, positionAngleDeg: 0.6 },
        poles: [
          { raDeg: 151.2, decDeg: 41.3 },
          { raDeg: 20.8, decDeg: -12.6 },
        ],
        crossings: [],
        chi2: 1.2,
        dof: 3,
      },
    ],
  },
};

// The event's history: an earlier fit asked for, returned; then this fit asked for with a message.
const HISTORY = [
  {
    id: 'r3',
    fitId: 'f2',
    fitCreatedAt: '2029-05-19T08:30:00.000Z',
    decision: 'request',
    comment: 'Clock offset of brackenmoor now fitted, as asked.',
    reviewer: AUTHOR,
    createdAt: '2029-05-19T08:40:00.000Z',
  },
  {
    id: 'r1',
    fitId: 'f1',
    fitCreatedAt: '2029-05-18T10:00:00.000Z',
    decision: 'request',
    comment: '',
    reviewer: AUTHOR,
    createdAt: '2029-05-18T10:05:00.000Z',
  },
  {
    id: 'r2',
    fitId: 'f1',
    fitCreatedAt: '2029-05-18T10:00:00.000Z',
    decision: 'return',
    comment: 'Fit the clock offset of brackenmoor',
    reviewer: { id: REVIEWER_ID, name: 'Oren Vale' },
    createdAt: '2029-05-18T11:00:00.000Z',
  },
];

function stubHistory(history: unknown[] = HISTORY) {
  return stubFetch((call) => {
    if (call.method === 'POST') return jsonResponse(200, {});
    if (call.url === '/api/events/e1/reviews') return jsonResponse(200, history);
    return jsonResponse(404, { message: `no stub for ${call.url}` });
  });
}

function valueOf(table: HTMLElement, quantity: string): string {
  return within(table).getByRole('cell', { name: quantity }).closest('tr')?.textContent ?? '';
}

describe('ReviewPanel', () => {
  it('ReviewPanel names the fit under review and shows its numbers with 1σ and units, and its options', async () => {
    stubHistory();
    renderWithProviders(
      <ReviewPanel eventId="e1" fit={FIT} userId={REVIEWER_ID} canRequest={false} canDecide />,
    );
    expect(
      screen.getByRole('heading', { name: 'Under review: the fit of 2029-05-19 08:30:00 UTC' }),
    ).toBeInTheDocument();
    expect(screen.getByText(/Run by Noor Calder on 2029-05-19 08:30:00 UTC/)).toBeInTheDocument();
    const table = screen.getByRole('table', { name: 'Numbers of the fit under review' });
    expect(valueOf(table, 'Equatorial radius')).toBe('Equatorial radius121.4 ± 1.8km');
    expect(valueOf(table, 'Oblateness')).toBe('Oblateness0.0820 (fixed)—');
    expect(valueOf(table, 'Position angle')).toBe('Position angle31.7 ± 4.2°');
    expect(valueOf(table, 'Centre f')).toBe('Centre f1.25 ± 0.90km');
    expect(valueOf(table, 'Centre g')).toBe('Centre g-3.5 ± 2.1km');
    expect(valueOf(table, 'χ²/dof')).toBe('χ²/dof3.10 / 2 = 1.55—');
    expect(valueOf(table, 'Ring alpha radius')).toBe('Ring alpha radius391.20 ± 0.80km');
    expect(valueOf(table, 'Ring alpha opening angle')).toBe('Ring alpha opening angle28.40 ± 0.35°');
    expect(valueOf(table, 'Ring alpha position angle')).toBe('Ring alpha position angle121.70 ± 0.60°');
    expect(valueOf(table, 'Astrometric offset Δα cos δ')).toBe('Astrometric offset Δα cos δ12.30 ± 0.60mas');
    expect(valueOf(table, 'Astrometric offset Δδ')).toBe('Astrometric offset Δδ-4.50 ± 0.80mas');
    const options = screen.getByRole('list', { name: 'Options of the fit under review' });
    expect(
      within(options)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([
      'Held fixed: Oblateness = 0.082',
      'Model error: 2.5 km',
      'Clock offsets fitted for: brackenmoor',
      'Ring centres: fitted freely',
    ]);
    expect(screen.queryByText('Based on older data')).not.toBeInTheDocument();
  });

  it('ReviewPanel pre-selects no decision and sends none until the reviewer picks one', async () => {
    const calls = stubHistory();
    renderWithProviders(
      <ReviewPanel eventId="e1" fit={FIT} userId={REVIEWER_ID} canRequest={false} canDecide />,
    );
    const user = userEvent.setup();
    expect(screen.getByRole('radio', { name: 'Approve (freezes the fit)' })).not.toBeChecked();
    expect(screen.getByRole('radio', { name: 'Return to the modeller' })).not.toBeChecked();
    await user.click(screen.getByRole('button', { name: 'Submit decision' }));
    expect(await screen.findByText('choose whether to approve or return the fit')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);

    await user.click(screen.getByRole('radio', { name: 'Approve (freezes the fit)' }));
    await user.click(screen.getByRole('button', { name: 'Approve fit' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    const post = calls.find((c) => c.method === 'POST');
    expect(post?.url).toBe('/api/fits/f2/reviews');
    expect(post?.body).toEqual({ decision: 'approve', comment: '' });
  });

  it('ReviewPanel will not return a fit without a comment', async () => {
    const calls = stubHistory();
    renderWithProviders(
      <ReviewPanel eventId="e1" fit={FIT} userId={REVIEWER_ID} canRequest={false} canDecide />,
    );
    const user = userEvent.setup();
    await user.click(screen.getByRole('radio', { name: 'Return to the modeller' }));
    await user.click(screen.getByRole('button', { name: 'Return fit' }));
    expect(await screen.findByText('say what must change before it can be approved')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it("ReviewPanel lists the event's whole review history, requests with their messages and an earlier fit's steps marked", async () => {
    stubHistory();
    renderWithProviders(
      <ReviewPanel eventId="e1" fit={FIT} userId={REVIEWER_ID} canRequest={false} canDecide />,
    );
    const history = await screen.findByRole('list', { name: 'Review history' });
    const items = within(history).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([
      '2029-05-18 10:05:00 UTC — Noor Calder asked for review of the fit of 2029-05-18 10:00:00 UTC earlier fit',
      '2029-05-18 11:00:00 UTC — Oren Vale returned the fit of 2029-05-18 10:00:00 UTC: “Fit the clock offset of brackenmoor” earlier fit',
      '2029-05-19 08:40:00 UTC — Noor Calder asked for review of the fit of 2029-05-19 08:30:00 UTC: “Clock offset of brackenmoor now fitted, as asked.”',
    ]);
  });

  it("ReviewPanel lets the fit's author ask for review with a message", async () => {
    const calls = stubHistory([]);
    const fit: ReviewedFit = { ...FIT, reviewState: 'returned' };
    renderWithProviders(
      <ReviewPanel eventId="e1" fit={fit} userId={AUTHOR.id} canRequest canDecide={false} />,
    );
    expect(screen.queryByRole('radio', { name: 'Approve (freezes the fit)' })).not.toBeInTheDocument();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Request review' }));
    // jsdom has no layout, so the dialog cannot move focus to its first field by itself, and until focus is
    // inside, Fluent keeps the dialog aria-hidden; the label query finds the field regardless.
    await user.click(await screen.findByLabelText(/Message to the reviewers/));
    const dialog = screen.getByRole('dialog', { name: /Ask for a review of the fit of 2029-05-19/ });
    await user.paste('Ring centre now free; please look at the ring pole.');
    await user.click(within(dialog).getByRole('button', { name: 'Send request' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST')).toBe(true));
    const post = calls.find((c) => c.method === 'POST');
    expect(post?.url).toBe('/api/fits/f2/review-request');
    expect(post?.body).toEqual({ message: 'Ring centre now free; please look at the ring pole.' });
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
  });

  it("ReviewPanel tells a modeller who is not the fit's author that only the author asks for its review", () => {
    stubHistory([]);
    const fit: ReviewedFit = { ...FIT, reviewState: 'none' };
    renderWithProviders(<ReviewPanel eventId="e1" fit={fit} userId="u9" canRequest canDecide={false} />);
    expect(screen.queryByRole('button', { name: 'Request review' })).not.toBeInTheDocument();
    expect(
      screen.getByText("Only the fit's author, Noor Calder, can ask for its review."),
    ).toBeInTheDocument();
  });

  it('ReviewPanel warns that the fit ran on older data when the event changed since', () => {
    stubHistory([]);
    renderWithProviders(
      <ReviewPanel
        eventId="e1"
        fit={{ ...FIT, inputMatchesEvent: false }}
        userId={REVIEWER_ID}
        canRequest={false}
        canDecide
      />,
    );
    expect(screen.getByText('Based on older data')).toBeInTheDocument();
    expect(
      screen.getByText(
        'The event changed since this fit ran (its chords, stations, ring events, star, ephemeris or DUT1). Run the fit again before relying on it.',
      ),
    ).toBeInTheDocument();
  });
});
