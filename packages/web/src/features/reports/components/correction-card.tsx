import {
  Badge,
  Body1,
  Button,
  Field,
  makeStyles,
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
import { useDecideCorrection } from '../api/decide-correction';
import type { Report, ReportCorrection } from '../api/get-reports';
import { rejectInputSchema } from '../api/review-report';
import { CORRECTION_FIELDS, currentValue, fieldValueText } from './report-text';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ReplaceTimingDialog, replacesBetterTimingOf } from '@/components/replace-timing-dialog';
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
  const styles = useStyles();
  const decide = useDecideCorrection(eventId);
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const conflict = replacesBetterTimingOf(decide.error);
  const ids = { reportId: report.id, correctionId: correction.id };
  const who = `correction of ${correction.author.name}`;
  const reject = () => {
    const parsed = rejectInputSchema.safeParse({ reason });
    if (!parsed.success) {
      setReasonError(parsed.error.issues[0]?.message);
      return;
    }
    decide.mutate({ ...ids, accept: false, reason: parsed.data.reason });
  };
  return (
    <div className={styles.actions}>
      {rejecting ? (
        <>
          <Field label={`Reason for rejecting the ${who}`} validationMessage={reasonError}>
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
            aria-label={`Accept ${who}`}
            disabled={decide.isPending}
            onClick={() => decide.mutate({ ...ids, accept: true })}
          >
            Accept
          </Button>
          <Button aria-label={`Reject ${who}`} onClick={() => setRejecting(true)}>
            Reject…
          </Button>
        </>
      )}
      {decide.isError && conflict === null ? (
        <FormError title="The decision was not saved" message={errorMessage(decide.error)} />
      ) : null}
      <ReplaceTimingDialog
        conflict={conflict}
        pending={decide.isPending}
        onReplace={() => decide.mutate({ ...ids, accept: true, replaceTimedChord: true })}
        onKeep={() => decide.reset()}
      />
    </div>
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
