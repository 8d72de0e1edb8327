import {
  Body1,
  Button,
  Caption1,
  Checkbox,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Select,
  Subtitle1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import {
  fetchShapeTable,
  type FitShapeInput,
  fitShapeInputSchema,
  type ShapeView,
  useFitShape,
} from '../api/fit-shape';
import { defaultShapeFitIds, type ShapeFitRow, useShapeFits } from '../api/get-shape-fits';
import { Silhouettes } from './silhouettes';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { TableDownload, type TableFormat } from '@/components/table-download';
import { ApiError } from '@/lib/api-client';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '52em' },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'end' },
  fits: { display: 'flex', flexDirection: 'column', border: 'none', padding: 0, margin: 0 },
  table: { width: 'auto' },
});

interface Draft {
  /** The fits ticked; null until the modeller changes the default of one fit per event. */
  chosen: ReadonlySet<string> | null;
  poleSource: 'entered' | 'joint';
  raDeg: string;
  decDeg: string;
  jointPoleId: string;
  periodHours: string;
  epochUtc: string;
  phaseDeg: string;
  model: 'triaxial' | 'spheroid';
}

const EMPTY: Draft = {
  chosen: null,
  poleSource: 'entered',
  raDeg: '',
  decDeg: '',
  jointPoleId: '',
  periodHours: '',
  epochUtc: '',
  phaseDeg: '',
  model: 'triaxial',
};

function numberOf(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : null;
}

/** The form's text as the route's body, or one message per field that cannot be read as a number. */
function inputOf(
  draft: Draft,
  fits: ShapeFitRow[],
): { ok: true; input: FitShapeInput } | { ok: false; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const need = (key: string, text: string): number => {
    const n = numberOf(text);
    if (n === null) errors[key] = 'enter a number';
    return n ?? 0;
  };
  const chosen = draft.chosen ?? defaultShapeFitIds(fits);
  const fitIds = fits.filter((f) => chosen.has(f.fitId)).map((f) => f.fitId);
  if (fitIds.length < 2) errors.fitIds = 'choose at least two events';
  const pole: FitShapeInput['pole'] =
    draft.poleSource === 'entered'
      ? { raDeg: need('pole.raDeg', draft.raDeg), decDeg: need('pole.decDeg', draft.decDeg) }
      : { fromJointPoleId: draft.jointPoleId.trim() };
  if (draft.poleSource === 'joint' && draft.jointPoleId.trim() === '')
    errors['pole.fromJointPoleId'] = 'name a solved joint pole';
  const periodHours = need('periodHours', draft.periodHours);
  const phase = numberOf(draft.phaseDeg);
  if (draft.phaseDeg.trim() !== '' && phase === null) errors.phaseDeg = 'enter a number, or leave empty';
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  // The route's own schema catches the rest (ranges, the epoch's form) on the field it names.
  const parsed = fitShapeInputSchema.safeParse({
    fitIds,
    pole,
    periodHours,
    epochUtc: draft.epochUtc.trim(),
    ...(phase === null ? {} : { phaseDeg: phase }),
    model: draft.model,
  });
  if (parsed.success) return { ok: true, input: parsed.data };
  for (const issue of parsed.error.issues) errors[issue.path.map(String).join('.')] ??= issue.message;
  return { ok: false, errors };
}

/** Two fits of one event read apart by when each finished and who ran it. */
function fitLabel(r: ShapeFitRow): string {
  const fit = r.finishedAt === null ? 'fit' : `fit of ${utcText(r.finishedAt)}`;
  return [
    r.eventTitle,
    r.eventDateUtc === null ? 'event date unknown' : `event ${utcText(r.eventDateUtc)}`,
    r.createdBy === undefined ? fit : `${fit} by ${r.createdBy.name}`,
    r.reviewState === 'approved' ? 'approved' : 'not approved',
  ].join(' · ');
}

const pm = (value: number, sigma: number, digits: number) =>
  `${value.toFixed(digits)} ± ${sigma.toFixed(digits)}`;
const residual = (r: number | null) => (r === null ? '—' : r.toFixed(2));

function Results({
  view,
  fits,
  fetchTable,
}: {
  view: ShapeView;
  fits: ShapeFitRow[];
  fetchTable: (format: TableFormat) => Promise<Blob>;
}) {
  const styles = useStyles();
  const { result } = view;
  const u = result.uncertainty;
  const titleOf = (id: string) => view.fits.find((f) => f.fitId === id)?.eventTitle ?? id;
  const pairs = result.events.flatMap((e) => {
    const limb = fits.find((f) => f.fitId === e.id)?.limb;
    if (limb === undefined || limb === null) return [];
    return [
      {
        fitId: e.id,
        title: titleOf(e.id),
        model: e.model,
        observed: {
          equatorialRadiusKm: limb.equatorialRadiusKm.value,
          oblateness: limb.oblateness.value,
          positionAngleDeg: limb.positionAngleDeg.value,
        },
      },
    ];
  });
  return (
    <section aria-label="Shape result" className={styles.panel}>
      <ScrollArea label="Semi-axes table">
        <Table aria-label="Semi-axes" size="small" className={styles.table}>
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Model</TableHeaderCell>
              <TableHeaderCell>a (km)</TableHeaderCell>
              <TableHeaderCell>b (km)</TableHeaderCell>
              <TableHeaderCell>c (km)</TableHeaderCell>
              <TableHeaderCell>Phase at epoch (°)</TableHeaderCell>
              <TableHeaderCell>χ² / dof</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            <TableRow>
              <TableCell>{result.model}</TableCell>
              <TableCell>{pm(result.semiAxesKm.aKm, u.aKm, 1)}</TableCell>
              <TableCell>{pm(result.semiAxesKm.bKm, u.bKm, 1)}</TableCell>
              <TableCell>{pm(result.semiAxesKm.cKm, u.cKm, 1)}</TableCell>
              <TableCell>
                {result.phaseDeg === null
                  ? '—'
                  : result.phaseFitted
                    ? `${pm(result.phaseDeg, u.phaseDeg, 1)} (fitted)`
                    : `${result.phaseDeg.toFixed(1)} (given)`}
              </TableCell>
              <TableCell>
                {result.chi2.toFixed(2)} / {result.dof}
              </TableCell>
            </TableRow>
          </TableBody>
        </Table>
      </ScrollArea>
      <ScrollArea label="Residuals table">
        <Table aria-label="Residuals by event" size="small" className={styles.table}>
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Event</TableHeaderCell>
              <TableHeaderCell>Rotation angle (°)</TableHeaderCell>
              <TableHeaderCell>Aspect (°)</TableHeaderCell>
              <TableHeaderCell>Δa′/σ</TableHeaderCell>
              <TableHeaderCell>Δε/σ</TableHeaderCell>
              <TableHeaderCell>ΔP/σ</TableHeaderCell>
              <TableHeaderCell>RMS radial gap (km)</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {result.events.map((e) => (
              <TableRow key={e.id}>
                <TableCell>{titleOf(e.id)}</TableCell>
                <TableCell>{e.rotationAngleDeg.toFixed(1)}</TableCell>
                <TableCell>{e.aspectAngleDeg.toFixed(1)}</TableCell>
                <TableCell>{residual(e.normalizedResiduals.equatorialRadius)}</TableCell>
                <TableCell>{residual(e.normalizedResiduals.oblateness)}</TableCell>
                <TableCell>{residual(e.normalizedResiduals.positionAngle)}</TableCell>
                <TableCell>{e.rmsRadialKm.toFixed(1)}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </ScrollArea>
      {result.equilibrium === null ? (
        <Body1>
          No equilibrium density: the fitted figure is on neither the Maclaurin nor the Jacobi sequence.
        </Body1>
      ) : (
        <MessageBar intent="warning" aria-label="Equilibrium density">
          <MessageBarBody>
            <MessageBarTitle>
              {result.equilibrium.sequence} density{' '}
              {pm(result.equilibrium.densityKgM3, result.equilibrium.densityKgM3Sigma, 0)} kg/m³
            </MessageBarTitle>
            {result.equilibrium.caution}
          </MessageBarBody>
        </MessageBar>
      )}
      {view.cautions.length === 0 ? null : (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Cautions</MessageBarTitle>
            <ul aria-label="Shape cautions">
              {view.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      )}
      {result.warnings.map((w) => (
        <Caption1 key={w}>{w}</Caption1>
      ))}
      <Silhouettes pairs={pairs} />
      <TableDownload what="shape table" fetchTable={fetchTable} fileStem="limbus-shape" />
    </section>
  );
}

/** The body's 3D shape from several events' limbs: pole, rotation and model in; semi-axes, residuals out. */
export function ShapePanel({ bodyId }: { bodyId: string }) {
  const styles = useStyles();
  const fits = useShapeFits(bodyId);
  const fit = useFitShape(bodyId);
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  if (fits.isPending) return <Loading label="Loading the fits with a limb…" />;
  if (fits.isError)
    return (
      <RequestFailed what="the fits with a limb" error={fits.error} onRetry={() => void fits.refetch()} />
    );
  const rows = fits.data;
  const chosen = draft.chosen ?? defaultShapeFitIds(rows);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const built = inputOf(draft, rows);
    if (!built.ok) {
      setErrors(built.errors);
      return;
    }
    setErrors({});
    fit.mutate(built.input, {
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        const next: Record<string, string> = {};
        for (const issue of error.issues) {
          // "fitIds.2" names the third chosen fit; say which event that is.
          const k = /^fitIds\.(\d+)$/.exec(issue.path)?.[1];
          const id = k === undefined ? undefined : built.input.fitIds[Number(k)];
          const title = rows.find((r) => r.fitId === id)?.eventTitle;
          const key = title === undefined ? issue.path : 'fitIds';
          next[key] ??= title === undefined ? issue.message : `${title}: ${issue.message}`;
        }
        setErrors(next);
      },
    });
  };

  return (
    <section aria-labelledby="shape-heading" className={styles.panel}>
      <Subtitle1 as="h3" id="shape-heading">
        3D shape
      </Subtitle1>
      <form className={styles.form} onSubmit={onSubmit} aria-label="Shape fit">
        <fieldset className={styles.fits}>
          <legend>Fits with a limb (one per event is ticked: its latest approved, else latest solved)</legend>
          {rows.map((r) => (
            <Checkbox
              key={r.fitId}
              label={fitLabel(r)}
              checked={chosen.has(r.fitId)}
              onChange={(_, data) => {
                const next = new Set(chosen);
                if (data.checked === true) next.add(r.fitId);
                else next.delete(r.fitId);
                set('chosen', next);
              }}
            />
          ))}
          {errors.fitIds !== undefined && <Caption1 role="alert">{errors.fitIds}</Caption1>}
        </fieldset>
        <Field label="Pole">
          <RadioGroup
            layout="horizontal"
            value={draft.poleSource}
            onChange={(_, data) => set('poleSource', data.value === 'joint' ? 'joint' : 'entered')}
          >
            <Radio value="entered" label="Enter RA and Dec" />
            <Radio value="joint" label="A solved joint ring pole" />
          </RadioGroup>
        </Field>
        {draft.poleSource === 'entered' ? (
          <div className={styles.row}>
            <Field label="Pole RA (°)" validationMessage={errors['pole.raDeg']}>
              <Input value={draft.raDeg} onChange={(_, d) => set('raDeg', d.value)} inputMode="decimal" />
            </Field>
            <Field label="Pole Dec (°)" validationMessage={errors['pole.decDeg']}>
              <Input value={draft.decDeg} onChange={(_, d) => set('decDeg', d.value)} inputMode="decimal" />
            </Field>
          </div>
        ) : (
          <Field label="Joint pole job id" validationMessage={errors['pole.fromJointPoleId']}>
            <Input value={draft.jointPoleId} onChange={(_, d) => set('jointPoleId', d.value)} />
          </Field>
        )}
        <div className={styles.row}>
          <Field label="Rotation period (h)" validationMessage={errors.periodHours}>
            <Input
              value={draft.periodHours}
              onChange={(_, d) => set('periodHours', d.value)}
              inputMode="decimal"
            />
          </Field>
          <Field
            label="Reference epoch (UTC, at the body)"
            hint="e.g. 2030-01-01T00:00:00Z"
            validationMessage={errors.epochUtc}
          >
            <Input value={draft.epochUtc} onChange={(_, d) => set('epochUtc', d.value)} />
          </Field>
          <Field
            label="Rotation phase at epoch (°)"
            hint="empty: fitted (triaxial)"
            validationMessage={errors.phaseDeg}
          >
            <Input value={draft.phaseDeg} onChange={(_, d) => set('phaseDeg', d.value)} inputMode="decimal" />
          </Field>
          <Field label="Model">
            <Select
              value={draft.model}
              onChange={(_, d) => set('model', d.value === 'spheroid' ? 'spheroid' : 'triaxial')}
            >
              <option value="triaxial">Triaxial ellipsoid (a ≥ b ≥ c)</option>
              <option value="spheroid">Spheroid (rotation phase unknown)</option>
            </Select>
          </Field>
        </div>
        <div>
          <Button type="submit" appearance="primary" disabled={fit.isPending}>
            {fit.isPending ? 'Fitting…' : 'Fit shape'}
          </Button>
        </div>
        {fit.isError && !(fit.error instanceof ApiError && fit.error.issues.length > 0) && (
          <FormError title="The shape fit failed" message={errorMessage(fit.error)} />
        )}
      </form>
      {fit.data !== undefined && (
        <Results
          view={fit.data}
          fits={rows}
          // The table is written from the input that gave the result on screen, not from the form's edits since.
          fetchTable={(format) => fetchShapeTable(bodyId, fit.variables, format)}
        />
      )}
    </section>
  );
}
