import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { PredictionOffsetSource } from '@limbus/schema/planning';
import { PREDICTION_STEP_SECONDS, predictionSettingsSchema } from '@limbus/schema/prediction';
import { useState, type FormEvent } from 'react';
import type { EventDetail } from '../api/get-event';
import { useOffsetFromFit } from '../api/offset-from-fit';
import { useUpdatePredictionSettings, type PredictionSettingsInput } from '../api/update-prediction-settings';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';
import { ApiError } from '@/lib/api-client';
import { parseUtcInput, utcFieldText, utcText } from '@/lib/utc-text';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14em, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  number: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
});

/** A solved fit of an earlier event of the same body, with the astrometric offset it measured. */
export interface OffsetFitCandidate {
  fitId: string;
  eventId: string;
  eventTitle: string;
  eventTimeUtc: string;
  reviewState: string;
  /** The fit's astrometry reference time (UTC). */
  referenceTimeUtc: string;
  offsetMas: { raCosDec: number; dec: number };
  uncertaintyMas: { raCosDec: number; dec: number };
}

/** The candidate fits as the desk loads them (only once asked for). */
export interface OffsetFitChoices {
  candidates: OffsetFitCandidate[] | undefined;
  isPending: boolean;
  error: unknown;
}

const PAIR_FIELDS = [
  ['uncertaintyMas.raCosDec', '1σ of the offset, Δα·cos δ (mas)'],
  ['uncertaintyMas.dec', '1σ of the offset, Δδ (mas)'],
  ['offsetMas.raCosDec', 'Offset of the body, Δα·cos δ (mas)'],
  ['offsetMas.dec', 'Offset of the body, Δδ (mas)'],
] as const;
type PairKey = (typeof PAIR_FIELDS)[number][0];
type Scalar = 'bodyRadiusKm' | 'stepSeconds' | 'from' | 'to' | PairKey;
type Ring = { ring: string; radiusKm: string };

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));
const text = (value: number | undefined) => (value === undefined ? '' : String(value));

function initialValues(prediction: EventDetail['prediction']): Record<Scalar, string> {
  return {
    bodyRadiusKm: text(prediction?.bodyRadiusKm),
    'uncertaintyMas.raCosDec': text(prediction?.uncertaintyMas.raCosDec),
    'uncertaintyMas.dec': text(prediction?.uncertaintyMas.dec),
    'offsetMas.raCosDec': text(prediction?.offsetMas.raCosDec),
    'offsetMas.dec': text(prediction?.offsetMas.dec),
    stepSeconds: text(prediction?.stepSeconds),
    from: prediction?.from === undefined ? '' : utcFieldText(prediction.from),
    to: prediction?.to === undefined ? '' : utcFieldText(prediction.to),
  };
}

/** Which field shows a refusal of this path (after `prediction.`), or null for a message of its own. */
function fieldOf(path: string): string {
  return path.replace(/^prediction\.?/, '');
}

function OffsetSource({ source, assumptions }: { source: PredictionOffsetSource; assumptions: string[] }) {
  const styles = useStyles();
  return (
    <MessageBar intent="info" layout="multiline">
      <MessageBarBody>
        <MessageBarTitle>Offset taken from a fit</MessageBarTitle>
        The offset and its 1σ come from the fit of “{source.eventTitle}” (event {utcText(source.eventTimeUtc)}
        , astrometry at {utcText(source.referenceTimeUtc)}, review: {source.reviewState}): Δα·cos δ ={' '}
        {formatValueSigma(source.offsetMas.raCosDec, source.uncertaintyMas.raCosDec)} mas, Δδ ={' '}
        {formatValueSigma(source.offsetMas.dec, source.uncertaintyMas.dec)} mas, carried{' '}
        {source.carriedDays.toFixed(0)} days to this event. Editing either value drops this link.
        {assumptions.length > 0 ? (
          <ul className={styles.list} aria-label="What taking the offset assumes">
            {assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        ) : null}
      </MessageBarBody>
    </MessageBar>
  );
}

function OffsetFitTable({
  choices,
  pending,
  onUse,
}: {
  choices: OffsetFitChoices;
  pending: boolean;
  onUse: (fitId: string) => void;
}) {
  const styles = useStyles();
  if (choices.isPending) return <Body1 as="p">Looking for solved fits of earlier events of this body…</Body1>;
  if (choices.error !== null && choices.error !== undefined)
    return <FormError title="The fits could not be listed" message={errorMessage(choices.error)} />;
  const list = choices.candidates ?? [];
  if (list.length === 0)
    return (
      <Body1 as="p">
        No earlier event of this body has a solved fit with an astrometric offset (a fitted limb or ring
        centre).
      </Body1>
    );
  return (
    <ScrollArea label="Fits to take the offset from">
      <Table aria-label="Fits with an astrometric offset" size="small">
        <TableHeader>
          <TableRow>
            {['Event', 'Event time (UTC)', 'Review', 'Δα·cos δ (mas, ±1σ)', 'Δδ (mas, ±1σ)', 'Use'].map(
              (h) => (
                <TableHeaderCell key={h}>{h}</TableHeaderCell>
              ),
            )}
          </TableRow>
        </TableHeader>
        <TableBody>
          {list.map((c) => (
            <TableRow key={c.fitId}>
              <TableCell>{c.eventTitle}</TableCell>
              <TableCell className={styles.number}>{utcText(c.eventTimeUtc)}</TableCell>
              <TableCell>{c.reviewState}</TableCell>
              <TableCell className={styles.number}>
                {formatValueSigma(c.offsetMas.raCosDec, c.uncertaintyMas.raCosDec)}
              </TableCell>
              <TableCell className={styles.number}>
                {formatValueSigma(c.offsetMas.dec, c.uncertaintyMas.dec)}
              </TableCell>
              <TableCell>
                <Button
                  size="small"
                  disabled={pending}
                  aria-label={`Use the offset of the fit of ${c.eventTitle}, ${utcText(c.eventTimeUtc)}`}
                  onClick={() => onUse(c.fitId)}
                >
                  Use this offset
                </Button>
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}

export interface PredictionSettingsFormProps {
  event: EventDetail;
  /** Coordinators edit the settings; modellers read them. */
  canEdit: boolean;
  offsetFits: OffsetFitChoices;
  /** Asks the desk to load the candidate fits (when the coordinator opens the list). */
  onOpenOffsetFits: () => void;
}

/**
 * The event's prediction settings (the event file's `prediction` section): the body's radius, the 1σ of
 * the body–star offset and the offset itself, the rings, the step and the span of the path. Checked with
 * the section's own schema before sending; the server's refusals land on their fields and what was typed
 * stays.
 */
export function PredictionSettingsForm({
  event,
  canEdit,
  offsetFits,
  onOpenOffsetFits,
}: PredictionSettingsFormProps) {
  const styles = useStyles();
  const update = useUpdatePredictionSettings(event.id);
  const fromFit = useOffsetFromFit(event.id);
  const [values, setValues] = useState(() => initialValues(event.prediction));
  const [rings, setRings] = useState<Ring[]>(() =>
    (event.prediction?.rings ?? []).map((r) => ({ ring: r.ring, radiusKm: String(r.radiusKm) })),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const [choosing, setChoosing] = useState(false);
  const [applied, setApplied] = useState<{ source: PredictionOffsetSource; assumptions: string[] } | null>(
    null,
  );
  const set = (key: Scalar, value: string) => setValues((v) => ({ ...v, [key]: value }));
  const rows = event.ephemeris.rows;
  const firstRow = rows[0]?.time;
  const lastRow = rows[rows.length - 1]?.time;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const read: Record<string, string> = {};
    const pair = (a: PairKey, b: PairKey) =>
      values[a].trim() === '' && values[b].trim() === ''
        ? undefined
        : { raCosDec: numberOf(values[a]), dec: numberOf(values[b]) };
    const time = (key: 'from' | 'to') => {
      if (values[key].trim() === '') return undefined;
      const parsed = parseUtcInput(values[key]);
      if (!parsed.ok) read[key] = parsed.message;
      return parsed.ok ? parsed.iso : undefined;
    };
    // An empty or unreadable number is said so here; zod would only say it expected a number.
    if (values.bodyRadiusKm.trim() === '') read.bodyRadiusKm = 'give the body’s radius in km';
    for (const key of ['bodyRadiusKm', 'stepSeconds', ...PAIR_FIELDS.map(([k]) => k)] as const)
      if (values[key].trim() !== '' && !Number.isFinite(Number(values[key]))) read[key] = 'not a number';
    rings.forEach((r, i) => {
      if (!Number.isFinite(numberOf(r.radiusKm)))
        read[`rings.${i}.radiusKm`] = 'give the ring’s radius in km';
    });
    const uncertaintyMas = pair('uncertaintyMas.raCosDec', 'uncertaintyMas.dec');
    const offsetMas = pair('offsetMas.raCosDec', 'offsetMas.dec');
    const from = time('from');
    const to = time('to');
    const input: PredictionSettingsInput = {
      bodyRadiusKm: numberOf(values.bodyRadiusKm),
      ...(uncertaintyMas === undefined ? {} : { uncertaintyMas }),
      ...(offsetMas === undefined ? {} : { offsetMas }),
      rings: rings.map((r) => ({ ring: r.ring.trim(), radiusKm: numberOf(r.radiusKm) })),
      ...(values.stepSeconds.trim() === '' ? {} : { stepSeconds: numberOf(values.stepSeconds) }),
      ...(from === undefined ? {} : { from }),
      ...(to === undefined ? {} : { to }),
    };
    // The section's own schema, so the form refuses what the server would (the span check against the
    // ephemeris is the server's).
    const parsed = predictionSettingsSchema.safeParse(input);
    if (!parsed.success || Object.keys(read).length > 0) {
      const next = { ...read };
      for (const issue of parsed.success ? [] : parsed.error.issues)
        next[issue.path.join('.')] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    update.mutate(input, {
      onSuccess: () => setSaved(true),
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        const next: Record<string, string> = {};
        for (const issue of error.issues) next[fieldOf(issue.path)] ??= issue.message;
        setErrors(next);
      },
    });
  };

  const takeOffset = (fitId: string) =>
    fromFit.mutate(fitId, {
      onSuccess: (answer) => {
        const { offsetMas, uncertaintyMas } = answer.offsetSource;
        setValues((v) => ({
          ...v,
          'offsetMas.raCosDec': String(offsetMas.raCosDec),
          'offsetMas.dec': String(offsetMas.dec),
          'uncertaintyMas.raCosDec': String(uncertaintyMas.raCosDec),
          'uncertaintyMas.dec': String(uncertaintyMas.dec),
        }));
        setApplied({ source: answer.offsetSource, assumptions: answer.assumptions });
        setChoosing(false);
      },
    });

  const shownFields = new Set<string>([
    'bodyRadiusKm',
    'stepSeconds',
    'from',
    'to',
    'rings',
    ...PAIR_FIELDS.map(([k]) => k),
  ]);
  const unplaced = Object.entries(errors).filter(
    ([path]) => !shownFields.has(path) && !/^rings\.\d+\.(ring|radiusKm)$/.test(path),
  );
  const source = applied?.source ?? event.predictionOffsetSource ?? null;

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Prediction settings">
      <Subtitle2 as="h4">Prediction of the shadow path</Subtitle2>
      {event.prediction == null ? (
        <Body1 as="p">
          No prediction settings yet: the map, the coverage and the briefing need at least the body’s radius.
        </Body1>
      ) : null}
      <div className={styles.grid}>
        <Field label="Body radius (km)" required validationMessage={errors.bodyRadiusKm}>
          <Input
            inputMode="decimal"
            disabled={!canEdit}
            value={values.bodyRadiusKm}
            onChange={(_, d) => set('bodyRadiusKm', d.value)}
          />
        </Field>
        {PAIR_FIELDS.map(([key, label]) => (
          <Field key={key} label={label} hint="0 unless given" validationMessage={errors[key]}>
            <Input
              inputMode="decimal"
              disabled={!canEdit}
              value={values[key]}
              onChange={(_, d) => {
                set(key, d.value);
                setApplied(null);
              }}
            />
          </Field>
        ))}
        <Field
          label="Time step (s)"
          hint={`${PREDICTION_STEP_SECONDS.min} to ${PREDICTION_STEP_SECONDS.max}; ${PREDICTION_STEP_SECONDS.default} unless given`}
          validationMessage={errors.stepSeconds}
        >
          <Input
            inputMode="decimal"
            disabled={!canEdit}
            value={values.stepSeconds}
            onChange={(_, d) => set('stepSeconds', d.value)}
          />
        </Field>
        <Field
          label="From (UTC)"
          hint={`Unless given: the first ephemeris row${firstRow === undefined ? '' : ` (${firstRow.replace('T', ' ')} ${event.ephemeris.timeScale})`}`}
          validationMessage={errors.from}
        >
          <Input disabled={!canEdit} value={values.from} onChange={(_, d) => set('from', d.value)} />
        </Field>
        <Field
          label="To (UTC)"
          hint={`Unless given: the last ephemeris row${lastRow === undefined ? '' : ` (${lastRow.replace('T', ' ')} ${event.ephemeris.timeScale})`}`}
          validationMessage={errors.to}
        >
          <Input disabled={!canEdit} value={values.to} onChange={(_, d) => set('to', d.value)} />
        </Field>
      </div>
      {source !== null ? <OffsetSource source={source} assumptions={applied?.assumptions ?? []} /> : null}
      {canEdit ? (
        <div className={styles.actions}>
          <Button
            aria-expanded={choosing}
            disabled={event.prediction == null}
            onClick={() => {
              setChoosing((open) => !open);
              onOpenOffsetFits();
            }}
          >
            Use the offset of fit…
          </Button>
          {event.prediction == null ? (
            <Body1>Save the body’s radius first; the offset of a fit then goes into these settings.</Body1>
          ) : null}
        </div>
      ) : null}
      {choosing ? (
        <OffsetFitTable choices={offsetFits} pending={fromFit.isPending} onUse={takeOffset} />
      ) : null}
      {fromFit.isError ? (
        <FormError title="The offset was not taken" message={errorMessage(fromFit.error)} />
      ) : null}
      <Subtitle2 as="h5">Rings</Subtitle2>
      {errors.rings ? (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{errors.rings}</MessageBarBody>
        </MessageBar>
      ) : null}
      {rings.length === 0 ? <Body1 as="p">No ring.</Body1> : null}
      {rings.map((r, i) => (
        <div key={i} className={styles.actions} role="group" aria-label={`Ring ${i + 1}`}>
          <Field label={`Ring ${i + 1} label`} validationMessage={errors[`rings.${i}.ring`]}>
            <Input
              disabled={!canEdit}
              value={r.ring}
              onChange={(_, d) =>
                setRings((list) => list.map((x, j) => (j === i ? { ...x, ring: d.value } : x)))
              }
            />
          </Field>
          <Field label={`Ring ${i + 1} radius (km)`} validationMessage={errors[`rings.${i}.radiusKm`]}>
            <Input
              inputMode="decimal"
              disabled={!canEdit}
              value={r.radiusKm}
              onChange={(_, d) =>
                setRings((list) => list.map((x, j) => (j === i ? { ...x, radiusKm: d.value } : x)))
              }
            />
          </Field>
          {canEdit ? (
            <Button
              aria-label={`Remove ring ${i + 1}`}
              onClick={() => setRings((list) => list.filter((_, j) => j !== i))}
            >
              Remove
            </Button>
          ) : null}
        </div>
      ))}
      {canEdit ? (
        <div className={styles.actions}>
          <Button onClick={() => setRings((list) => [...list, { ring: '', radiusKm: '' }])}>Add ring</Button>
        </div>
      ) : null}
      {update.isError &&
      (!(update.error instanceof ApiError) || unplaced.length > 0 || update.error.issues.length === 0) ? (
        <FormError
          title="The prediction settings were not saved"
          message={
            unplaced.length > 0
              ? unplaced.map(([p, m]) => `${p}: ${m}`).join('; ')
              : errorMessage(update.error)
          }
        />
      ) : null}
      {saved ? (
        <MessageBar intent="success">
          <MessageBarBody>Prediction settings saved.</MessageBarBody>
        </MessageBar>
      ) : null}
      {canEdit ? (
        <div>
          <Button appearance="primary" type="submit" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save prediction settings'}
          </Button>
        </div>
      ) : null}
    </form>
  );
}
