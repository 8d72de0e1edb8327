import {
  Button,
  Field,
  Input,
  makeStyles,
  Radio,
  RadioGroup,
  Select,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import type { Report, ReportResult } from '../api/get-reports';
import { reportInputSchema, useSubmitReport, type ReportInput } from '../api/submit-report';
import { lightCurveInputSchema, useUploadLightCurve } from '../api/upload-light-curve';
import { FormError } from '@/components/form-error';
import { ApiError } from '@/lib/api-client';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '44em' },
  pair: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 2fr) minmax(5em, 1fr)',
    gap: tokens.spacingHorizontalM,
  },
});

export interface ReportStation {
  id: string;
  code: string;
}

const RESULT_LABELS: Record<ReportResult, string> = {
  positive: 'Positive (the star went out)',
  negative: 'Negative (the star stayed visible)',
  clouded_out: 'Clouded out',
  technical_failure: 'Technical failure',
};

interface Draft {
  stationId: string;
  result: ReportResult;
  dTime: string;
  dSigma: string;
  rTime: string;
  rSigma: string;
  from: string;
  to: string;
  notes: string;
}

/** The two timed marks of a positive report: one time and one sigma field each. */
const MARKS = [
  {
    event: 'disappearance',
    label: 'Disappearance',
    time: 'dTime',
    sigma: 'dSigma',
    placeholder: '2029-05-17T03:12:31.25Z',
  },
  {
    event: 'reappearance',
    label: 'Reappearance',
    time: 'rTime',
    sigma: 'rSigma',
    placeholder: '2029-05-17T03:12:49.90Z',
  },
] as const satisfies ReadonlyArray<{
  event: string;
  label: string;
  time: keyof Draft;
  sigma: keyof Draft;
  placeholder: string;
}>;

function draftOf(report: Report | null, stationId: string): Draft {
  return {
    stationId: report?.stationId ?? stationId,
    result: report?.result ?? 'positive',
    dTime: report?.disappearance?.time ?? '',
    dSigma: report?.disappearance == null ? '' : String(report.disappearance.sigmaSeconds),
    rTime: report?.reappearance?.time ?? '',
    rSigma: report?.reappearance == null ? '' : String(report.reappearance.sigmaSeconds),
    from: report?.observedFromUtc ?? '',
    to: report?.observedToUtc ?? '',
    notes: report?.notes ?? '',
  };
}

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));
const mark = (time: string, sigma: string) =>
  time.trim() === '' && sigma.trim() === '' ? null : { time: time.trim(), sigmaSeconds: numberOf(sigma) };
const orNull = (text: string) => (text.trim() === '' ? null : text.trim());

function candidateOf(d: Draft): ReportInput {
  return {
    stationId: d.stationId,
    result: d.result,
    disappearance: mark(d.dTime, d.dSigma),
    reappearance: mark(d.rTime, d.rSigma),
    observedFromUtc: orNull(d.from),
    observedToUtc: orNull(d.to),
    notes: orNull(d.notes),
  };
}

/**
 * An observer's report for one of their own stations. An existing report is edited in place until a
 * coordinator accepts it; the light curve is uploaded after the report exists, since it hangs on it.
 */
export function ReportForm({
  eventId,
  stations,
  report,
  onSaved,
}: {
  eventId: string;
  stations: ReportStation[];
  report: Report | null;
  onSaved?: (reportId: string) => void;
}) {
  const styles = useStyles();
  const [draft, setDraft] = useState<Draft>(() => draftOf(report, stations[0]?.id ?? ''));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const submit = useSubmitReport(eventId);
  const upload = useUploadLightCurve(eventId);
  const locked = report?.state === 'accepted';
  const set = (field: keyof Draft, value: string) => setDraft((d) => ({ ...d, [field]: value }));

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = reportInputSchema.safeParse(candidateOf(draft));
    const next: Record<string, string> = {};
    if (!parsed.success)
      for (const issue of parsed.error.issues) {
        const key = issue.path.join('.');
        next[key] ??= issue.code === 'invalid_type' ? 'enter a number of seconds' : issue.message;
      }
    let chosen: File | null = null;
    if (file !== null) {
      const checked = lightCurveInputSchema.safeParse({ file });
      if (checked.success) chosen = checked.data.file;
      else setFileError(checked.error.issues[0]?.message);
    }
    setErrors(next);
    if (!parsed.success) return;
    submit.mutate(
      { input: parsed.data, reportId: report?.id ?? null },
      {
        onSuccess: (reportId) => {
          if (chosen !== null)
            upload.mutate({ reportId, file: chosen }, { onSuccess: () => onSaved?.(reportId) });
          else onSaved?.(reportId);
        },
      },
    );
  };

  const err = (...keys: string[]) => keys.map((k) => errors[k]).find((m) => m !== undefined);
  const positive = draft.result === 'positive';
  const negative = draft.result === 'negative';

  return (
    <form className={styles.form} onSubmit={onSubmit} noValidate aria-label="Observer report">
      <Field label="Station" required validationMessage={err('stationId')}>
        <Select
          value={draft.stationId}
          disabled={report !== null || locked}
          onChange={(_, data) => set('stationId', data.value)}
        >
          {stations.map((s) => (
            <option key={s.id} value={s.id}>
              {s.code}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Result" required>
        <RadioGroup value={draft.result} disabled={locked} onChange={(_, data) => set('result', data.value)}>
          {(Object.keys(RESULT_LABELS) as ReportResult[]).map((r) => (
            <Radio key={r} value={r} label={RESULT_LABELS[r]} />
          ))}
        </RadioGroup>
      </Field>
      {positive ? (
        <>
          {MARKS.map((m) => (
            <div key={m.event} className={styles.pair}>
              <Field label={`${m.label} (UTC)`} required validationMessage={err(`${m.event}.time`, m.event)}>
                <Input
                  value={draft[m.time]}
                  disabled={locked}
                  placeholder={m.placeholder}
                  onChange={(_, d) => set(m.time, d.value)}
                />
              </Field>
              <Field label={`${m.label} σ (s)`} required validationMessage={err(`${m.event}.sigmaSeconds`)}>
                <Input
                  value={draft[m.sigma]}
                  disabled={locked}
                  inputMode="decimal"
                  onChange={(_, d) => set(m.sigma, d.value)}
                />
              </Field>
            </div>
          ))}
        </>
      ) : null}
      {negative ? (
        <div className={styles.pair}>
          <Field label="Watched from (UTC)" required validationMessage={err('observedFromUtc')}>
            <Input value={draft.from} disabled={locked} onChange={(_, d) => set('from', d.value)} />
          </Field>
          <Field label="Watched to (UTC)" required validationMessage={err('observedToUtc')}>
            <Input value={draft.to} disabled={locked} onChange={(_, d) => set('to', d.value)} />
          </Field>
        </div>
      ) : null}
      <Field label="Notes" validationMessage={err('notes')}>
        <Textarea
          value={draft.notes}
          disabled={locked}
          onChange={(_, d) => set('notes', d.value)}
          resize="vertical"
        />
      </Field>
      <Field
        label="Light curve file"
        hint={
          report?.lightCurve
            ? `Uploaded: ${report.lightCurve.name ?? 'a file'}; choose another to replace it.`
            : 'Optional. CSV with the header time,flux or time,flux,fluxErr; times in UTC or seconds.'
        }
        validationMessage={fileError}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            type="file"
            disabled={locked}
            onChange={(event) => {
              setFileError(undefined);
              setFile(event.currentTarget.files?.[0] ?? null);
            }}
          />
        )}
      </Field>
      {submit.isError ? (
        <FormError title="The report was not saved" message={errorMessage(submit.error)} />
      ) : null}
      {upload.isError ? (
        <FormError
          title="The report was saved but the light curve was not uploaded"
          message={
            upload.error instanceof ApiError && upload.error.issues.length > 0
              ? upload.error.issues.map((i) => `${i.path}: ${i.message}`).join('; ')
              : errorMessage(upload.error)
          }
        />
      ) : null}
      {locked ? null : (
        <Button appearance="primary" type="submit" disabled={submit.isPending || upload.isPending}>
          {submit.isPending || upload.isPending
            ? 'Saving…'
            : report === null
              ? 'Submit report'
              : 'Save changes'}
        </Button>
      )}
    </form>
  );
}
