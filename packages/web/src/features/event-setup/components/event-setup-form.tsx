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
import { parseDeclination, parseRightAscension, type AngleParse } from '@limbus/schema/angles';
import { useState, type FormEvent } from 'react';
import { useDeleteEvent } from '../api/delete-event';
import { TIME_SCALES, type EventDetail } from '../api/get-event';
import { updateEventInputSchema, useUpdateEvent } from '../api/update-event';
import { ConfirmButton } from '@/components/confirm-button';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';
import { ApiError } from '@/lib/api-client';
import { parseUtcInput, utcFieldText } from '@/lib/utc-text';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14em, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
});

type Row = { time: string; raDeg: string; decDeg: string; distanceKm: string };

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

// RA and Dec are read by parseRightAscension/parseDeclination; the others are plain numbers.
const STAR_FIELDS = [
  ['raDeg', 'Right ascension (° or h m s)'],
  ['decDeg', 'Declination (° or ° ′ ″)'],
  ['catalogEpochJyear', 'Catalogue epoch (Julian year)'],
  ['pmRaCosDecMasPerYear', 'Proper motion μα* = μα cos δ (mas/yr)'],
  ['pmDecMasPerYear', 'Proper motion μδ (mas/yr)'],
  ['parallaxMas', 'Parallax (mas)'],
  ['angularDiameterMas', 'Angular diameter (mas)'],
] as const;
type StarKey = (typeof STAR_FIELDS)[number][0];
const OPTIONAL_STAR_FIELDS: ReadonlySet<StarKey> = new Set(['angularDiameterMas']);

/** Whether the form shows a refusal of this path on a field of its own. */
const placed = (path: string) =>
  [
    'title',
    'bodyId',
    'eventTimeUtc',
    'ephemeris.timeScale',
    'ephemeris.rows',
    'earthRotation.dut1Seconds',
  ].includes(path) ||
  /^star\.\w+$/.test(path) ||
  /^ephemeris\.rows\.\d+\.\w+$/.test(path);

/** Under RA and Dec: the angle read, in degrees, while the person types. */
function angleHint(text: string, parsed: AngleParse): string | undefined {
  if (text.trim() === '') return undefined;
  return parsed.ok ? `= ${parsed.deg.toFixed(6)}°` : parsed.message;
}

function DeleteEventButton({ event, onDeleted }: { event: EventDetail; onDeleted: () => void }) {
  const remove = useDeleteEvent(event.id, onDeleted);
  return (
    <ConfirmButton
      size="medium"
      text="Delete event"
      name="Delete event"
      title={`Delete ${event.title}?`}
      description="The event leaves the list with its stations, reports, chords and fits. A coordinator can restore it from Archived events on the events list."
      confirmText="Delete"
      cancelText="Keep it"
      pending={remove.isPending}
      error={remove.error}
      onOpen={() => remove.reset()}
      onConfirm={(close) => remove.mutate(undefined, { onSuccess: close })}
    />
  );
}

export interface EventSetupFormProps {
  event: EventDetail;
  /** Coordinators and modellers edit the setup and move the event to another body. */
  canEdit: boolean;
  /** Coordinators delete (archive) the event. */
  canDelete: boolean;
  /** The team's bodies; null while they load. */
  bodies: Array<{ id: string; name: string }> | null;
  onDeleted: () => void;
}

/**
 * The event's own numbers: title, body, event time, star (ICRS at the catalogue epoch), ephemeris rows in
 * their stated time scale, DUT1. Checked here with the event file's limits before anything is sent.
 */
export function EventSetupForm({ event, canEdit, canDelete, bodies, onDeleted }: EventSetupFormProps) {
  const styles = useStyles();
  const update = useUpdateEvent(event.id);
  const [title, setTitle] = useState(event.title);
  const [bodyId, setBodyId] = useState(event.bodyId);
  const [eventTime, setEventTime] = useState(utcFieldText(event.eventTimeUtc));
  const [star, setStar] = useState<Record<StarKey, string>>(
    () =>
      Object.fromEntries(
        STAR_FIELDS.map(([k]) => {
          const value = event.star[k];
          return [k, value === undefined || value === null ? '' : String(value)];
        }),
      ) as Record<StarKey, string>,
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

  const ra = parseRightAscension(star.raDeg);
  const dec = parseDeclination(star.decDeg);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSaved(false);
    const read: Record<string, string> = {};
    if (!ra.ok) read['star.raDeg'] = ra.message;
    if (!dec.ok) read['star.decDeg'] = dec.message;
    const time = parseUtcInput(eventTime);
    if (!time.ok) read.eventTimeUtc = time.message;
    const parsed = updateEventInputSchema.safeParse({
      title,
      bodyId,
      ...(time.ok ? { eventTimeUtc: time.iso } : {}),
      star: Object.fromEntries(
        STAR_FIELDS.flatMap(([k]): Array<[StarKey, number]> => {
          if (k === 'raDeg') return [[k, ra.ok ? ra.deg : 0]];
          if (k === 'decDeg') return [[k, dec.ok ? dec.deg : 0]];
          if (OPTIONAL_STAR_FIELDS.has(k) && star[k].trim() === '') return [];
          return [[k, numberOf(star[k])]];
        }),
      ),
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
    if (!parsed.success || Object.keys(read).length > 0) {
      const next: Record<string, string> = { ...read };
      for (const issue of parsed.success ? [] : parsed.error.issues)
        next[issue.path.join('.')] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    update.mutate(parsed.data, {
      onSuccess: () => setSaved(true),
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        const next: Record<string, string> = {};
        for (const issue of error.issues) next[issue.path] ??= issue.message;
        setErrors(next);
      },
    });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Event setup">
      <Field label="Title" required validationMessage={errors.title}>
        <Input value={title} disabled={!canEdit} onChange={(_, d) => setTitle(d.value)} />
      </Field>
      <div className={styles.grid}>
        <Field label="Body" required validationMessage={errors.bodyId}>
          <Select value={bodyId} disabled={!canEdit} onChange={(_, d) => setBodyId(d.value)}>
            {/* The event's own body stays listed while the team's bodies load (or if they fail to). */}
            {(bodies ?? []).some((b) => b.id === event.bodyId) ? null : (
              <option value={event.bodyId}>{event.bodyName}</option>
            )}
            {(bodies ?? []).map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          label="Event time (UTC)"
          required
          hint="The moment the event is filed under, e.g. 2028-03-14 02:11:04"
          validationMessage={errors.eventTimeUtc}
        >
          <Input value={eventTime} disabled={!canEdit} onChange={(_, d) => setEventTime(d.value)} />
        </Field>
      </div>
      <Subtitle2 as="h4">Star</Subtitle2>
      <div className={styles.grid}>
        {STAR_FIELDS.map(([key, label]) => (
          <Field
            key={key}
            label={label}
            required={!OPTIONAL_STAR_FIELDS.has(key)}
            hint={
              errors[`star.${key}`] !== undefined
                ? undefined
                : key === 'raDeg'
                  ? angleHint(star.raDeg, ra)
                  : key === 'decDeg'
                    ? angleHint(star.decDeg, dec)
                    : OPTIONAL_STAR_FIELDS.has(key)
                      ? 'Optional'
                      : undefined
            }
            validationMessage={errors[`star.${key}`]}
          >
            <Input
              inputMode={key === 'raDeg' || key === 'decDeg' ? 'text' : 'decimal'}
              disabled={!canEdit}
              value={star[key]}
              onChange={(_, d) => setStar((s) => ({ ...s, [key]: d.value }))}
            />
          </Field>
        ))}
      </div>
      <Subtitle2 as="h4">Ephemeris of the body</Subtitle2>
      <Field
        label="Time scale of the rows"
        hint="The scale the ephemeris times are given in."
        validationMessage={errors['ephemeris.timeScale']}
      >
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
      <ScrollArea label="Ephemeris table">
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
      </ScrollArea>
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
        <FormError
          title="The setup was not saved"
          message={
            update.error instanceof ApiError && update.error.issues.length > 0
              ? update.error.issues
                  .filter((i) => !placed(i.path))
                  .map((i) => `${i.path}: ${i.message}`)
                  .join('; ') || 'see the fields marked above'
              : errorMessage(update.error)
          }
        />
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
      {canDelete ? (
        <div className={styles.actions}>
          <DeleteEventButton event={event} onDeleted={onDeleted} />
        </div>
      ) : null}
    </form>
  );
}
