import {
  Badge,
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
import { useDecideCorrection } from '../api/decide-correction';
import type { Report, ReportCorrection } from '../api/get-reports';
import { AcceptOrReject } from './accept-or-reject';
import { CORRECTION_FIELDS, currentValue, fieldValueText } from './report-text';
import { ScrollArea } from '@/components/scroll-area';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  card: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    padding: tokens.spacingHorizontalM,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
  },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'end' },
  value: { fontFamily: tokens.fontFamilyMonospace, overflowWrap: 'anywhere' },
});

const STATE_COLOURS = { pending: 'warning', accepted: 'success', rejected: 'danger' } as const;

function Decide({
  eventId,
  report,
  correction,
}: {
  eventId: string;
  report: Report;
  correction: ReportCorrection;
}) {
  const decide = useDecideCorrection(eventId);
  const ids = { reportId: report.id, correctionId: correction.id };
  return (
    <AcceptOrReject
      who={`correction of ${correction.author.name}`}
      pending={decide.isPending}
      error={decide.error}
      onAccept={(replaceTimedChord) => decide.mutate({ ...ids, accept: true, replaceTimedChord })}
      onReject={(reason) => decide.mutate({ ...ids, accept: false, reason })}
      onKeep={() => decide.reset()}
    />
  );
}

/**
 * One correction an observer asked for: the message, each changed field beside the report's value
 * (while it is pending; after a decision only the proposed values mean anything), and how it ended.
 */
export function CorrectionCard({
  eventId,
  report,
  correction,
  canDecide,
}: {
  eventId: string;
  report: Report;
  correction: ReportCorrection;
  canDecide: boolean;
}) {
  const styles = useStyles();
  const pending = correction.state === 'pending';
  const fields = CORRECTION_FIELDS.filter(([field]) => field in correction.changes);
  const label = `Correction of the report for ${report.station}, asked ${utcText(correction.createdAt)}`;
  return (
    <article className={styles.card} aria-label={label}>
      <Body1>
        <Badge appearance={pending ? 'outline' : 'filled'} color={STATE_COLOURS[correction.state]}>
          correction {correction.state}
        </Badge>{' '}
        {correction.author.name} asked on {utcText(correction.createdAt)}: “{correction.message}”
      </Body1>
      <ScrollArea label="Changed fields">
        <Table aria-label={`Changes asked for the report for ${report.station}`} size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Field</TableHeaderCell>
              {pending ? <TableHeaderCell>Current</TableHeaderCell> : null}
              <TableHeaderCell>Proposed</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {fields.map(([field, name]) => (
              <TableRow key={field}>
                <TableCell>{name}</TableCell>
                {pending ? (
                  <TableCell className={styles.value}>
                    {fieldValueText(field, currentValue(report, field))}
                  </TableCell>
                ) : null}
                <TableCell className={styles.value}>
                  {fieldValueText(field, correction.changes[field])}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </ScrollArea>
      {correction.state !== 'pending' ? (
        <Body1>
          {correction.state === 'accepted' ? 'Accepted' : 'Rejected'}
          {correction.decidedBy ? ` by ${correction.decidedBy.name}` : ''}
          {correction.decidedAt ? ` on ${utcText(correction.decidedAt)}` : ''}
          {correction.reason ? `. Reason: ${correction.reason}` : '.'}
        </Body1>
      ) : null}
      {pending && canDecide ? <Decide eventId={eventId} report={report} correction={correction} /> : null}
    </article>
  );
}
