import { Badge, Body1, makeStyles, tokens } from '@fluentui/react-components';
import { useEventReviews, type ReviewEntry } from '../api/get-event-reviews';
import { Loading, RequestFailed } from '@/components/request-state';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  history: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
  },
});

const VERBS: Record<ReviewEntry['decision'], string> = {
  request: 'asked for review of',
  approve: 'approved',
  return: 'returned',
};

/** One step in words: "2029-05-18 11:00:00 UTC — Oren Vale returned the fit of …: “…”". */
export function reviewEntryText(entry: ReviewEntry): string {
  const said = entry.comment === '' ? '' : `: “${entry.comment}”`;
  return `${utcText(entry.createdAt)} — ${entry.reviewer.name} ${VERBS[entry.decision]} the fit of ${utcText(entry.fitCreatedAt)}${said}`;
}

/**
 * The event's whole review history, oldest first: every fit's requests (with their messages), approvals
 * and returns, so what a reviewer asked for survives the re-run it led to. Steps of another fit than the
 * one shown say so.
 */
export function ReviewHistory({ eventId, fit }: { eventId: string; fit: { id: string; createdAt: string } }) {
  const styles = useStyles();
  const reviews = useEventReviews(eventId);
  if (reviews.isPending) return <Loading label="Loading the review history…" />;
  if (reviews.isError)
    return (
      <RequestFailed what="the review history" error={reviews.error} onRetry={() => void reviews.refetch()} />
    );
  if (reviews.data.length === 0)
    return <Body1 as="p">No fit of this event has been sent for review yet.</Body1>;
  const oldestFirst = [...reviews.data].sort(
    (a, b) => a.createdAt.localeCompare(b.createdAt) || a.id.localeCompare(b.id),
  );
  return (
    <ol className={styles.history} aria-label="Review history">
      {oldestFirst.map((entry) => (
        <li key={entry.id}>
          {reviewEntryText(entry)}
          {entry.fitId === fit.id ? null : (
            <>
              {' '}
              <Badge appearance="outline" color="informative">
                {Date.parse(entry.fitCreatedAt) < Date.parse(fit.createdAt) ? 'earlier fit' : 'later fit'}
              </Badge>
            </>
          )}
        </li>
      ))}
    </ol>
  );
}
