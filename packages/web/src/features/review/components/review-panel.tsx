import {
  Body1,
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Subtitle2,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { reviewDecisionInputSchema, useDecideReview, useRequestReview } from '../api/decide-review';
import { useReviews } from '../api/get-reviews';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';

// The desk speaks UTC throughout, as the timings do; a local clock time would invite mix-ups.
function utcText(iso: string): string {
  return `${iso.slice(0, 19).replace('T', ' ')} UTC`;
}

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '48em' },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  history: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

export type ReviewState = 'none' | 'in_review' | 'approved' | 'returned';

export interface ReviewPanelProps {
  fitId: string;
  fitState: 'queued' | 'running' | 'solved' | 'failed';
  reviewState: ReviewState;
  /** The modeller (or coordinator) may ask for a review; a reviewer decides. */
  canRequest: boolean;
  canDecide: boolean;
}

const DECISION_WORDS = { approve: 'approved', return: 'returned' } as const;

function History({ fitId }: { fitId: string }) {
  const styles = useStyles();
  const reviews = useReviews(fitId);
  if (reviews.isPending) return <Loading label="Loading the review history…" />;
  if (reviews.isError)
    return (
      <RequestFailed what="the review history" error={reviews.error} onRetry={() => void reviews.refetch()} />
    );
  if (reviews.data.length === 0) return <Body1 as="p">No reviews yet.</Body1>;
  return (
    <ol className={styles.history} aria-label="Review history">
      {reviews.data.map((r) => (
        <li key={r.id}>
          {utcText(r.createdAt)}: {r.reviewer.name} {DECISION_WORDS[r.decision]}
          {r.comment === '' ? '' : ` — “${r.comment}”`}
        </li>
      ))}
    </ol>
  );
}

function DecisionForm({ fitId }: { fitId: string }) {
  const styles = useStyles();
  const [decision, setDecision] = useState<'approve' | 'return'>('approve');
  const [comment, setComment] = useState('');
  const [commentError, setCommentError] = useState<string | undefined>();
  const decide = useDecideReview(fitId);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = reviewDecisionInputSchema.safeParse({ decision, comment });
    if (!parsed.success) {
      setCommentError(parsed.error.issues[0]?.message);
      return;
    }
    setCommentError(undefined);
    decide.mutate(parsed.data, { onSuccess: () => setComment('') });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Review decision">
      <Field label="Decision">
        <RadioGroup
          value={decision}
          onChange={(_, data) => setDecision(data.value === 'return' ? 'return' : 'approve')}
        >
          <Radio value="approve" label="Approve (freezes the fit)" />
          <Radio value="return" label="Return to the modeller" />
        </RadioGroup>
      </Field>
      <Field
        label="Comment"
        validationMessage={commentError}
        hint="Required when returning: say what must change."
      >
        <Textarea value={comment} onChange={(_, data) => setComment(data.value)} resize="vertical" />
      </Field>
      {decide.isError ? (
        <FormError title="The review was not saved" message={errorMessage(decide.error)} />
      ) : null}
      <Button appearance="primary" type="submit" disabled={decide.isPending}>
        {decide.isPending ? 'Saving…' : decision === 'approve' ? 'Approve fit' : 'Return fit'}
      </Button>
    </form>
  );
}

/** Review of one fit: ask for it, decide it, and the history of who said what. */
export function ReviewPanel({ fitId, fitState, reviewState, canRequest, canDecide }: ReviewPanelProps) {
  const styles = useStyles();
  const request = useRequestReview(fitId);
  return (
    <section className={styles.panel} aria-label="Review">
      {reviewState === 'approved' ? (
        <MessageBar intent="success">
          <MessageBarBody>
            <MessageBarTitle>Approved</MessageBarTitle>
            The fit is frozen: its options and solution no longer change.
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {fitState !== 'solved' ? <Body1 as="p">Only a solved fit can be reviewed.</Body1> : null}
      {fitState === 'solved' && canRequest && (reviewState === 'none' || reviewState === 'returned') ? (
        <div>
          <Button onClick={() => request.mutate()} disabled={request.isPending}>
            {request.isPending ? 'Asking…' : 'Request review'}
          </Button>
          {request.isError ? (
            <FormError title="Review was not requested" message={errorMessage(request.error)} />
          ) : null}
        </div>
      ) : null}
      {fitState === 'solved' && reviewState === 'in_review' && canDecide ? (
        <DecisionForm fitId={fitId} />
      ) : null}
      {reviewState === 'in_review' && !canDecide ? <Body1 as="p">Waiting for a reviewer.</Body1> : null}
      <Subtitle2 as="h4">History</Subtitle2>
      <History fitId={fitId} />
    </section>
  );
}
