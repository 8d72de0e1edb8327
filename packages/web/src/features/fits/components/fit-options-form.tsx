import {
  Button,
  Checkbox,
  Field,
  Input,
  makeStyles,
  Radio,
  RadioGroup,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { fitOptionsInputSchema, type FitOptionsInput, useSubmitFit } from '../api/submit-fit';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import {
  LIMB_PARAMETERS,
  RING_CENTER_SOURCES,
  type LimbParameterKey,
  type RingCenterFrom,
} from '@/lib/fit-numbers';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '44em' },
  fieldset: {
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
    padding: tokens.spacingHorizontalM,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
  },
  fixedRow: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 14em) minmax(5em, 10em)',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
  },
  stations: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
});

type FixedDraft = Record<LimbParameterKey, { on: boolean; value: string }>;

const emptyFixed = (): FixedDraft =>
  Object.fromEntries(LIMB_PARAMETERS.map((p) => [p.key, { on: false, value: '' }])) as FixedDraft;

/** Empty is "missing", never zero, so a fixed parameter left blank is reported rather than fixed at 0. */
const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

export interface FitOptionsFormProps {
  eventId: string;
  /** Station ids whose clock offset may be fitted (positive chords only carry timing to shift). */
  stationCodes: string[];
  onQueued: (fitId: string) => void;
}

export function FitOptionsForm({ eventId, stationCodes, onQueued }: FitOptionsFormProps) {
  const styles = useStyles();
  const [fixed, setFixed] = useState<FixedDraft>(emptyFixed);
  const [modelError, setModelError] = useState('0');
  const [offsets, setOffsets] = useState<string[]>([]);
  const [centerFrom, setCenterFrom] = useState<RingCenterFrom>('limb');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const submit = useSubmitFit(eventId, onQueued);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const fixedValues: Partial<Record<LimbParameterKey, number>> = {};
    for (const p of LIMB_PARAMETERS) if (fixed[p.key].on) fixedValues[p.key] = numberOf(fixed[p.key].value);
    const candidate: FitOptionsInput = {
      limb: { fixed: fixedValues, modelErrorKm: numberOf(modelError), fitTimeOffsets: offsets },
      ring: { centerFrom },
    };
    const parsed = fitOptionsInputSchema.safeParse(candidate);
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const key = issue.path.join('.');
        next[key] ??= issue.code === 'invalid_type' ? 'enter a number' : issue.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    submit.mutate(parsed.data);
  };

  return (
    <form className={styles.form} onSubmit={onSubmit} noValidate aria-label="Fit options">
      <fieldset className={styles.fieldset}>
        <legend>Limb parameters held fixed</legend>
        {errors['limb.fixed'] ? <span role="alert">{errors['limb.fixed']}</span> : null}
        {LIMB_PARAMETERS.map((p) => {
          const name = `${p.label}${p.unit === '' ? '' : ` (${p.unit})`}`;
          return (
            <div key={p.key} className={styles.fixedRow}>
              <Checkbox
                label={`Fix ${name}`}
                checked={fixed[p.key].on}
                onChange={(_, data) =>
                  setFixed((f) => ({ ...f, [p.key]: { ...f[p.key], on: data.checked === true } }))
                }
              />
              <Field validationMessage={errors[`limb.fixed.${p.key}`]}>
                <Input
                  aria-label={`Fixed value of ${name}`}
                  disabled={!fixed[p.key].on}
                  inputMode="decimal"
                  value={fixed[p.key].value}
                  onChange={(_, data) =>
                    setFixed((f) => ({ ...f, [p.key]: { ...f[p.key], value: data.value } }))
                  }
                />
              </Field>
            </div>
          );
        })}
      </fieldset>
      <Field
        label="Model error (km)"
        hint="Added in quadrature to every endpoint's sigma, for topography the ellipse cannot follow."
        validationMessage={errors['limb.modelErrorKm']}
      >
        <Input inputMode="decimal" value={modelError} onChange={(_, data) => setModelError(data.value)} />
      </Field>
      <fieldset className={styles.fieldset}>
        <legend>Stations whose clock offset is fitted</legend>
        {stationCodes.length === 0 ? <span>No stations with positive chords.</span> : null}
        <div className={styles.stations}>
          {stationCodes.map((code) => (
            <Checkbox
              key={code}
              label={code}
              checked={offsets.includes(code)}
              onChange={(_, data) =>
                setOffsets((list) =>
                  data.checked === true ? [...list, code] : list.filter((c) => c !== code),
                )
              }
            />
          ))}
        </div>
      </fieldset>
      <Field label="Ring centre">
        <RadioGroup
          value={centerFrom}
          onChange={(_, data) => setCenterFrom(RING_CENTER_SOURCES.find((c) => c === data.value) ?? 'limb')}
        >
          <Radio value="limb" label="Same as the limb centre" />
          <Radio value="free" label="Fitted freely" />
          <Radio value="joint" label="Fitted with the limb, one shared centre (joint fit)" />
        </RadioGroup>
      </Field>
      {submit.isError ? (
        <FormError title="The fit was not queued" message={errorMessage(submit.error)} />
      ) : null}
      <Button appearance="primary" type="submit" disabled={submit.isPending}>
        {submit.isPending ? 'Queueing…' : 'Run fit'}
      </Button>
    </form>
  );
}
