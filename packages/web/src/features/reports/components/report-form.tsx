import {
  Button,
  Field,
  Input,
  makeStyles,
  Radio,
  RadioGroup,
  Select,
  Subtitle2,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import type { Report, ReportResult } from '../api/get-reports';
import { correctionChanges, correctionMessageSchema, useRequestCorrection } from '../api/request-correction';
import { inputOf, reportInputSchema, useSubmitReport } from '../api/submit-report';
import { lightCurveInputSchema, useUploadLightCurve } from '../api/upload-light-curve';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '48em' },
  pair: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 2fr) minmax(5em, 1fr)',
    gap: tokens.spacingHorizontalM,
  },
  dips: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    border: 'none',
    padding: 0,
  },
  dip: {
    display: 'grid',
    gridTemplateColumns:
      'minmax(5em, 1fr) minmax(0, 2fr) minmax(4em, 1fr) minmax(0, 2fr) minmax(4em, 1fr) auto',
    gap: tokens.spacingHorizontalS,
    alignItems: 'end',
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

interface DipDraft {
  /** Keeps a row's React identity when an earlier row is removed. */
  key: number;
  ring: string;
  startTime: string;
  startSigma: string;
  endTime: string;
  endSigma: string;
}

interface Draft {
  stationId: string;
  result: ReportResult;
  timesFrom: 'typed' | 'light-curve';
  dTime: string;
  dSigma: string;
  rTime: string;
  rSigma: string;
  from: string;
  to: string;
  dips: DipDraft[];
  notes: string;
}

type TextField = Exclude<keyof Draft, 'result' | 'timesFrom' | 'dips'>;

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
  time: TextField;
  sigma: TextField;
  placeholder: string;
}>;

const sigmaText = (mark: { sigmaSeconds: number } | null | undefined) =>
  mark == null ? '' : String(mark.sigmaSeconds);

function draftOf(report: Report | null, stationId: string): Draft {
  return {
    stationId: report?.stationId ?? stationId,
    result: report?.result ?? 'positive',
    timesFrom: report?.timesFromLightCurve ? 'light-curve' : 'typed',
    dTime: report?.disappearance?.time ?? '',
    dSigma: sigmaText(report?.disappearance),
    rTime: report?.reappearance?.time ?? '',
    rSigma: sigmaText(report?.reappearance),
    from: report?.observedFromUtc ?? '',
    to: report?.observedToUtc ?? '',
    dips: (report?.ringDips ?? []).map((d, k) => ({
      key: k,
      ring: d.ring,
      startTime: d.start.time,
      startSigma: sigmaText(d.start),
      endTime: d.end.time,
      endSigma: sigmaText(d.end),
    })),
    notes: report?.notes ?? '',
  };
}

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));
const mark = (time: string, sigma: string) =>
  time.trim() === '' && sigma.trim() === '' ? null : { time: time.trim(), sigmaSeconds: numberOf(sigma) };
const orNull = (text: string) => (text.trim() === '' ? null : text.trim());

function candidateOf(d: Draft) {
  return {
    stationId: d.stationId,
    result: d.result,
    timesFromLightCurve: d.result === 'positive' && d.timesFrom === 'light-curve',
    disappearance: mark(d.dTime, d.dSigma),
    reappearance: mark(d.rTime, d.rSigma),
    observedFromUtc: orNull(d.from),
    observedToUtc: orNull(d.to),
    ringDips: d.dips.map((dip) => ({
      ring: dip.ring,
      start: { time: dip.startTime.trim(), sigmaSeconds: numberOf(dip.startSigma) },
      end: { time: dip.endTime.trim(), sigmaSeconds: numberOf(dip.endSigma) },
    })),
    notes: orNull(d.notes),
  };
}

/**
 * Field messages keyed by JSON path ("disappearance.time", "ringDips.0.end.sigmaSeconds"). A correction's
 * fields come back under "changes.", which is dropped so they land on the same fields.
 */
function serverErrors(error: unknown): Record<string, string> {
  const errors: Record<string, string> = {};
  if (!(error instanceof ApiError)) return errors;
  for (const issue of error.issues) errors[issue.path.replace(/^changes\./, '')] ??= issue.message;
  return errors;
}

function failureText(error: unknown): string {
  if (error instanceof ApiError && error.issues.length > 0)
    return error.issues.map((i) => `${i.path}: ${i.message}`).join('; ');
  return errorMessage(error);
}

export interface ReportFormProps {
  eventId: string;
  stations: ReportStation[];
  report: Report | null;
  /**
   * `correction`: the report is accepted and the form asks a coordinator to change it; the changed
   * fields travel with a message instead of being saved.
   */
  mode?: 'report' | 'correction';
  onSaved?: (reportId: string) => void;
}

/**
 * An observer's report for one of their own stations. An existing report is edited in place until a
 * coordinator accepts it, and corrected through a request after that; the light curve is uploaded after
 * the report exists, since it hangs on it.
 */
export function ReportForm({ eventId, stations, report, mode = 'report', onSaved }: ReportFormProps) {
  const styles = useStyles();
  const correcting = mode === 'correction' && report !== null;
  const [draft, setDraft] = useState<Draft>(() => draftOf(report, stations[0]?.id ?? ''));
  const [nextDipKey, setNextDipKey] = useState(() => draft.dips.length);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [file, setFile] = useState<File | null>(null);
  const [message, setMessage] = useState('');
  const submit = useSubmitReport(eventId);
  const upload = useUploadLightCurve(eventId);
  const correction = useRequestCorrection(eventId);
  const locked = report?.state === 'accepted' && !correcting;
  const set = (field: TextField, value: string) => setDraft((d) => ({ ...d, [field]: value }));
  const setDip = (key: number, field: Exclude<keyof DipDraft, 'key'>, value: string) =>
    setDraft((d) => ({
      ...d,
      dips: d.dips.map((dip) => (dip.key === key ? { ...dip, [field]: value } : dip)),
    }));
  const addDip = () => {
    setDraft((d) => ({
      ...d,
      dips: [
        ...d.dips,
        { key: nextDipKey, ring: '', startTime: '', startSigma: '', endTime: '', endSigma: '' },
      ],
    }));
    setNextDipKey((k) => k + 1);
  };
  const removeDip = (key: number) =>
    setDraft((d) => ({ ...d, dips: d.dips.filter((dip) => dip.key !== key) }));

  const positive = draft.result === 'positive';
  const negative = draft.result === 'negative';
  const fromLightCurve = positive && draft.timesFrom === 'light-curve';

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
      else next.file = checked.error.issues[0]?.message ?? 'choose another file';
    } else if (fromLightCurve && !correcting && report?.lightCurve == null) {
      // The server cannot see this: the file is uploaded once the report exists.
      next.file = 'a report timed from its light curve needs the light-curve file';
    }
    if (correcting) {
      const checked = correctionMessageSchema.safeParse(message);
      if (!checked.success) next.message = checked.error.issues[0]?.message ?? 'write a message';
    }
    setErrors(next);
    if (!parsed.success || Object.keys(next).length > 0) return;
    if (correcting) {
      correction.mutate(
        {
          reportId: report.id,
          changes: correctionChanges(inputOf(report), parsed.data),
          message: message.trim(),
        },
        { onSuccess: () => onSaved?.(report.id), onError: (error) => setErrors(serverErrors(error)) },
      );
      return;
    }
    submit.mutate(
      { input: parsed.data, reportId: report?.id ?? null },
      {
        onSuccess: (reportId) => {
          if (chosen !== null)
            upload.mutate({ reportId, file: chosen }, { onSuccess: () => onSaved?.(reportId) });
          else onSaved?.(reportId);
        },
        onError: (error) => setErrors(serverErrors(error)),
      },
    );
  };

  const err = (...keys: string[]) => keys.map((k) => errors[k]).find((m) => m !== undefined);
  const pending = submit.isPending || upload.isPending || correction.isPending;

  return (
    <form
      className={styles.form}
      onSubmit={onSubmit}
      noValidate
      aria-label={correcting ? 'Correction request' : 'Observer report'}
    >
      <Field label="Station" required validationMessage={err('stationId')}>
        <Select
          value={draft.stationId}
          disabled={report !== null}
          onChange={(_, data) => set('stationId', data.value)}
        >
          {stations.map((s) => (
            <option key={s.id} value={s.id}>
              {s.code}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Result" required validationMessage={err('result')}>
        <RadioGroup
          value={draft.result}
          disabled={locked}
          onChange={(_, data) => setDraft((d) => ({ ...d, result: data.value as ReportResult }))}
        >
          {(Object.keys(RESULT_LABELS) as ReportResult[]).map((r) => (
            <Radio key={r} value={r} label={RESULT_LABELS[r]} />
          ))}
        </RadioGroup>
      </Field>
      {positive ? (
        <Field label="Times" required validationMessage={err('timesFromLightCurve')}>
          <RadioGroup
            value={draft.timesFrom}
            disabled={locked}
            onChange={(_, data) =>
              setDraft((d) => ({ ...d, timesFrom: data.value === 'light-curve' ? 'light-curve' : 'typed' }))
            }
          >
            <Radio value="typed" label="typed below" />
            <Radio value="light-curve" label="to be timed from my light curve" />
          </RadioGroup>
        </Field>
      ) : null}
      {positive
        ? MARKS.map((m) => (
            <div key={m.event} className={styles.pair}>
              <Field
                label={`${m.label} (UTC)${fromLightCurve ? ', optional' : ''}`}
                required={!fromLightCurve}
                validationMessage={err(`${m.event}.time`, m.event)}
              >
                <Input
                  value={draft[m.time]}
                  disabled={locked}
                  placeholder={m.placeholder}
                  onChange={(_, d) => set(m.time, d.value)}
                />
              </Field>
              <Field
                label={`${m.label} σ (s)`}
                required={!fromLightCurve}
                validationMessage={err(`${m.event}.sigmaSeconds`)}
              >
                <Input
                  value={draft[m.sigma]}
                  disabled={locked}
                  inputMode="decimal"
                  onChange={(_, d) => set(m.sigma, d.value)}
                />
              </Field>
            </div>
          ))
        : null}
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
      {positive || negative ? (
        <fieldset className={styles.dips} aria-label="Ring dips">
          <Subtitle2 as="h5">Ring dips</Subtitle2>
          {draft.dips.length === 0 ? <span>No ring dips entered.</span> : null}
          {draft.dips.map((dip, k) => {
            const n = k + 1;
            const at = `ringDips.${k}`;
            return (
              <div key={dip.key} className={styles.dip}>
                <Field label={`Dip ${n} ring label`} validationMessage={err(`${at}.ring`)}>
                  <Input
                    value={dip.ring}
                    disabled={locked}
                    onChange={(_, d) => setDip(dip.key, 'ring', d.value)}
                  />
                </Field>
                <Field
                  label={`Dip ${n} start (UTC)`}
                  validationMessage={err(`${at}.start.time`, `${at}.start`)}
                >
                  <Input
                    value={dip.startTime}
                    disabled={locked}
                    onChange={(_, d) => setDip(dip.key, 'startTime', d.value)}
                  />
                </Field>
                <Field label={`Dip ${n} start σ (s)`} validationMessage={err(`${at}.start.sigmaSeconds`)}>
                  <Input
                    value={dip.startSigma}
                    disabled={locked}
                    inputMode="decimal"
                    onChange={(_, d) => setDip(dip.key, 'startSigma', d.value)}
                  />
                </Field>
                <Field label={`Dip ${n} end (UTC)`} validationMessage={err(`${at}.end.time`, `${at}.end`)}>
                  <Input
                    value={dip.endTime}
                    disabled={locked}
                    onChange={(_, d) => setDip(dip.key, 'endTime', d.value)}
                  />
                </Field>
                <Field label={`Dip ${n} end σ (s)`} validationMessage={err(`${at}.end.sigmaSeconds`)}>
                  <Input
                    value={dip.endSigma}
                    disabled={locked}
                    inputMode="decimal"
                    onChange={(_, d) => setDip(dip.key, 'endSigma', d.value)}
                  />
                </Field>
                {locked ? null : <Button onClick={() => removeDip(dip.key)}>Remove dip {n}</Button>}
              </div>
            );
          })}
          {locked ? null : (
            <div>
              <Button onClick={addDip}>Add a ring dip</Button>
            </div>
          )}
          {err('ringDips') ? <span role="alert">{err('ringDips')}</span> : null}
        </fieldset>
      ) : null}
      <Field label="Notes" validationMessage={err('notes')}>
        <Textarea
          value={draft.notes}
          disabled={locked}
          onChange={(_, d) => set('notes', d.value)}
          resize="vertical"
        />
      </Field>
      {correcting ? (
        <Field label="Message to the coordinator" required validationMessage={err('message')}>
          <Textarea
            value={message}
            onChange={(_, d) => setMessage(d.value)}
            resize="vertical"
            placeholder="What is wrong with the accepted report, and why the new values are right"
          />
        </Field>
      ) : (
        <Field
          label="Light curve file"
          required={fromLightCurve}
          hint={
            report?.lightCurve
              ? `Uploaded: ${report.lightCurve.name}; choose another to replace it.`
              : `${fromLightCurve ? 'Needed for timing.' : 'Optional.'} CSV with the header time,flux or time,flux,fluxErr; times in UTC.`
          }
          validationMessage={err('file')}
        >
          {(fieldProps) => (
            <input
              {...fieldProps}
              type="file"
              disabled={locked}
              onChange={(event) => {
                setErrors(({ file: _file, ...rest }) => rest);
                setFile(event.currentTarget.files?.[0] ?? null);
              }}
            />
          )}
        </Field>
      )}
      {submit.isError ? (
        <FormError title="The report was not saved" message={failureText(submit.error)} />
      ) : null}
      {correction.isError ? (
        <FormError title="The correction request was not sent" message={failureText(correction.error)} />
      ) : null}
      {upload.isError ? (
        <FormError
          title="The report was saved but the light curve was not uploaded"
          message={failureText(upload.error)}
        />
      ) : null}
      {locked ? null : (
        <div>
          <Button appearance="primary" type="submit" disabled={pending}>
            {pending
              ? 'Saving…'
              : correcting
                ? 'Send the correction request'
                : report === null
                  ? 'Submit report'
                  : 'Save changes'}
          </Button>
        </div>
      )}
    </form>
  );
}
