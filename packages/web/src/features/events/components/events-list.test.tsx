import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { EventSummary, EventsPage } from '../api/get-events';
import { EventsList, type EventsListProps } from './events-list';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// An invented event of the demo body; its latest fit is in review, and an earlier one too.
const NIGHT_ONE: EventSummary = {
  id: 'e1',
  title: 'Quillon occults a 13th-magnitude star, night one',
  teamId: 't1',
  bodyId: 'b1',
  bodyName: 'Quillon',
  eventTimeUtc: '2029-05-17T03:12:30Z',
  deletedAt: null,
  star: { raDeg: 210.1, decDeg: -12.3 },
  counts: { stations: 13, chords: 9, reports: 11, fits: 3, myStations: 2, openReports: 4 },
  latestFit: {
    id: 'f3',
    state: 'solved',
    reviewState: 'in_review',
    createdAt: '2029-05-19T08:00:00.000Z',
    inputMatchesEvent: true,
  },
  fitsInReview: 2,
};

const page = (items: EventSummary[], pageNumber = 1, total = items.length): EventsPage => ({
  items,
  total,
  page: pageNumber,
  pageSize: 25,
});

const PROPS: EventsListProps = {
  teamId: 't1',
  teamName: 'Outer Belt Timing Group',
  bodies: [
    { id: 'b1', name: 'Quillon' },
    { id: 'b2', name: 'Brask' },
  ],
  canReview: false,
  canRestore: false,
  showOwnStations: false,
};

/** The API's query of a recorded call, as a plain object. */
const queryOf = (url: string | undefined) => Object.fromEntries(new URL(url ?? '', 'http://x').searchParams);

describe('EventsList', () => {
  it('EventsList asks GET /api/events with the search, filter, body, sort and page of the URL, and tables the answer', async () => {
    const calls = stubFetch(() => jsonResponse(200, page([NIGHT_ONE], 2, 112)));
    renderWithProviders(<EventsList {...PROPS} showOwnStations />, {
      initialEntries: ['/events?q=night&fit=in_review&sort=title&page=2&body=b1'],
    });
    const table = await screen.findByRole('table', { name: 'Events of Outer Belt Timing Group' });
    expect(new URL(calls[0]?.url ?? '', 'http://x').pathname).toBe('/api/events');
    expect(queryOf(calls[0]?.url)).toEqual({
      teamId: 't1',
      q: 'night',
      fit: 'in_review',
      bodyId: 'b1',
      sort: 'title',
      page: '2',
      pageSize: '25',
    });
    expect(screen.getByRole('searchbox', { name: 'Search title or body' })).toHaveValue('night');
    expect(screen.getByRole('combobox', { name: 'Latest fit' })).toHaveValue('in_review');
    const row = within(table).getByRole('row', { name: /night one/ });
    expect(within(row).getByRole('link', { name: NIGHT_ONE.title })).toHaveAttribute('href', '/events/e1');
    expect(within(row).getByRole('link', { name: 'Quillon' })).toHaveAttribute('href', '/bodies/b1');
    expect(row).toHaveTextContent('2029-05-17 03:12 UTC');
    expect(row).toHaveTextContent('2 of 13 stations yours');
    // In review, never plain "solved"; the other fit waiting in review is counted beside it.
    expect(row).toHaveTextContent('Solved, in review· 1 earlier fit in review');
    expect(screen.getByRole('status')).toHaveTextContent('Page 2 of 5 · 112 events');
  });

  it('EventsList puts each filter, the sort and the page in the request, starting again at page 1 on a change', async () => {
    const calls = stubFetch((call) => {
      const q = queryOf(call.url);
      return jsonResponse(200, page([NIGHT_ONE], Number(q.page), 60));
    });
    const user = userEvent.setup();
    renderWithProviders(<EventsList {...PROPS} />, { initialEntries: ['/events'] });
    await screen.findByRole('table');
    expect(queryOf(calls[0]?.url)).toEqual({ teamId: 't1', sort: 'date-desc', page: '1', pageSize: '25' });
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    await waitFor(() => expect(queryOf(calls.at(-1)?.url).page).toBe('2'));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Latest fit' }), 'Approved');
    await waitFor(() => expect(queryOf(calls.at(-1)?.url)).toMatchObject({ fit: 'approved', page: '1' }));
    await user.selectOptions(screen.getByRole('combobox', { name: 'Body' }), 'Brask');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Sort by' }), 'Event date, oldest first');
    await user.type(screen.getByRole('searchbox', { name: 'Search title or body' }), 'Quill');
    await user.click(screen.getByRole('button', { name: 'Search' }));
    await waitFor(() =>
      expect(queryOf(calls.at(-1)?.url)).toEqual({
        teamId: 't1',
        q: 'Quill',
        fit: 'approved',
        bodyId: 'b2',
        sort: 'date-asc',
        page: '1',
        pageSize: '25',
      }),
    );
    expect(screen.getByRole('status')).toHaveTextContent('Page 1 of 3 · 60 events');
    expect(screen.getByRole('button', { name: 'Previous page' })).toBeDisabled();
  });

  it('EventsList offers "Awaiting my review" to reviewers only, and asks for it', async () => {
    const calls = stubFetch(() => jsonResponse(200, page([])));
    const { unmount } = renderWithProviders(<EventsList {...PROPS} />, {
      initialEntries: ['/events?awaiting=true'],
    });
    await screen.findByText('No events yet');
    expect(screen.queryByRole('switch', { name: 'Awaiting my review' })).not.toBeInTheDocument();
    // A shared link does not narrow the list for someone who reviews nothing.
    expect(queryOf(calls[0]?.url).awaitingMyReview).toBeUndefined();
    unmount();
    renderWithProviders(<EventsList {...PROPS} canReview />, { initialEntries: ['/events'] });
    await userEvent.click(await screen.findByRole('switch', { name: 'Awaiting my review' }));
    await waitFor(() => expect(queryOf(calls.at(-1)?.url).awaitingMyReview).toBe('true'));
    expect(await screen.findByText('No events match these filters.')).toBeInTheDocument();
  });

  it('EventsList shows coordinators the archived events and restores one', async () => {
    let archived = [
      { ...NIGHT_ONE, id: 'e9', title: 'A mistaken event', deletedAt: '2029-06-01T12:00:00.000Z' },
    ];
    const calls = stubFetch((call) => {
      if (call.method === 'POST') {
        archived = [];
        return jsonResponse(200, {});
      }
      return jsonResponse(200, page(queryOf(call.url).archived === 'true' ? archived : [NIGHT_ONE]));
    });
    const user = userEvent.setup();
    renderWithProviders(<EventsList {...PROPS} canRestore />, { initialEntries: ['/events'] });
    await screen.findByRole('table', { name: 'Events of Outer Belt Timing Group' });
    await user.click(screen.getByRole('switch', { name: 'Archived events' }));
    const table = await screen.findByRole('table', { name: 'Archived events of Outer Belt Timing Group' });
    const row = within(table).getByRole('row', { name: /A mistaken event/ });
    expect(row).toHaveTextContent('2029-06-01 12:00:00 UTC');
    await user.click(within(row).getByRole('button', { name: 'Restore A mistaken event' }));
    expect(await screen.findByText('No archived events.')).toBeInTheDocument();
    expect(calls.find((c) => c.method === 'POST')?.url).toBe('/api/events/e9/restore');
  });

  it('EventsList says what failed and retries on request', async () => {
    let attempts = 0;
    stubFetch(() => {
      attempts += 1;
      return attempts === 1
        ? jsonResponse(500, { statusCode: 500, message: 'Database down' })
        : jsonResponse(200, page([]));
    });
    renderWithProviders(<EventsList {...PROPS} teamName={null} />);
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Could not load events');
    expect(alert).toHaveTextContent('Database down');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Retry' }));
    expect(await screen.findByText('No events yet')).toBeInTheDocument();
  });
});
