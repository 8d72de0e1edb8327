import {
  Body1,
  Button,
  Field,
  makeStyles,
  Textarea,
  tokens,
  useRestoreFocusTarget,
} from '@fluentui/react-components';
import { useState } from 'react';
import { waitingForTiming, type Report } from '../api/get-reports';
import { rejectInputSchema, useDecideReport } from '../api/review-report';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ReplaceTimingDialog, replacesBetterTimingOf } from '@/components/replace-timing-dialog';

const useStyles = makeStyles({
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'end' },
});

/** A coordinator's accept or reject of a report; an accept that would replace better times asks first. */
export function DecideReport({ eventId, report }: { eventId: string; report: Report }) {
  const styles = useStyles();
  const decide = useDecideReport(eventId);
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const conflict = replacesBetterTimingOf(decide.error);
  // The dialog opens from an answer, not a trigger: focus goes back to Accept when it closes.
  const restoreFocus = useRestoreFocusTarget();
  const name = `report of ${report.authorName}`;
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
          {waitingForTiming(report) ? (
            <Body1>
              Time its light curve in the Light curves section; accepting the timing accepts the report.
            </Body1>
          ) : (
            <Button
              appearance="primary"
              aria-label={`Accept ${name}`}
              {...restoreFocus}
              disabled={decide.isPending}
              onClick={() => decide.mutate({ reportId: report.id, accept: true })}
            >
              Accept
            </Button>
          )}
          <Button aria-label={`Reject ${name}`} onClick={() => setRejecting(true)}>
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
        onReplace={() => decide.mutate({ reportId: report.id, accept: true, replaceTimedChord: true })}
        onKeep={() => decide.reset()}
      />
    </div>
  );
}
