import {
  Badge,
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
import type { Solution } from '@limbus/geometry';
import type { FitStatus } from '@limbus/schema/views';
import { useState, type FormEvent } from 'react';
import { reviewDecisionInputSchema, useDecideReview } from '../api/decide-review';
import { FitUnderReview } from './fit-under-review';
import { RequestReviewDialog } from './request-review-dialog';
import { ReviewHistory } from './review-history';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { StaleFitWarning } from '@/components/stale-fit';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '48em' },
  heading: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center', flexWrap: 'wrap' },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  submit: { alignSelf: 'start' },
});

/** The fit the Review tab is about, as the desk loaded it. */
export interface ReviewedFit extends FitStatus {
  createdBy: { id: string; name: string };
  options?: Record<string, unknown> | undefined;
  solution?: Solution | null | undefined;
}

export interface ReviewPanelProps {
  eventId: string;
  fit: ReviewedFit;
  /** The signed-in user: a fit's author asks for its review, and someone else decides it. */
  userId: string;
  /** Modellers and coordinators may ask for a review; reviewers decide. */
  canRequest: boolean;
  canDecide: boolean;
}

const REVIEW_WORDS: Record<ReviewedFit['reviewState'], string> = {
  none: 'not sent for review',
  in_review: 'in review',
  approved: 'approved',
  returned: 'returned',
};

type Decision = 'approve' | 'return';

function DecisionForm({ fitId }: { fitId: string }) {
  const styles = useStyles();
  // No decision until the reviewer picks one: an approval must be a choice, not a default left alone.
  const [decision, setDecision] = useState<Decision | null>(null);
  const [comment, setComment] = useState('');
  const [errors, setErrors] = useState<{ decision?: string; comment?: string }>({});
  const decide = useDecideReview(fitId);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = reviewDecisionInputSchema.safeParse({ decision: decision ?? undefined, comment });
    if (!parsed.success) {
      const next: { decision?: string; comment?: string } = {};
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] === 'comment' ? 'comment' : 'decision';
        next[field] ??= issue.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    decide.mutate(parsed.data, { onSuccess: () => setComment('') });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Review decision">
      <Field label="Decision" required validationMessage={errors.decision}>
        <RadioGroup
          value={decision ?? ''}
          onChange={(_, data) => {
            setDecision(data.value === 'return' ? 'return' : 'approve');
            setErrors((e) => ({ ...e, decision: undefined }));
          }}
        >
          <Radio value="approve" label="Approve (freezes the fit)" />
          <Radio value="return" label="Return to the modeller" />
        </RadioGroup>
      </Field>
      <Field
        label="Comment"
        validationMessage={errors.comment}
        hint="Required when returning: say what must change."
      >
        <Textarea value={comment} onChange={(_, data) => setComment(data.value)} resize="vertical" />
      </Field>
      {decide.isError ? (
        <FormError title="The review was not saved" message={errorMessage(decide.error)} />
      ) : null}
      <Button className={styles.submit} appearance="primary" type="submit" disabled={decide.isPending}>
        {decide.isPending
          ? 'Saving…'
          : decision === 'approve'
            ? 'Approve fit'
            : decision === 'return'
              ? 'Return fit'
              : 'Submit decision'}
      </Button>
    </form>
  );
}

/**
 * The review of one fit: which fit it is, its numbers and options, asking for a review or deciding it,
 * and the event's review history across all its fits.
 */
export function ReviewPanel({ eventId, fit, userId, canRequest, canDecide }: ReviewPanelProps) {
  const styles = useStyles();
  const fitLabel = `the fit of ${utcText(fit.createdAt)}`;
  const isAuthor = fit.createdBy.id === userId;
  const solved = fit.state === 'solved';
  const open = fit.reviewState === 'none' || fit.reviewState === 'returned';
  return (
    <section className={styles.panel} aria-label="Review">
      {fit.inputMatchesEvent ? null : <StaleFitWarning />}
      <div className={styles.heading}>
        <Subtitle2 as="h3">
          {fit.reviewState === 'in_review' ? `Under review: ${fitLabel}` : `Fit of ${utcText(fit.createdAt)}`}
        </Subtitle2>
        <Badge
          appearance={fit.reviewState === 'approved' ? 'filled' : 'outline'}
          color={fit.reviewState === 'approved' ? 'success' : 'informative'}
        >
          {REVIEW_WORDS[fit.reviewState]}
        </Badge>
      </div>
      <Body1 as="p">
        Run by {fit.createdBy.name} on {utcText(fit.createdAt)}
        {solved ? '.' : `; it is ${fit.state}.`}
      </Body1>
      {fit.reviewState === 'approved' ? (
        <MessageBar intent="success">
          <MessageBarBody>
            <MessageBarTitle>Approved</MessageBarTitle>
            The fit is frozen: its options and solution no longer change.
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {!solved ? <Body1 as="p">Only a solved fit can be reviewed.</Body1> : null}
      {solved && fit.solution != null ? (
        <FitUnderReview solution={fit.solution} options={fit.options} />
      ) : null}
      {solved && open && canRequest && isAuthor ? (
        <div>
          <RequestReviewDialog fitId={fit.id} fitLabel={fitLabel} />
        </div>
      ) : null}
      {solved && open && canRequest && !isAuthor ? (
        <Body1 as="p">Only the fit&apos;s author, {fit.createdBy.name}, can ask for its review.</Body1>
      ) : null}
      {solved && fit.reviewState === 'in_review' && canDecide && !isAuthor ? (
        <DecisionForm fitId={fit.id} />
      ) : null}
      {fit.reviewState === 'in_review' && canDecide && isAuthor ? (
        <Body1 as="p">You ran this fit, so another reviewer decides it.</Body1>
      ) : null}
      {fit.reviewState === 'in_review' && !canDecide ? <Body1 as="p">Waiting for a reviewer.</Body1> : null}
      <Subtitle2 as="h4">Review history of this event</Subtitle2>
      <ReviewHistory eventId={eventId} fit={fit} />
    </section>
  );
}
