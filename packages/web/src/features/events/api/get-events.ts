import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { EventsQuery } from '@limbus/schema';
import { eventsPageSchema, type EventsPage, type EventSummary } from '@limbus/schema/views';
import { apiRequest } from '@/lib/api-client';

export type { EventsPage, EventSummary };
export type EventFitFilter = NonNullable<EventsQuery['fit']>;
export type EventSort = EventsQuery['sort'];

/** Each filter of the latest fit, in words; "in review" and "approved" mean any fit of the event is. */
export const FIT_FILTER_LABELS: Record<EventFitFilter, string> = {
  none: 'No fit yet',
  running: 'Fit running',
  solved: 'Solved, not sent for review',
  in_review: 'In review',
  approved: 'Approved',
  returned: 'Returned',
  failed: 'Fit failed',
};

export const SORT_LABELS: Record<EventSort, string> = {
  'date-desc': 'Event date, newest first',
  'date-asc': 'Event date, oldest first',
  title: 'Title',
  'created-desc': 'Recently created',
};

export const EVENTS_PAGE_SIZE = 25;

/** What the list asks for; the route keeps it in the URL (see eventsListParamsOf). */
export interface EventsListParams {
  teamId: string | null;
  q: string;
  fit: EventFitFilter | null;
  sort: EventSort;
  page: number;
  bodyId: string | null;
  archived: boolean;
  awaitingMyReview: boolean;
}

const isKey = <K extends string>(labels: Record<K, string>, value: string | null): value is K =>
  value !== null && Object.hasOwn(labels, value);

/**
 * The list's state from the page URL (`?q=&fit=&sort=&page=&body=&archived=&awaiting=`); a value the
 * list does not know is read as its default, so an edited link still opens a list.
 */
export function eventsListParamsOf(search: URLSearchParams, teamId: string | null): EventsListParams {
  const fit = search.get('fit');
  const sort = search.get('sort');
  const page = Number(search.get('page'));
  return {
    teamId,
    q: (search.get('q') ?? '').trim(),
    fit: isKey(FIT_FILTER_LABELS, fit) ? fit : null,
    sort: isKey(SORT_LABELS, sort) ? sort : 'date-desc',
    page: Number.isInteger(page) && page >= 1 ? page : 1,
    bodyId: search.get('body') || null,
    archived: search.get('archived') === 'true',
    awaitingMyReview: search.get('awaiting') === 'true',
  };
}

/** The API's query string (eventsQuerySchema) for the list's state. */
export function eventsApiQuery(params: EventsListParams): string {
  const q = new URLSearchParams();
  if (params.teamId !== null) q.set('teamId', params.teamId);
  if (params.q !== '') q.set('q', params.q);
  if (params.fit !== null) q.set('fit', params.fit);
  if (params.bodyId !== null) q.set('bodyId', params.bodyId);
  if (params.archived) q.set('archived', 'true');
  if (params.awaitingMyReview) q.set('awaitingMyReview', 'true');
  q.set('sort', params.sort);
  q.set('page', String(params.page));
  q.set('pageSize', String(EVENTS_PAGE_SIZE));
  return q.toString();
}

export function getEvents(params: EventsListParams, signal?: AbortSignal): Promise<EventsPage> {
  return apiRequest(`/api/events?${eventsApiQuery(params)}`, { schema: eventsPageSchema, signal });
}

/** Everything under it is an event or a list of them; a change to any event invalidates this. */
export const eventsQueryKey = ['events'] as const;

export function eventsQueryOptions(params: EventsListParams) {
  return queryOptions({
    queryKey: [...eventsQueryKey, 'list', params] as const,
    queryFn: ({ signal }) => getEvents(params, signal),
    // The page on screen stays while the next one loads, instead of a spinner in its place.
    placeholderData: keepPreviousData,
  });
}

export function useEvents(params: EventsListParams) {
  return useQuery(eventsQueryOptions(params));
}
