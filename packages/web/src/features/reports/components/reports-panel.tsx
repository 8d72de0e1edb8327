import {
  Badge,
  Body1,
  Button,
  makeStyles,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { useReports, waitingForTiming, type Report } from '../api/get-reports';
import { CorrectionCard } from './correction-card';
import { DecideReport } from './decide-report';
import { ReportDetails } from './report-details';
import { ReportForm, type ReportStation } from './report-form';
import { pendingCorrection, RESULT_WORDS, stateText } from './report-text';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';
import { markText, utcInstantText } from '@/components/timing-text';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  time: { fontFamily: tokens.fontFamilyMonospace, overflowWrap: 'anywhere' },
  badges: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
  // A state such as "accepted — times from a light-curve timing" wraps inside its badge, not out of it.
  stateBadge: {
    height: 'auto',
    minHeight: '20px',
    whiteSpace: 'normal',
    paddingTop: '2px',
    paddingBottom: '2px',
  },
  // Fluent tables share the width equally; the timings need more of it than the state does.
  table: { tableLayout: 'auto' },
  list: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

/** One line per timing, so a long time wraps between marks and never runs into the next column. */
function timings(r: Report): string[] {
  const dips = r.ringDips.map((d) => `${d.ring} dip ${markText(d.start)} to ${markText(d.end)}`);
  if (r.result === 'positive') {
    // Once its curve is timed into the chord, the report shows the chord's times, not the rough typed ones.
    const timed = r.chord?.source === 'timing' ? r.chord : null;
    const marks = timed ?? r;
    const lines = [
      ...(marks.disappearance ? [`D ${markText(marks.disappearance)}`] : []),
      ...(marks.reappearance ? [`R ${markText(marks.reappearance)}`] : []),
    ];
    if (timed !== null) lines.push('timed from the light curve');
    else if (r.timesFromLightCurve) lines.push('to be timed from the light curve');
    return [...lines, ...dips];
  }
  if (r.result === 'negative' && r.observedFromUtc && r.observedToUtc)
    return [`from ${utcInstantText(r.observedFromUtc)}`, `to ${utcInstantText(r.observedToUtc)}`, ...dips];
  return ['—'];
}

function StateBadges({ report, canDecide }: { report: Report; canDecide: boolean }) {
  const styles = useStyles();
  const r = report;
  return (
    <div className={styles.badges}>
      <Badge
        className={styles.stateBadge}
        appearance={r.state === 'accepted' ? 'filled' : 'outline'}
        color={
          r.state === 'rejected'
            ? 'danger'
            : r.state === 'accepted'
              ? 'success'
              : waitingForTiming(r)
                ? 'warning'
                : 'informative'
        }
      >
        {stateText(r)}
      </Badge>
      {canDecide && pendingCorrection(r) !== null ? (
        <Badge appearance="tint" color="warning">
          correction requested
        </Badge>
      ) : null}
    </div>
  );
}

export interface ReportsPanelProps {
  eventId: string;
  /** Every station of the event, to name the station of each report. */
  stations: ReportStation[];
  /** The stations the signed-in user observes from; they report only for these. */
  ownStationIds: string[];
  /** Coordinators accept and reject reports and corrections; others only see. */
  canDecide: boolean;
}

/**
 * Observer reports. The server already limits an observer to their own reports; this view also offers
 * the report form only for the user's own stations, and shows each of the user's reports in full.
 */
export function ReportsPanel({ eventId, stations, ownStationIds, canDecide }: ReportsPanelProps) {
  const styles = useStyles();
  const reports = useReports(eventId);
  const [editing, setEditing] = useState<string | 'new' | null>(null);
  if (reports.isPending) return <Loading label="Loading reports…" />;
  if (reports.isError)
    return <RequestFailed what="the reports" error={reports.error} onRetry={() => void reports.refetch()} />;
  const own = stations.filter((s) => ownStationIds.includes(s.id));
  const ownReports = reports.data.filter((r) => ownStationIds.includes(r.stationId));
  const pending = canDecide ? reports.data.filter((r) => pendingCorrection(r) !== null) : [];
  const editedReport =
    editing === null || editing === 'new' ? null : (reports.data.find((r) => r.id === editing) ?? null);

  return (
    <section className={styles.panel} aria-label="Observer reports">
      {reports.data.length === 0 ? (
        <Body1 as="p">No reports yet.</Body1>
      ) : (
        <ScrollArea label="Reports table">
          <Table className={styles.table} aria-label="Reports" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Station</TableHeaderCell>
                <TableHeaderCell>Observer</TableHeaderCell>
                <TableHeaderCell>Result</TableHeaderCell>
                <TableHeaderCell>Timings (UTC, 1σ)</TableHeaderCell>
                <TableHeaderCell>State</TableHeaderCell>
                <TableHeaderCell>Actions</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {reports.data.map((r) => (
                <TableRow key={r.id}>
                  <TableCell>{r.station}</TableCell>
                  <TableCell>{r.authorName}</TableCell>
                  <TableCell>{RESULT_WORDS[r.result]}</TableCell>
                  <TableCell>
                    {timings(r).map((line) => (
                      <div key={line} className={styles.time}>
                        {line}
                      </div>
                    ))}
                  </TableCell>
                  <TableCell>
                    <StateBadges report={r} canDecide={canDecide} />
                    {r.state === 'rejected' && r.rejectReason ? (
                      <Body1 as="p">Reason: {r.rejectReason}</Body1>
                    ) : null}
                  </TableCell>
                  <TableCell>
                    {canDecide && r.state !== 'accepted' ? (
                      <DecideReport eventId={eventId} report={r} />
                    ) : null}
                    {ownStationIds.includes(r.stationId) && r.state !== 'accepted' ? (
                      <Button
                        size="small"
                        aria-label={`Edit the report for ${r.station}`}
                        onClick={() => setEditing(r.id)}
                      >
                        Edit
                      </Button>
                    ) : null}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </ScrollArea>
      )}
      {own.length > 0 && editing === null ? (
        <div>
          <Button onClick={() => setEditing('new')}>New report</Button>
        </div>
      ) : null}
      {editing !== null && own.length > 0 ? (
        <section aria-label="Report form">
          <Subtitle2 as="h4">{editedReport === null ? 'New report' : 'Edit report'}</Subtitle2>
          <ReportForm
            key={editing}
            eventId={eventId}
            stations={own}
            report={editedReport}
            onSaved={() => setEditing(null)}
          />
          <Button onClick={() => setEditing(null)}>Close the form</Button>
        </section>
      ) : null}
      {pending.length > 0 ? (
        <section className={styles.list} aria-label="Corrections waiting for a decision">
          <Subtitle2 as="h4">Corrections waiting for a decision</Subtitle2>
          {pending.map((r) => {
            const correction = pendingCorrection(r);
            return correction === null ? null : (
              <CorrectionCard
                key={correction.id}
                eventId={eventId}
                report={r}
                correction={correction}
                canDecide
              />
            );
          })}
        </section>
      ) : null}
      {ownReports.length > 0 ? (
        <section className={styles.list} aria-label="Your reports">
          <Subtitle2 as="h4">Your reports</Subtitle2>
          {ownReports.map((r) => (
            <ReportDetails key={r.id} eventId={eventId} report={r} stations={own} />
          ))}
        </section>
      ) : null}
    </section>
  );
}
