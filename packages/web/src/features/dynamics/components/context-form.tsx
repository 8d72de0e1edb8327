import { Button, Field, Input, makeStyles, Radio, RadioGroup, tokens } from '@fluentui/react-components';
import type { ContextInputFile } from '@limbus/schema';
import { useState, type FormEvent } from 'react';
import { usePutBodyDynamics } from '../api/put-body-dynamics';
import {
  type ContextDraft,
  draftOf,
  fileOf,
  MASS_FIELDS,
  MEASURED,
  type SatelliteDraft,
} from './context-draft';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '60em' },
  row: {
    display: 'grid',
    gridTemplateColumns: '14em 9em 18em',
    gap: tokens.spacingHorizontalM,
    alignItems: 'end',
  },
  satellite: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'end' },
});

const emptySatellite = (): SatelliteDraft => ({
  name: '',
  semiMajorAxisKm: '',
  semiMajorAxisKmSigma: '',
  semiMajorAxisKmSource: '',
  periodDays: '',
  periodDaysSigma: '',
  periodDaysSource: '',
});

/** Edits the body's physical parameters; every refusal, the client's or the server's, is shown on its field. */
export function ContextForm({ bodyId, input }: { bodyId: string; input: ContextInputFile | null }) {
  const styles = useStyles();
  const [draft, setDraft] = useState<ContextDraft>(() => draftOf(input));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const put = usePutBodyDynamics(bodyId);
  const setValue = (path: string, value: string) =>
    setDraft((d) => ({ ...d, values: { ...d.values, [path]: value } }));
  const setSatellite = (index: number, key: keyof SatelliteDraft, value: string) =>
    setDraft((d) => ({
      ...d,
      satellites: d.satellites.map((s, i) => (i === index ? { ...s, [key]: value } : s)),
    }));

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const built = fileOf(draft);
    if (!built.ok) {
      setErrors(built.errors);
      return;
    }
    setErrors({});
    put.mutate(built.file, {
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        const next: Record<string, string> = {};
        for (const issue of error.issues) next[issue.path] ??= `${issue.path}: ${issue.message}`;
        setErrors(next);
      },
    });
  };

  const measuredRow = (path: string, label: string, unit: string) => (
    <div className={styles.row} key={path}>
      <Field label={`${label} (${unit})`} validationMessage={errors[path]}>
        <Input
          value={draft.values[path] ?? ''}
          onChange={(_, d) => setValue(path, d.value)}
          inputMode="decimal"
        />
      </Field>
      <Field label={`${label} 1σ (${unit})`} validationMessage={errors[`${path}Sigma`]}>
        <Input
          value={draft.values[`${path}Sigma`] ?? ''}
          onChange={(_, d) => setValue(`${path}Sigma`, d.value)}
          inputMode="decimal"
        />
      </Field>
      <Field label={`${label} source`}>
        <Input
          value={draft.values[`${path}Source`] ?? ''}
          onChange={(_, d) => setValue(`${path}Source`, d.value)}
        />
      </Field>
    </div>
  );

  const unplaced = Object.entries(errors).filter(
    ([path]) =>
      !MEASURED.some((m) => path.startsWith(m.path)) &&
      !Object.values(MASS_FIELDS).some((m) => path.startsWith(m.path)) &&
      !path.startsWith('satellites[') &&
      !path.startsWith('resonances') &&
      path !== 'body.massFromSatellite',
  );

  return (
    <form aria-label="Physical parameters" className={styles.form} onSubmit={onSubmit} noValidate>
      <Field label="Mass from">
        <RadioGroup
          layout="horizontal"
          value={draft.massFrom}
          onChange={(_, d) =>
            setDraft((x) => ({
              ...x,
              massFrom: d.value === 'massKg' || d.value === 'massFromSatellite' ? d.value : 'densityKgM3',
            }))
          }
        >
          <Radio value="densityKgM3" label="bulk density" />
          <Radio value="massKg" label="mass" />
          <Radio value="massFromSatellite" label="a satellite's orbit" />
        </RadioGroup>
      </Field>
      {draft.massFrom === 'massFromSatellite' ? (
        <Field label="Satellite giving the mass" validationMessage={errors['body.massFromSatellite']}>
          <Input
            value={draft.satelliteForMass}
            onChange={(_, d) => setDraft((x) => ({ ...x, satelliteForMass: d.value }))}
          />
        </Field>
      ) : (
        measuredRow(
          MASS_FIELDS[draft.massFrom].path,
          MASS_FIELDS[draft.massFrom].label,
          MASS_FIELDS[draft.massFrom].unit,
        )
      )}
      {MEASURED.map((m) => measuredRow(m.path, m.label, m.unit))}
      {draft.satellites.map((s, i) => {
        const p = `satellites[${i}]`;
        return (
          <fieldset key={i} className={styles.satellite} aria-label={`Satellite ${i + 1}`}>
            <Field label={`Satellite ${i + 1} name`} validationMessage={errors[`${p}.name`]}>
              <Input value={s.name} onChange={(_, d) => setSatellite(i, 'name', d.value)} />
            </Field>
            <Field
              label="Semi-major axis (km)"
              validationMessage={errors[`${p}.semiMajorAxisKm`] ?? errors[p]}
            >
              <Input
                value={s.semiMajorAxisKm}
                onChange={(_, d) => setSatellite(i, 'semiMajorAxisKm', d.value)}
              />
            </Field>
            <Field label="Semi-major axis 1σ (km)" validationMessage={errors[`${p}.semiMajorAxisKmSigma`]}>
              <Input
                value={s.semiMajorAxisKmSigma}
                onChange={(_, d) => setSatellite(i, 'semiMajorAxisKmSigma', d.value)}
              />
            </Field>
            <Field label="Semi-major axis source">
              <Input
                value={s.semiMajorAxisKmSource}
                onChange={(_, d) => setSatellite(i, 'semiMajorAxisKmSource', d.value)}
              />
            </Field>
            <Field label="Period (d)" validationMessage={errors[`${p}.periodDays`]}>
              <Input value={s.periodDays} onChange={(_, d) => setSatellite(i, 'periodDays', d.value)} />
            </Field>
            <Field label="Period 1σ (d)" validationMessage={errors[`${p}.periodDaysSigma`]}>
              <Input
                value={s.periodDaysSigma}
                onChange={(_, d) => setSatellite(i, 'periodDaysSigma', d.value)}
              />
            </Field>
            <Field label="Period source">
              <Input
                value={s.periodDaysSource}
                onChange={(_, d) => setSatellite(i, 'periodDaysSource', d.value)}
              />
            </Field>
            <Button
              onClick={() => setDraft((x) => ({ ...x, satellites: x.satellites.filter((_, k) => k !== i) }))}
            >
              Remove satellite {i + 1}
            </Button>
          </fieldset>
        );
      })}
      <div>
        <Button onClick={() => setDraft((x) => ({ ...x, satellites: [...x.satellites, emptySatellite()] }))}>
          Add satellite
        </Button>
      </div>
      <Field
        label="Resonances to list besides k:1 and the first and second order (p:q, n_ring : n_satellite)"
        hint="Comma-separated, e.g. 6:1, 11:2; each is listed for every satellite."
        validationMessage={
          Object.entries(errors)
            .filter(([path]) => path.startsWith('resonances'))
            .map(([, message]) => message)
            .join(' ') || undefined
        }
      >
        <Input
          value={draft.resonances}
          onChange={(_, d) => setDraft((x) => ({ ...x, resonances: d.value }))}
        />
      </Field>
      {unplaced.map(([path, message]) => (
        <FormError key={path} title="The physical parameters were refused" message={message} />
      ))}
      {put.isError && !(put.error instanceof ApiError && put.error.issues.length > 0) && (
        <FormError title="Could not save the physical parameters" message={errorMessage(put.error)} />
      )}
      {put.isSuccess && <span role="status">Physical parameters saved.</span>}
      <div>
        <Button type="submit" appearance="primary" disabled={put.isPending}>
          Save physical parameters
        </Button>
      </div>
    </form>
  );
}
