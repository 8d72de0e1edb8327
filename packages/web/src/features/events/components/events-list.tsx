import {
  Body1,
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  Select,
  Switch,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Title3,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  EVENTS_PAGE_SIZE,
  eventsListParamsOf,
  FIT_FILTER_LABELS,
  SORT_LABELS,
  useEvents,
  type EventFitFilter,
  type EventSort,
  type EventSummary,
} from '../api/get-events';
import { useRestoreEvent } from '../api/restore-event';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { ScrollArea } from '@/components/scroll-area';
import { StaleFitBadge } from '@/components/stale-fit';
import { paths } from '@/config/paths';
import { fitStatusText } from '@/lib/fit-status-text';
import { utcText } from '@/lib/utc-text';

// Fluent's text components are inline; the page reads top to bottom.
const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  filters: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalL,
    alignItems: 'end',
  },
  search: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'end' },
  table: { tableLayout: 'auto', width: 'max-content', minWidth: '100%' },
  number: { textAlign: 'end' },
  nowrap: { whiteSpace: 'nowrap' },
  fit: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS, alignItems: 'center' },
  pager: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center' },
});

export interface EventsListProps {
  teamId: string | null;
  teamName: string | null;
  /** The team's bodies, for the body filter. */
  bodies: Array<{ id: string; name: string }>;
  /** Reviewers (and site admins) may narrow the list to fits waiting for their review. */
  canReview: boolean;
  /** Coordinators see archived (deleted) events and restore them. */
  canRestore: boolean;
  /** Observers see how many of an event's stations are theirs. */
  showOwnStations: boolean;
}

/** The latest fit in words, review first, with the other fits of the event still in review. */
function LatestFit({ event }: { event: EventSummary }) {
  const styles = useStyles();
  const fit = event.latestFit;
  const latestInReview = fit?.state === 'solved' && fit.reviewState === 'in_review' ? 1 : 0;
  const othersInReview = event.fitsInReview - latestInReview;
  return (
    <div className={styles.fit}>
      <span>{fitStatusText(fit)}</span>
      {othersInReview > 0 ? (
        <Caption1>
          · {othersInReview} {othersInReview === 1 ? 'earlier fit' : 'earlier fits'} in review
        </Caption1>
      ) : null}
      {fit !== null && !fit.inputMatchesEvent ? <StaleFitBadge /> : null}
    </div>
  );
}

function RestoreButton({ event }: { event: EventSummary }) {
  const restore = useRestoreEvent();
  return (
    <>
      <Button
        size="small"
        aria-label={`Restore ${event.title}`}
        disabled={restore.isPending}
        onClick={() => restore.mutate(event.id)}
      >
        Restore
      </Button>
      {restore.isError ? (
        <FormError title={`${event.title} was not restored`} message={errorMessage(restore.error)} />
      ) : null}
    </>
  );
}

/**
 * The team's events, one page at a time: searched, filtered by body and by where the latest fit stands,
 * and sorted, all kept in the URL so a link (or the back button) opens the same list.
 */
export function EventsList({
  teamId,
  teamName,
  bodies,
  canReview,
  canRestore,
  showOwnStations,
}: EventsListProps) {
  const styles = useStyles();
  const [search, setSearch] = useSearchParams();
  const params = eventsListParamsOf(search, teamId);
  // Archived events are the coordinators' to see; a shared link does not open them for anyone else.
  const shown = {
    ...params,
    archived: canRestore && params.archived,
    awaitingMyReview: canReview && params.awaitingMyReview,
  };
  const events = useEvents(shown);
  const [typed, setTyped] = useState(params.q);

  /** Changes one setting; any change but paging starts again on page 1. */
  const update = (changes: Record<string, string | null>) =>
    setSearch((old) => {
      const next = new URLSearchParams(old);
      for (const [key, value] of Object.entries(changes)) {
        if (value === null || value === '') next.delete(key);
        else next.set(key, value);
      }
      if (!('page' in changes)) next.delete('page');
      return next;
    });

  const onSearch = (event: FormEvent) => {
    event.preventDefault();
    update({ q: typed.trim() });
  };

  const filtered = shown.q !== '' || shown.fit !== null || shown.bodyId !== null || shown.awaitingMyReview;
  const heading = shown.archived ? 'Archived events' : 'Events';

  return (
    <section className={styles.section} aria-labelledby="events-heading">
      <Title3 as="h2" id="events-heading">
        {heading}
        {teamName === null ? '' : ` of ${teamName}`}
      </Title3>
      <div className={styles.filters}>
        <form className={styles.search} role="search" aria-label="Search events" onSubmit={onSearch}>
          <Field label="Search title or body">
            <Input type="search" value={typed} onChange={(_, d) => setTyped(d.value)} />
          </Field>
          <Button type="submit">Search</Button>
        </form>
        <Field label="Latest fit">
          <Select value={shown.fit ?? ''} onChange={(_, d) => update({ fit: d.value })}>
            <option value="">Any</option>
            {(Object.keys(FIT_FILTER_LABELS) as EventFitFilter[]).map((key) => (
              <option key={key} value={key}>
                {FIT_FILTER_LABELS[key]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Body">
          <Select value={shown.bodyId ?? ''} onChange={(_, d) => update({ body: d.value })}>
            <option value="">All bodies</option>
            {bodies.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Sort by">
          <Select
            value={shown.sort}
            onChange={(_, d) => update({ sort: d.value === 'date-desc' ? null : d.value })}
          >
            {(Object.keys(SORT_LABELS) as EventSort[]).map((key) => (
              <option key={key} value={key}>
                {SORT_LABELS[key]}
              </option>
            ))}
          </Select>
        </Field>
        {canReview ? (
          <Switch
            label="Awaiting my review"
            checked={shown.awaitingMyReview}
            onChange={(_, d) => update({ awaiting: d.checked ? 'true' : null })}
          />
        ) : null}
        {canRestore ? (
          <Switch
            label="Archived events"
            checked={shown.archived}
            onChange={(_, d) => update({ archived: d.checked ? 'true' : null })}
          />
        ) : null}
      </div>
      {events.isPending ? (
        <Loading label="Loading events…" />
      ) : events.isError ? (
        <RequestFailed what="events" error={events.error} onRetry={() => void events.refetch()} />
      ) : events.data.items.length === 0 ? (
        <Body1 as="p">
          {filtered
            ? 'No events match these filters.'
            : shown.archived
              ? 'No archived events.'
              : 'No events yet'}
        </Body1>
      ) : (
        <>
          <ScrollArea label="Events table">
            <Table className={styles.table} aria-labelledby="events-heading" size="small">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Title</TableHeaderCell>
                  <TableHeaderCell>Body</TableHeaderCell>
                  <TableHeaderCell>Date (UTC)</TableHeaderCell>
                  <TableHeaderCell>Stations</TableHeaderCell>
                  {showOwnStations ? <TableHeaderCell>Your stations</TableHeaderCell> : null}
                  <TableHeaderCell>Chords</TableHeaderCell>
                  <TableHeaderCell>Open reports</TableHeaderCell>
                  <TableHeaderCell>Latest fit</TableHeaderCell>
                  {shown.archived ? <TableHeaderCell>Archived</TableHeaderCell> : null}
                  {shown.archived ? <TableHeaderCell>Restore</TableHeaderCell> : null}
                </TableRow>
              </TableHeader>
              <TableBody>
                {events.data.items.map((event) => (
                  <TableRow key={event.id}>
                    <TableCell>
                      {shown.archived ? (
                        event.title
                      ) : (
                        <RouterLink to={paths.event(event.id)}>{event.title}</RouterLink>
                      )}
                    </TableCell>
                    <TableCell>
                      <RouterLink to={paths.body(event.bodyId)}>{event.bodyName}</RouterLink>
                    </TableCell>
                    <TableCell className={styles.nowrap}>{utcText(event.eventTimeUtc, 'minutes')}</TableCell>
                    <TableCell className={styles.number}>{event.counts.stations}</TableCell>
                    {showOwnStations ? (
                      <TableCell className={styles.nowrap}>
                        {event.counts.myStations} of {event.counts.stations} stations yours
                      </TableCell>
                    ) : null}
                    <TableCell className={styles.number}>{event.counts.chords}</TableCell>
                    <TableCell className={styles.number}>{event.counts.openReports}</TableCell>
                    <TableCell>
                      <LatestFit event={event} />
                    </TableCell>
                    {shown.archived ? (
                      <TableCell className={styles.nowrap}>
                        {event.deletedAt === null ? '—' : utcText(event.deletedAt)}
                      </TableCell>
                    ) : null}
                    {shown.archived ? (
                      <TableCell>
                        <RestoreButton event={event} />
                      </TableCell>
                    ) : null}
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          </ScrollArea>
          <Pager
            page={events.data.page}
            total={events.data.total}
            pageSize={events.data.pageSize}
            onPage={(page) => update({ page: page === 1 ? null : String(page) })}
          />
        </>
      )}
    </section>
  );
}

function Pager({
  page,
  total,
  pageSize,
  onPage,
}: {
  page: number;
  total: number;
  pageSize: number;
  onPage: (page: number) => void;
}) {
  const styles = useStyles();
  const pages = Math.max(1, Math.ceil(total / (pageSize || EVENTS_PAGE_SIZE)));
  return (
    <nav className={styles.pager} aria-label="Pages of events">
      <Button disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous page
      </Button>
      <Body1 role="status">
        Page {page} of {pages} · {total} {total === 1 ? 'event' : 'events'}
      </Body1>
      <Button disabled={page >= pages} onClick={() => onPage(page + 1)}>
        Next page
      </Button>
    </nav>
  );
}
