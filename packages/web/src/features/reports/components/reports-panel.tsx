import {
  Badge,
  Body1,
  Button,
  Field,
  makeStyles,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { useReports, type Report } from '../api/get-reports';
import { rejectInputSchema, useDecideReport } from '../api/review-report';
import { ReportForm, type ReportStation } from './report-form';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'end' },
  time: { fontFamily: tokens.fontFamilyMonospace, overflowWrap: 'anywhere' },
  scroll: { overflowX: 'auto' },
  // Fluent tables share the width equally; the timings need more of it than the state does.
  table: { tableLayout: 'auto' },
});

/** One line per timing, so a long ISO time wraps between marks and never runs into the next column. */
function timings(r: Report): string[] {
  if (r.result === 'positive' && r.disappearance && r.reappearance)
    return [
      `D ${r.disappearance.time} ± ${r.disappearance.sigmaSeconds} s`,
      `R ${r.reappearance.time} ± ${r.reappearance.sigmaSeconds} s`,
    ];
  if (r.result === 'negative' && r.observedFromUtc && r.observedToUtc)
    return [`from ${r.observedFromUtc}`, `to ${r.observedToUtc}`];
  return ['—'];
}

function Decide({ eventId, report }: { eventId: string; report: Report }) {
  const styles = useStyles();
  const decide = useDecideReport(eventId);
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const name = `report of ${report.authorName ?? 'the observer'}`;
  const reject = () => {
    const parsed = rejectInputSchema.safeParse({ reason });
    if (!parsed.success) {
      setReasonError(parsed.error.issues[0]?.message);
      return;
    }
    decide.mutate({ reportId: report.id, accept: false, reason: parsed.data.reason });
  };
  return (
    <div className={styles.actions}>
      {rejecting ? (
        <>
          <Field label={`Reason for rejecting the ${name}`} validationMessage={reasonError}>
            <Textarea value={reason} onChange={(_, d) => setReason(d.value)} />
          </Field>
          <Button onClick={reject} disabled={decide.isPending}>
            Send rejection
          </Button>
          <Button onClick={() => setRejecting(false)}>Cancel</Button>
        </>
      ) : (
        <>
          <Button
            appearance="primary"
            aria-label={`Accept ${name}`}
            disabled={decide.isPending}
            onClick={() => decide.mutate({ reportId: report.id, accept: true })}
          >
            Accept
          </Button>
          <Button aria-label={`Reject ${name}`} onClick={() => setRejecting(true)}>
            Reject…
          </Button>
        </>
      )}
      {decide.isError ? (
        <FormError title="The decision was not saved" message={errorMessage(decide.error)} />
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
  /** Coordinators accept and reject; others only see. */
  canDecide: boolean;
}

/**
 * Observer reports. The server already limits an observer to their own reports; this view also offers
 * the report form only for the user's own stations.
 */
export function ReportsPanel({ eventId, stations, ownStationIds, canDecide }: ReportsPanelProps) {
  const styles = useStyles();
  const reports = useReports(eventId);
  const [editing, setEditing] = useState<string | 'new' | null>(null);
  if (reports.isPending) return <Loading label="Loading reports…" />;
  if (reports.isError)
    return <RequestFailed what="the reports" error={reports.error} onRetry={() => void reports.refetch()} />;
  const codeOf = new Map(stations.map((s) => [s.id, s.code]));
  const own = stations.filter((s) => ownStationIds.includes(s.id));
  const editedReport =
    editing === null || editing === 'new' ? null : (reports.data.find((r) => r.id === editing) ?? null);

  return (
    <section className={styles.panel} aria-label="Observer reports">
      {reports.data.length === 0 ? (
        <Body1 as="p">No reports yet.</Body1>
      ) : (
        <div className={styles.scroll}>
          <Table className={styles.table} aria-label="Reports" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Station</TableHeaderCell>
                <TableHeaderCell>Observer</TableHeaderCell>
                <TableHeaderCell>Result</TableHeaderCell>
                <TableHeaderCell>Timings</TableHeaderCell>
                <TableHeaderCell>State</TableHeaderCell>
                <TableHeaderCell>Actions</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {reports.data.map((r) => (
                <TableRow key={r.id}>
                  <TableCell>{codeOf.get(r.stationId) ?? r.stationId}</TableCell>
                  <TableCell>{r.authorName ?? '—'}</TableCell>
                  <TableCell>{r.result.replace('_', ' ')}</TableCell>
                  <TableCell>
                    {timings(r).map((line) => (
                      <div key={line} className={styles.time}>
                        {line}
                      </div>
                    ))}
                  </TableCell>
                  <TableCell>
                    <Badge
                      appearance={r.state === 'accepted' ? 'filled' : 'outline'}
                      color={
                        r.state === 'rejected' ? 'danger' : r.state === 'accepted' ? 'success' : 'informative'
                      }
                    >
                      {r.state}
                    </Badge>
                    {r.state === 'rejected' && r.rejectReason ? (
                      <Body1 as="p">Reason: {r.rejectReason}</Body1>
                    ) : null}
                  </TableCell>
                  <TableCell>
                    {canDecide && r.state !== 'accepted' ? <Decide eventId={eventId} report={r} /> : null}
                    {ownStationIds.includes(r.stationId) && r.state !== 'accepted' ? (
                      <Button size="small" onClick={() => setEditing(r.id)}>
                        Edit
                      </Button>
                    ) : null}
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </div>
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
    </section>
  );
}
