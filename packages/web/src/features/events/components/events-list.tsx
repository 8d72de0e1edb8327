import {
  Body1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Title3,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { useEvents } from '../api/get-events';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';

// Fluent's text components are inline; the page reads top to bottom.
const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export function EventsList({ teamId, teamName }: { teamId: string | null; teamName: string | null }) {
  const styles = useStyles();
  const events = useEvents();
  if (events.isPending) return <Loading label="Loading events…" />;
  if (events.isError)
    return <RequestFailed what="events" error={events.error} onRetry={() => void events.refetch()} />;

  const mine = teamId === null ? events.data : events.data.filter((event) => event.teamId === teamId);
  return (
    <section className={styles.section} aria-labelledby="events-heading">
      <Title3 as="h2" id="events-heading">
        Events{teamName === null ? '' : ` of ${teamName}`}
      </Title3>
      {mine.length === 0 ? (
        <Body1 as="p">No events yet</Body1>
      ) : (
        <Table aria-labelledby="events-heading">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Title</TableHeaderCell>
              <TableHeaderCell>Date (UTC)</TableHeaderCell>
              <TableHeaderCell>Stations</TableHeaderCell>
              <TableHeaderCell>Chords</TableHeaderCell>
              <TableHeaderCell>Latest fit</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {mine.map((event) => (
              <TableRow key={event.id}>
                <TableCell>
                  <RouterLink to={paths.event(event.id)}>{event.title}</RouterLink>
                </TableCell>
                <TableCell>{event.eventDate?.slice(0, 10) ?? '—'}</TableCell>
                <TableCell>{event.counts?.stations ?? '—'}</TableCell>
                <TableCell>{event.counts?.chords ?? '—'}</TableCell>
                <TableCell>{event.latestFit?.state ?? 'none'}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
    </section>
  );
}
