import {
  Badge,
  Body1,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  ProgressBar,
  Subtitle1,
  tokens,
} from '@fluentui/react-components';
import { useFitEvents } from '../api/fit-events';
import { useFit, type Fit } from '../api/get-fit';
import { FitResult } from './fit-result';
import { Loading, RequestFailed } from '@/components/request-state';
import { StaleFitBadge, StaleFitWarning } from '@/components/stale-fit';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  view: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  heading: { display: 'flex', gap: tokens.spacingHorizontalM, alignItems: 'center', flexWrap: 'wrap' },
});

export const REVIEW_LABELS: Record<Fit['reviewState'], string> = {
  none: 'not reviewed',
  in_review: 'in review',
  approved: 'approved',
  returned: 'returned',
};

function FitProgress({ fit }: { fit: Fit }) {
  const running = fit.state === 'queued' || fit.state === 'running';
  const stream = useFitEvents(fit.id, running);
  const percent = Math.max(fit.progress, stream.progress ?? 0);
  const state = stream.state ?? fit.state;
  return (
    <Field
      label="Fit progress"
      validationState="none"
      validationMessage={state === 'queued' ? 'Waiting in the queue…' : `Running: ${percent.toFixed(0)} %`}
    >
      <ProgressBar value={state === 'queued' ? undefined : percent} max={100} thickness="large" />
    </Field>
  );
}

/**
 * One fit: its progress while it runs, then its numbers; an approved fit is frozen and says so, and a fit
 * that ran on data the event no longer holds says that too.
 */
export function FitView({ fitId }: { fitId: string }) {
  const styles = useStyles();
  const fit = useFit(fitId);
  if (fit.isPending) return <Loading label="Loading the fit…" />;
  if (fit.isError)
    return <RequestFailed what="the fit" error={fit.error} onRetry={() => void fit.refetch()} />;
  const f = fit.data;
  const author = f.createdBy.name;
  return (
    <section className={styles.view} aria-label="Selected fit">
      <div className={styles.heading}>
        <Subtitle1 as="h3">Fit of {utcText(f.createdAt)}</Subtitle1>
        <Badge appearance="outline">{f.state}</Badge>
        <Badge
          appearance={f.reviewState === 'approved' ? 'filled' : 'outline'}
          color={f.reviewState === 'approved' ? 'success' : 'informative'}
        >
          {REVIEW_LABELS[f.reviewState]}
        </Badge>
        {f.inputMatchesEvent ? null : <StaleFitBadge />}
        <Body1>by {author}</Body1>
      </div>
      {f.inputMatchesEvent ? null : <StaleFitWarning />}
      {f.reviewState === 'approved' ? (
        <MessageBar intent="success">
          <MessageBarBody>
            <MessageBarTitle>Approved and frozen</MessageBarTitle>
            This fit can no longer change; run a new fit to try other options.
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {f.state === 'queued' || f.state === 'running' ? <FitProgress fit={f} /> : null}
      {f.state === 'failed' ? (
        <MessageBar intent="error" role="alert" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>The fit failed</MessageBarTitle>
            {f.error ?? 'The server gave no reason.'}
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {f.state === 'solved' && f.solution != null ? (
        <FitResult solution={f.solution} options={f.options} />
      ) : null}
      {f.state === 'solved' && f.solution == null ? (
        <Body1 as="p">The fit is solved but carries no solution.</Body1>
      ) : null}
    </section>
  );
}
