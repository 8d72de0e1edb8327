import {
  Body1,
  Button,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { useEventAudit, type AuditEntryView } from '../api/get-event-audit';
import { actionText, detailText } from './audit-words';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { ScrollArea } from '@/components/scroll-area';
import { paths } from '@/config/paths';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  time: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  id: { fontFamily: tokens.fontFamilyMonospace },
  detail: { color: tokens.colorNeutralForeground2, overflowWrap: 'anywhere' },
  more: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center', flexWrap: 'wrap' },
});

/** How many entries show at first, and how many more each "Show more" adds. */
export const AUDIT_PAGE_SIZE = 50;

function ObjectCell({ eventId, entry }: { eventId: string; entry: AuditEntryView }) {
  const styles = useStyles();
  const shortId = entry.objectId.slice(0, 8);
  // A fit can be opened; the other objects are named by type and the start of their id.
  if (entry.objectType === 'fit')
    return <RouterLink to={paths.eventSection(eventId, 'fits', entry.objectId)}>fit {shortId}</RouterLink>;
  if (entry.objectType === 'event') return <>the event</>;
  return (
    <span title={entry.objectId}>
      {entry.objectType} <span className={styles.id}>{shortId}</span>
    </span>
  );
}

/** The event's audit log for its coordinators: who did what and when, newest first, a page at a time. */
export function AuditPanel({ eventId }: { eventId: string }) {
  const styles = useStyles();
  const audit = useEventAudit(eventId);
  const [shown, setShown] = useState(AUDIT_PAGE_SIZE);
  if (audit.isPending) return <Loading label="Loading the audit log…" />;
  if (audit.isError)
    return <RequestFailed what="the audit log" error={audit.error} onRetry={() => void audit.refetch()} />;
  if (audit.data.length === 0) return <Body1 as="p">Nothing has been recorded for this event yet.</Body1>;
  const newestFirst = [...audit.data].sort(
    (a, b) => b.createdAt.localeCompare(a.createdAt) || b.id.localeCompare(a.id),
  );
  const page = newestFirst.slice(0, shown);
  const left = newestFirst.length - page.length;
  return (
    <section className={styles.panel} aria-label="Audit log">
      <ScrollArea label="Audit log table">
        <Table aria-label="Audit log" size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Time (UTC)</TableHeaderCell>
              <TableHeaderCell>Who</TableHeaderCell>
              <TableHeaderCell>What</TableHeaderCell>
              <TableHeaderCell>Object</TableHeaderCell>
              <TableHeaderCell>Details</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {page.map((entry) => (
              <TableRow key={entry.id}>
                <TableCell className={styles.time}>{utcText(entry.createdAt)}</TableCell>
                <TableCell>
                  {entry.actorName ?? (entry.actorId === null ? 'system' : 'a former member')}
                </TableCell>
                <TableCell>{actionText(entry.action)}</TableCell>
                <TableCell>
                  <ObjectCell eventId={eventId} entry={entry} />
                </TableCell>
                <TableCell className={styles.detail}>{detailText(entry.detail)}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </ScrollArea>
      <div className={styles.more}>
        <Body1>
          Showing {page.length} of {newestFirst.length} entries, newest first.
        </Body1>
        {left > 0 ? (
          <Button onClick={() => setShown((n) => n + AUDIT_PAGE_SIZE)}>
            Show {Math.min(left, AUDIT_PAGE_SIZE)} more
          </Button>
        ) : null}
      </div>
    </section>
  );
}
