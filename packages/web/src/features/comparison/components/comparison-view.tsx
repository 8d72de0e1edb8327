import {
  Body1,
  Button,
  Caption1,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Field,
  Select,
  Subtitle1,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { useState } from 'react';
import { comparisonFigureFileName, comparisonFigureUrl } from '../api/download-comparison-figure';
import { FIT_SELECTIONS, type FitSelection, useComparison } from '../api/get-comparison';
import { type JointPoleDocument, useJointPole, useSubmitJointPole } from '../api/joint-pole';
import { EllipseOverlay } from './ellipse-overlay';
import { ParameterTable } from './parameter-table';
import { PoleChart } from './pole-chart';
import { FigureDownload } from '@/components/figure-download';
import { Loading, RequestFailed } from '@/components/request-state';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  controls: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'center' },
  plots: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXXL, alignItems: 'flex-start' },
  figure: { margin: 0, display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
});

function AmbiguityText({ doc }: { doc: JointPoleDocument }) {
  const pole = `RA ${doc.pole.raDeg.toFixed(2)}° ± ${doc.uncertainty.raDeg.toFixed(2)}°, Dec ${doc.pole.decDeg.toFixed(2)}° ± ${doc.uncertainty.decDeg.toFixed(2)}°`;
  const correlation =
    doc.uncertainty.correlation === undefined
      ? ''
      : ` (RA–Dec correlation ${doc.uncertainty.correlation.toFixed(2)})`;
  const reduced =
    doc.reducedChi2 === undefined || doc.reducedChi2 === null
      ? ''
      : ` (χ²/dof = ${doc.reducedChi2.toFixed(2)})`;
  return (
    <>
      <Body1>
        Joint pole of ring {doc.ring}: {pole}
        {correlation}; radius {doc.radiusKm.toFixed(1)} ± {doc.radiusSigmaKm.toFixed(1)} km; χ² ={' '}
        {doc.chi2.toFixed(2)} for {doc.dof} degrees of freedom{reduced}.{' '}
        {doc.notes === undefined
          ? doc.ambiguityResolved
            ? 'The other pole family is ruled out (its best χ² is larger by more than 9).'
            : 'Both poles remain possible. Fit the joint pole again for the χ² difference and χ²/dof.'
          : null}
      </Body1>
      {doc.notes === undefined ? null : (
        <ul aria-label="Joint pole notes">
          {doc.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
    </>
  );
}

export interface ComparisonViewProps {
  bodyId: string;
  /** Modellers and coordinators may queue a joint pole fit. */
  canFitJointPole: boolean;
}

const SELECTIONS: Record<FitSelection, string> = {
  'latest-approved': 'Latest approved fit of each event',
  approved: 'Every approved fit',
  all: 'Every solved fit, approved or not',
};

const EMPTY_TEXT: Record<FitSelection, string> = {
  'latest-approved':
    'No approved fits of this body yet. Choose "Every solved fit" to compare fits before review.',
  approved: 'No approved fits of this body yet. Choose "Every solved fit" to compare fits before review.',
  all: 'No solved fits of this body yet.',
};

/** A body's fits side by side: parameters against date, centred ellipses, pole candidates and the joint pole. */
export function ComparisonView({ bodyId, canFitJointPole }: ComparisonViewProps) {
  const styles = useStyles();
  const [selection, setSelection] = useState<FitSelection>('latest-approved');
  const comparison = useComparison(bodyId, selection);
  const [unselected, setUnselected] = useState<ReadonlySet<string>>(new Set());
  const [ring, setRing] = useState<string | null>(null);
  const [jointId, setJointId] = useState<string | null>(null);
  const submit = useSubmitJointPole(bodyId, setJointId);
  const jointJob = useJointPole(jointId);

  if (comparison.isPending) return <Loading label="Loading the comparison…" />;
  if (comparison.isError)
    return (
      <RequestFailed
        what="the comparison"
        error={comparison.error}
        onRetry={() => void comparison.refetch()}
      />
    );

  const data = comparison.data;
  const activeRing = ring ?? data.ringLabels[0] ?? null;
  const selected = new Set(
    data.fits
      .filter((f) => !unselected.has(f.fitId) && f.rings.some((r) => r.ring === activeRing))
      .map((f) => f.fitId),
  );
  const toggle = (fitId: string) =>
    setUnselected((prev) => {
      const next = new Set(prev);
      if (next.has(fitId)) next.delete(fitId);
      else next.add(fitId);
      return next;
    });
  const job = jointJob.data;
  const joint = job?.state === 'solved' ? job.result : null;

  return (
    <section className={styles.page} aria-labelledby="comparison-title">
      <Subtitle1 as="h3" id="comparison-title">
        Comparison of fits
      </Subtitle1>
      <div className={styles.controls}>
        <Field label="Fits compared">
          <RadioGroup
            layout="horizontal"
            value={selection}
            onChange={(_, d) => setSelection(FIT_SELECTIONS.find((f) => f === d.value) ?? 'latest-approved')}
          >
            {FIT_SELECTIONS.map((key) => (
              <Radio key={key} value={key} label={SELECTIONS[key]} />
            ))}
          </RadioGroup>
        </Field>
        {data.ringLabels.length > 1 ? (
          <label>
            Ring{' '}
            <Select value={activeRing ?? ''} onChange={(_, d) => setRing(d.value)}>
              {data.ringLabels.map((l) => (
                <option key={l}>{l}</option>
              ))}
            </Select>
          </label>
        ) : null}
      </div>
      {data.fits.length === 0 ? (
        <MessageBar intent="info">
          <MessageBarBody>{EMPTY_TEXT[selection]}</MessageBarBody>
        </MessageBar>
      ) : (
        <>
          <ParameterTable
            fits={data.fits}
            ringLabels={data.ringLabels}
            selected={selected}
            onToggle={toggle}
          />
          <div className={styles.plots}>
            <figure className={styles.figure}>
              <Subtitle2 as="h4">Limbs and rings, centred</Subtitle2>
              <EllipseOverlay fits={data.fits} />
              <Caption1>Solid: limb ellipses; dashed: ring ellipses; colours as in the table.</Caption1>
            </figure>
            <figure className={styles.figure}>
              <Subtitle2 as="h4">Ring pole candidates</Subtitle2>
              <PoleChart fits={data.fits} ring={activeRing} joint={joint} />
              <Caption1>
                Filled circle: solution 1 of an event; open square: solution 2; triangle: joint pole with its
                1σ region; open triangle: the best pole of the other family.
              </Caption1>
            </figure>
          </div>
          {activeRing !== null ? (
            <>
              <Subtitle2 as="h4">Joint ring pole</Subtitle2>
              <div className={styles.controls}>
                <Button
                  appearance="primary"
                  disabled={!canFitJointPole || selected.size === 0 || submit.isPending}
                  onClick={() => submit.mutate({ fitIds: [...selected], ring: activeRing })}
                >
                  Fit joint pole of ring {activeRing} ({selected.size}{' '}
                  {selected.size === 1 ? 'event' : 'events'})
                </Button>
                {!canFitJointPole ? (
                  <Caption1>Modellers and coordinators can fit the joint pole.</Caption1>
                ) : null}
              </div>
            </>
          ) : null}
          {submit.isError ? (
            <MessageBar intent="error" role="alert">
              <MessageBarBody>{errorMessage(submit.error)}</MessageBarBody>
            </MessageBar>
          ) : null}
          {job !== undefined && (job.state === 'queued' || job.state === 'running') ? (
            <Loading label="Fitting the joint pole…" />
          ) : null}
          {job?.state === 'failed' ? (
            <MessageBar intent="error" role="alert" layout="multiline">
              <MessageBarBody>
                <MessageBarTitle>The joint pole could not be fitted</MessageBarTitle>
                {job.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}
              </MessageBarBody>
            </MessageBar>
          ) : null}
          {joint !== null ? (
            <div role="status" aria-label="Joint pole">
              <AmbiguityText doc={joint} />
            </div>
          ) : null}
          <FigureDownload
            buttonLabel="Download comparison figure"
            figure={(spec) => {
              const input = {
                ...spec,
                selection,
                jointId: joint === null ? null : (job?.id ?? null),
              };
              return { url: comparisonFigureUrl(bodyId, input), fileName: comparisonFigureFileName(input) };
            }}
          />
        </>
      )}
    </section>
  );
}
