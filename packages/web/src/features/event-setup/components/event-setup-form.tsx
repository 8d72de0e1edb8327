import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Select,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { TIME_SCALES, type EventDetail } from '../api/get-event';
import { updateEventInputSchema, useUpdateEvent } from '../api/update-event';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14em, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  scroll: { overflowX: 'auto' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
});

type Row = { time: string; raDeg: string; decDeg: string; distanceKm: string };

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

const STAR_FIELDS = [
  ['raDeg', 'Right ascension (°)'],
  ['decDeg', 'Declination (°)'],
  ['catalogEpochJyear', 'Catalogue epoch (Julian year)'],
  ['pmRaCosDecMasPerYear', 'Proper motion in RA × cos Dec (mas/yr)'],
  ['pmDecMasPerYear', 'Proper motion in Dec (mas/yr)'],
  ['parallaxMas', 'Parallax (mas)'],
] as const;
type StarKey = (typeof STAR_FIELDS)[number][0];

/**
 * The event's own numbers: title, star (ICRS at the catalogue epoch), ephemeris rows in their stated time
 * scale, DUT1. Checked here with the event file's limits before anything is sent.
 */
export function EventSetupForm({ event, canEdit }: { event: EventDetail; canEdit: boolean }) {
  const styles = useStyles();
  const update = useUpdateEvent(event.id);
  const [title, setTitle] = useState(event.title);
  const [star, setStar] = useState<Record<StarKey, string>>(
    () => Object.fromEntries(STAR_FIELDS.map(([k]) => [k, String(event.star[k])])) as Record<StarKey, string>,
  );
  const [timeScale, setTimeScale] = useState(event.ephemeris.timeScale);
  const [rows, setRows] = useState<Row[]>(() =>
    event.ephemeris.rows.map((r) => ({
      time: r.time,
      raDeg: String(r.raDeg),
      decDeg: String(r.decDeg),
      distanceKm: String(r.distanceKm),
    })),
  );
  const [dut1, setDut1] = useState(String(event.earthRotation.dut1Seconds));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);

  const setRow = (i: number, key: keyof Row, value: string) =>
    setRows((list) => list.map((r, j) => (j === i ? { ...r, [key]: value } : r)));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const parsed = updateEventInputSchema.safeParse({
      title,
      star: Object.fromEntries(STAR_FIELDS.map(([k]) => [k, numberOf(star[k])])),
      ephemeris: {
        timeScale,
        rows: rows.map((r) => ({
          time: r.time.trim(),
          raDeg: numberOf(r.raDeg),
          decDeg: numberOf(r.decDeg),
          distanceKm: numberOf(r.distanceKm),
        })),
      },
      earthRotation: { dut1Seconds: numberOf(dut1) },
    });
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) next[issue.path.join('.')] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    update.mutate(parsed.data, { onSuccess: () => setSaved(true) });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Event setup">
      <Field label="Title" required validationMessage={errors.title}>
        <Input value={title} disabled={!canEdit} onChange={(_, d) => setTitle(d.value)} />
      </Field>
      <Subtitle2 as="h4">Star</Subtitle2>
      <div className={styles.grid}>
        {STAR_FIELDS.map(([key, label]) => (
          <Field key={key} label={label} required validationMessage={errors[`star.${key}`]}>
            <Input
              inputMode="decimal"
              disabled={!canEdit}
              value={star[key]}
              onChange={(_, d) => setStar((s) => ({ ...s, [key]: d.value }))}
            />
          </Field>
        ))}
      </div>
      <Subtitle2 as="h4">Ephemeris of the body</Subtitle2>
      <Field label="Time scale of the rows" hint="The scale the ephemeris times are given in.">
        <Select
          value={timeScale}
          disabled={!canEdit}
          onChange={(_, d) => setTimeScale(TIME_SCALES.find((s) => s === d.value) ?? 'TDB')}
        >
          {TIME_SCALES.map((s) => (
            <option key={s}>{s}</option>
          ))}
        </Select>
      </Field>
      {errors['ephemeris.rows'] ? (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{errors['ephemeris.rows']}</MessageBarBody>
        </MessageBar>
      ) : null}
      <div className={styles.scroll}>
        <Table aria-label="Ephemeris rows" size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Time ({timeScale})</TableHeaderCell>
              <TableHeaderCell>RA (°)</TableHeaderCell>
              <TableHeaderCell>Dec (°)</TableHeaderCell>
              <TableHeaderCell>Distance (km)</TableHeaderCell>
              {canEdit ? <TableHeaderCell>Remove</TableHeaderCell> : null}
            </TableRow>
          </TableHeader>
          <TableBody>
            {rows.map((r, i) => (
              <TableRow key={i}>
                {(['time', 'raDeg', 'decDeg', 'distanceKm'] as const).map((key) => (
                  <TableCell key={key}>
                    <Field validationMessage={errors[`ephemeris.rows.${i}.${key}`]}>
                      <Input
                        aria-label={`Row ${i + 1} ${key === 'time' ? 'time' : key === 'raDeg' ? 'RA' : key === 'decDeg' ? 'Dec' : 'distance'}`}
                        disabled={!canEdit}
                        value={r[key]}
                        onChange={(_, d) => setRow(i, key, d.value)}
                      />
                    </Field>
                  </TableCell>
                ))}
                {canEdit ? (
                  <TableCell>
                    <Button
                      size="small"
                      aria-label={`Remove ephemeris row ${i + 1}`}
                      onClick={() => setRows((list) => list.filter((_, j) => j !== i))}
                    >
                      Remove
                    </Button>
                  </TableCell>
                ) : null}
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </div>
      {canEdit ? (
        <div className={styles.actions}>
          <Button
            onClick={() => setRows((list) => [...list, { time: '', raDeg: '', decDeg: '', distanceKm: '' }])}
          >
            Add ephemeris row
          </Button>
        </div>
      ) : null}
      <Field
        label="DUT1 = UT1 − UTC (s)"
        required
        hint="From the IERS bulletins for the night of the event."
        validationMessage={errors['earthRotation.dut1Seconds']}
      >
        <Input inputMode="decimal" disabled={!canEdit} value={dut1} onChange={(_, d) => setDut1(d.value)} />
      </Field>
      {update.isError ? (
        <FormError title="The setup was not saved" message={errorMessage(update.error)} />
      ) : null}
      {saved ? (
        <MessageBar intent="success">
          <MessageBarBody>Saved.</MessageBarBody>
        </MessageBar>
      ) : null}
      {canEdit ? (
        <Button appearance="primary" type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save setup'}
        </Button>
      ) : null}
    </form>
  );
}
