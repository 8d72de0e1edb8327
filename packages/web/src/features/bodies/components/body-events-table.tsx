import {
  Body1,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { BodyEventRow } from '../api/get-body';
import { RouterLink } from '@/components/router-link';
import { ScrollArea } from '@/components/scroll-area';
import { StaleFitBadge } from '@/components/stale-fit';
import { paths } from '@/config/paths';
import { fitStatusText } from '@/lib/fit-status-text';
import { utcText } from '@/lib/utc-text';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  // Fluent's table is fixed-layout; these columns must grow to their numbers instead of overlapping.
  table: { tableLayout: 'auto', width: 'max-content', minWidth: '100%' },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end', whiteSpace: 'nowrap' },
  nowrap: { whiteSpace: 'nowrap' },
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS, alignItems: 'start' },
});

type Measured = { value: number; sigma: number };

function Number1({ v }: { v: Measured | undefined }) {
  const styles = useStyles();
  return (
    <TableCell className={styles.number}>
      {v === undefined ? '—' : formatValueSigma(v.value, v.sigma)}
    </TableCell>
  );
}

/**
 * The body's events, each with the limb of its latest approved fit ± 1σ: what the team stands behind,
 * event by event. A fit run on data that has since changed says so.
 */
export function BodyEventsTable({ events }: { events: BodyEventRow[] }) {
  const styles = useStyles();
  if (events.length === 0) return <Body1 as="p">No events of this body yet.</Body1>;
  return (
    <ScrollArea label="Events of the body">
      <Table className={styles.table} aria-label="Events and approved fits" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Event</TableHeaderCell>
            <TableHeaderCell>Date (UTC)</TableHeaderCell>
            <TableHeaderCell>Stations</TableHeaderCell>
            <TableHeaderCell>Chords</TableHeaderCell>
            <TableHeaderCell>Latest fit</TableHeaderCell>
            <TableHeaderCell>Approved fit</TableHeaderCell>
            <TableHeaderCell>Equatorial radius (km)</TableHeaderCell>
            <TableHeaderCell>Oblateness</TableHeaderCell>
            <TableHeaderCell>Position angle (°)</TableHeaderCell>
            <TableHeaderCell>χ² / dof</TableHeaderCell>
            <TableHeaderCell>Ring radii (km)</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {events.map((event) => {
            const approved = event.approvedFit;
            const limb = approved?.limb ?? undefined;
            return (
              <TableRow key={event.id}>
                <TableCell>
                  <RouterLink to={paths.event(event.id)}>{event.title}</RouterLink>
                </TableCell>
                <TableCell className={styles.nowrap}>{utcText(event.eventTimeUtc)}</TableCell>
                <TableCell className={styles.number}>{event.counts.stations}</TableCell>
                <TableCell className={styles.number}>{event.counts.chords}</TableCell>
                <TableCell>
                  <div className={styles.stack}>
                    {fitStatusText(event.latestFit)}
                    {event.latestFit !== null && !event.latestFit.inputMatchesEvent ? (
                      <StaleFitBadge />
                    ) : null}
                  </div>
                </TableCell>
                <TableCell>
                  {approved === null ? (
                    'none'
                  ) : (
                    <div className={styles.stack}>
                      <RouterLink to={paths.eventSection(event.id, 'fits', approved.id)}>
                        {utcText(approved.createdAt)}
                      </RouterLink>
                      {approved.inputMatchesEvent ? null : <StaleFitBadge />}
                    </div>
                  )}
                </TableCell>
                <Number1 v={limb?.equatorialRadiusKm} />
                <Number1 v={limb?.oblateness} />
                <Number1 v={limb?.positionAngleDeg} />
                <TableCell className={styles.number}>
                  {limb === undefined ? '—' : `${limb.chi2.toFixed(2)} / ${limb.dof}`}
                </TableCell>
                <TableCell className={styles.number}>
                  {approved === null || approved.rings.length === 0
                    ? '—'
                    : approved.rings
                        .map((r) => `${r.ring}: ${formatValueSigma(r.radiusKm.value, r.radiusKm.sigma)}`)
                        .join('; ')}
                </TableCell>
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
