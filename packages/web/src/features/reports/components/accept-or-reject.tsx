import {
  Button,
  Field,
  makeStyles,
  Textarea,
  tokens,
  useRestoreFocusTarget,
} from '@fluentui/react-components';
import { useState, type ReactNode } from 'react';
import { rejectInputSchema } from '../api/review-report';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ReplaceTimingDialog, replacesBetterTimingOf } from '@/components/replace-timing-dialog';

const useStyles = makeStyles({
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'end' },
});

/**
 * A coordinator's decision on a report or a correction: accept, or reject with a reason the observer
 * reads. An accept that would replace better-timed chord values comes back as a question (409
 * replaces-better-timing), answered in a dialog that shows both sets of times.
 */
export function AcceptOrReject({
  who,
  pending,
  error,
  acceptInstead,
  onAccept,
  onReject,
  onKeep,
}: {
  /** "report of Ilse Darrow", "correction of Ilse Darrow": names the buttons and the reason field. */
  who: string;
  pending: boolean;
  /** The last attempt's failure (the question among them). */
  error: unknown;
  /** Shown in place of Accept when accepting cannot happen here (a report that waits for its timing). */
  acceptInstead?: ReactNode;
  onAccept: (replaceTimedChord: boolean) => void;
  onReject: (reason: string) => void;
  /** The person keeps the chord's current times: forget the question. */
  onKeep: () => void;
}) {
  const styles = useStyles();
  const [rejecting, setRejecting] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const conflict = replacesBetterTimingOf(error);
  // The dialog opens from an answer, not a trigger: focus goes back to Accept when it closes.
  const restoreFocus = useRestoreFocusTarget();
  const reject = () => {
    const parsed = rejectInputSchema.safeParse({ reason });
    if (!parsed.success) {
      setReasonError(parsed.error.issues[0]?.message);
      return;
    }
    onReject(parsed.data.reason);
  };
  return (
    <div className={styles.actions}>
      {rejecting ? (
        <>
          <Field label={`Reason for rejecting the ${who}`} validationMessage={reasonError}>
            <Textarea value={reason} onChange={(_, d) => setReason(d.value)} />
          </Field>
          <Button onClick={reject} disabled={pending}>
            Send rejection
          </Button>
          <Button onClick={() => setRejecting(false)}>Cancel</Button>
        </>
      ) : (
        <>
          {acceptInstead ?? (
            <Button
              appearance="primary"
              aria-label={`Accept ${who}`}
              {...restoreFocus}
              disabled={pending}
              onClick={() => onAccept(false)}
            >
              Accept
            </Button>
          )}
          <Button aria-label={`Reject ${who}`} onClick={() => setRejecting(true)}>
            Reject…
          </Button>
        </>
      )}
      {error !== null && error !== undefined && conflict === null ? (
        <FormError title="The decision was not saved" message={errorMessage(error)} />
      ) : null}
      <ReplaceTimingDialog
        conflict={conflict}
        pending={pending}
        onReplace={() => onAccept(true)}
        onKeep={onKeep}
      />
    </div>
  );
}
