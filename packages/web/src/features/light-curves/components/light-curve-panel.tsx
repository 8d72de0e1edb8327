import {
  Badge,
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  Radio,
  RadioGroup,
  Select,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
  useRestoreFocusTarget,
} from '@fluentui/react-components';
import type { ChordSourceValue } from '@limbus/schema/views';
import { useEffect, useState, type FormEvent } from 'react';
import { useAcceptTiming } from '../api/accept-timing';
import { createTimingInputSchema, useCreateTiming } from '../api/create-timing';
import { ringNameSchema, useDipsToRingEvents } from '../api/dips-to-ring-events';
import { useTiming } from '../api/get-timing';
import { type TimingDefaults, useTimingDefaults } from '../api/get-timing-defaults';
import { useTimings } from '../api/get-timings';
import { useMarkDip } from '../api/mark-dip';
import type { TimingDetail, TimingResult, TimingSummary } from '../api/timing-schema';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';
import { LightCurvePlot } from '@/components/light-curve-plot';
import { ReplaceTimingDialog, replacesBetterTimingOf } from '@/components/replace-timing-dialog';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';
import { chordSourceText } from '@/components/timing-text';
import { utcText } from '@/lib/utc-text';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'end' },
});

/** Where the station's chord now takes its times from, to say what replaced an accepted timing. */
export interface ChordProvenance {
  source: ChordSourceValue;
  timingId: string | null;
}

export interface LightCurvePanelProps {
  eventId: string;
  reportId: string;
  stationLabel: string;
  /** The chord of the report, or null when it has none. */
  chord: ChordProvenance | null;
  /** Coordinators and modellers may queue, accept and mark; everyone else reads. */
  canEdit: boolean;
}

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

function TimingForm({
  eventId,
  reportId,
  onQueued,
}: {
  eventId: string;
  reportId: string;
  onQueued: (id: string) => void;
}) {
  const styles = useStyles();
  const [speed, setSpeed] = useState('');
  const [speedD, setSpeedD] = useState('');
  const [speedR, setSpeedR] = useState('');
  const [distance, setDistance] = useState('');
  const [exposure, setExposure] = useState('');
  const [bottom, setBottom] = useState<'free' | 'zero'>('free');
  const [ring, setRing] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateTiming(eventId, reportId, onQueued);
  const defaults = useTimingDefaults(eventId, reportId);
  // The event's values fill only the fields nobody has typed in yet.
  useEffect(() => {
    const d = defaults.data;
    if (d === undefined) return;
    const fill = (text: string) => (current: string) => (current === '' ? text : current);
    setSpeed(fill(d.speedKmPerS.toFixed(3)));
    setSpeedD(fill(d.edgeSpeeds.disappearanceKmPerS.toFixed(3)));
    setSpeedR(fill(d.edgeSpeeds.reappearanceKmPerS.toFixed(3)));
    setDistance(fill(d.distanceKm.toFixed(0)));
    if (d.exposureSeconds !== null) setExposure(fill(String(d.exposureSeconds)));
  }, [defaults.data]);
  const rings = defaults.data?.rings ?? [];
  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    // An edge speed left empty is the shadow speed; one changed from the default was entered by hand.
    const edge = (text: string) => (text.trim() === '' ? speed : text);
    const d = defaults.data?.edgeSpeeds;
    const asDefault =
      d !== undefined &&
      edge(speedD).trim() === d.disappearanceKmPerS.toFixed(3) &&
      edge(speedR).trim() === d.reappearanceKmPerS.toFixed(3);
    const chosenRing = rings.find((r) => r.ring === ring);
    const parsed = createTimingInputSchema.safeParse({
      speedKmPerS: numberOf(speed),
      speedDisappearanceKmPerS: numberOf(edge(speedD)),
      speedReappearanceKmPerS: numberOf(edge(speedR)),
      edgeSpeedsFrom: asDefault ? d.from : 'entered',
      distanceKm: numberOf(distance),
      exposureSeconds: numberOf(exposure),
      bottom,
      ...(chosenRing === undefined
        ? {}
        : {
            ringOpeningAngleDeg: chosenRing.openingAngleDeg,
            ringOpeningAngleSigmaDeg: chosenRing.openingAngleSigmaDeg,
          }),
    });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, { onError: (error) => setErrors(fieldErrorsFromApi(error)) });
  };
  return (
    <form aria-label="Time this light curve" onSubmit={onSubmit} noValidate>
      <div className={styles.row}>
        <Field label="Shadow speed (km/s)" validationMessage={errors.speedKmPerS}>
          <Input value={speed} onChange={(_, d) => setSpeed(d.value)} inputMode="decimal" />
        </Field>
        <Field label="Disappearance edge speed (km/s)" validationMessage={errors.speedDisappearanceKmPerS}>
          <Input value={speedD} onChange={(_, d) => setSpeedD(d.value)} inputMode="decimal" />
        </Field>
        <Field label="Reappearance edge speed (km/s)" validationMessage={errors.speedReappearanceKmPerS}>
          <Input value={speedR} onChange={(_, d) => setSpeedR(d.value)} inputMode="decimal" />
        </Field>
        <Field label="Distance (km)" validationMessage={errors.distanceKm}>
          <Input value={distance} onChange={(_, d) => setDistance(d.value)} inputMode="decimal" />
        </Field>
        <Field label="Exposure (s)" validationMessage={errors.exposureSeconds}>
          <Input value={exposure} onChange={(_, d) => setExposure(d.value)} inputMode="decimal" />
        </Field>
        <Field label="Bottom of the well">
          <RadioGroup
            layout="horizontal"
            value={bottom}
            onChange={(_, d) => setBottom(d.value === 'zero' ? 'zero' : 'free')}
          >
            <Radio value="free" label="fitted" />
            <Radio value="zero" label="zero flux" />
          </RadioGroup>
        </Field>
        <Field
          label="Ring for the dips' normal optical depth"
          hint="its opening angle B turns τ into τ·|sin B|"
        >
          <Select value={ring} onChange={(_, d) => setRing(d.value)}>
            <option value="">none</option>
            {rings.map((r) => (
              <option key={r.ring} value={r.ring}>
                {r.ring} (B = {r.openingAngleDeg.toFixed(2)} ± {r.openingAngleSigmaDeg.toFixed(2)}°, latest
                fit)
              </option>
            ))}
          </Select>
        </Field>
        <Button type="submit" appearance="primary" disabled={create.isPending}>
          Time light curve
        </Button>
      </div>
      <DefaultsNote defaults={defaults.data} error={defaults.error} />
      {create.isError && Object.keys(fieldErrorsFromApi(create.error)).length === 0 && (
        <FormError title="Could not queue the timing" message={errorMessage(create.error)} />
      )}
    </form>
  );
}

const AT_FROM: Record<TimingDefaults['atFrom'], string> = {
  report: "the report's own times",
  chords: "the mean mid-time of the event's positive chords",
  ephemeris: 'the middle of the ephemeris span',
};

const EDGES_FROM: Record<TimingDefaults['edgeSpeeds']['from'], string> = {
  fit: 'Edge speeds from the latest solved fit',
  prediction: "Edge speeds from the prediction's circle",
  full: 'Edge speeds: the full shadow speed',
};

/** Says where the prefilled speeds and distance come from, so nobody takes them for measured values. */
function DefaultsNote({ defaults, error }: { defaults: TimingDefaults | undefined; error: Error | null }) {
  if (defaults !== undefined)
    return (
      <>
        <p>
          Speed and distance from the event&apos;s geometry at {defaults.atUtc.slice(11, 19)} UTC (
          {AT_FROM[defaults.atFrom]})
          {defaults.exposureSeconds === null
            ? '; the station has no recorded exposure'
            : ', exposure from the station'}
          . Check them before timing.
        </p>
        <p>
          {EDGES_FROM[defaults.edgeSpeeds.from]}: {defaults.edgeSpeeds.note}. Diffraction, the star&apos;s
          disc and the exposure smear each edge over the limb-normal part of the shadow&apos;s motion there.
        </p>
      </>
    );
  if (error !== null)
    return <p>Speed and distance could not be taken from the event: {errorMessage(error)}</p>;
  return null;
}

/** Why an edge has no time: no event at all, or a curve that starts or ends inside it. */
function missingEdgeText(result: TimingResult, edge: 'disappearance' | 'reappearance'): string {
  if (result.disappearance === null && result.reappearance === null) return 'not found';
  return edge === 'disappearance'
    ? 'not in this curve (it starts inside the event)'
    : 'not in this curve (it ends inside the event)';
}

function TimesTable({ result }: { result: TimingResult }) {
  const speeds = result.edgeSpeedsKmPerS;
  const rows = [
    {
      label: `Disappearance${speeds ? ` (edge at ${speeds.disappearance.toFixed(2)} km/s)` : ''}`,
      mark: result.disappearance,
      missing: missingEdgeText(result, 'disappearance'),
    },
    {
      label: `Reappearance${speeds ? ` (edge at ${speeds.reappearance.toFixed(2)} km/s)` : ''}`,
      mark: result.reappearance,
      missing: missingEdgeText(result, 'reappearance'),
    },
    ...result.dips.flatMap((d, k) => [
      { label: `Dip ${k + 1} start${d.marked ? ' (marked)' : ''}`, mark: d.start, missing: '' },
      { label: `Dip ${k + 1} end${d.marked ? ' (marked)' : ''}`, mark: d.end, missing: '' },
    ]),
  ];
  return (
    <ScrollArea label="Fitted times table">
      <Table aria-label="Fitted times" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Edge</TableHeaderCell>
            <TableHeaderCell>Time (UTC)</TableHeaderCell>
            <TableHeaderCell>1σ (s)</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {rows.map((r) => (
            <TableRow key={r.label}>
              <TableCell>{r.label}</TableCell>
              <TableCell>{r.mark?.time ?? r.missing}</TableCell>
              <TableCell>{r.mark ? `± ${r.mark.sigmaSeconds.toFixed(4)}` : ''}</TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}

/** "value ± σ" (the shared rounding: σ to two significant digits); "—" without a value. */
function withSigma(value: number | null | undefined, sigma: number | null | undefined): string {
  if (value === null || value === undefined) return '—';
  return sigma === null || sigma === undefined ? value.toPrecision(3) : formatValueSigma(value, sigma);
}

/**
 * Each dip's products along the station's track (docs/method.md, "Ring dips"): apparent opacity, optical
 * depth τ and, with a ring's B, normal τ·|sin B|; its length, equivalent width and depth, each ± 1σ.
 * A dip not resolved (narrower than the Fresnel scale, the star or one exposure) or opaque gives lower
 * limits only, and the table says so.
 */
function DipsTable({ result }: { result: TimingResult }) {
  if (result.dips.length === 0) return null;
  const limited = result.dips.flatMap((d, k) => (d.lowerLimits ? [{ k, limits: d.lowerLimits }] : []));
  return (
    <>
      <ScrollArea label="Dip products table">
        <Table aria-label="Dip products" size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Dip</TableHeaderCell>
              <TableHeaderCell>Apparent opacity</TableHeaderCell>
              <TableHeaderCell>Optical depth τ</TableHeaderCell>
              <TableHeaderCell>Normal τ·|sin B|</TableHeaderCell>
              <TableHeaderCell>Length along track (km)</TableHeaderCell>
              <TableHeaderCell>Equivalent width (km)</TableHeaderCell>
              <TableHeaderCell>Equivalent depth (km)</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {result.dips.map((d, k) => (
              <TableRow key={d.start.time}>
                <TableCell>
                  {k + 1}
                  {d.lowerLimits ? ' (lower limits)' : ''}
                </TableCell>
                <TableCell>{withSigma(d.apparentOpacity, d.apparentOpacitySigma)}</TableCell>
                <TableCell>
                  {d.apparentOpticalDepth === null
                    ? 'opaque'
                    : withSigma(d.apparentOpticalDepth, d.apparentOpticalDepthSigma)}
                </TableCell>
                <TableCell>{withSigma(d.normalOpticalDepth, d.normalOpticalDepthSigma)}</TableCell>
                <TableCell>{withSigma(d.widthKm, d.widthKmSigma)}</TableCell>
                <TableCell>{withSigma(d.equivalentWidthKm, d.equivalentWidthKmSigma)}</TableCell>
                <TableCell>{withSigma(d.equivalentDepthKm, d.equivalentDepthKmSigma)}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </ScrollArea>
      {limited.map(({ k, limits }) => {
        const bounds =
          `opacity ≥ ${limits.apparentOpacity.toFixed(3)}, τ ≥ ${limits.apparentOpticalDepth.toFixed(3)}` +
          (limits.normalOpticalDepth === null
            ? ''
            : `, τ·|sin B| ≥ ${limits.normalOpticalDepth.toFixed(3)}`) +
          `, equivalent depth ≥ ${limits.equivalentDepthKm.toFixed(3)} km`;
        return limits.reason === 'opaque' ? (
          <p key={k}>
            Dip {k + 1} is opaque: its optical depth has no upper bound, only lower limits at 1σ: {bounds}.
          </p>
        ) : (
          <p key={k}>
            Dip {k + 1} is {limits.reason}: its light curve fixes the light it removed (the equivalent width)
            but not its depth and width apart, so the other values above are one fit among many equally good
            ones. Lower limits: {bounds}.
          </p>
        );
      })}
    </>
  );
}

/**
 * Whether the chord holds this timing's times; "In the chord" only while it does. A timing accepted
 * earlier and since replaced says by what.
 */
function ChordStatus({
  timing,
  chord,
  timings,
}: {
  timing: TimingSummary;
  chord: ChordProvenance | null;
  timings: TimingSummary[];
}) {
  if (timing.inChord)
    return (
      <Body1 as="p">
        <Badge appearance="filled" color="success">
          In the chord
        </Badge>
      </Body1>
    );
  if (timing.acceptedAt === null) return <Body1 as="p">Not in the chord.</Body1>;
  const accepted = `Accepted on ${utcText(timing.acceptedAt)}`;
  if (chord === null) return <Body1 as="p">{accepted}; the chord has since been deleted.</Body1>;
  if (chord.source === 'timing') {
    const other = timings.find((t) => t.id === chord.timingId);
    return (
      <Body1 as="p">
        {accepted}, since replaced by{' '}
        {other ? `the timing run of ${utcText(other.createdAt)}` : 'another timing of this light curve'}.
      </Body1>
    );
  }
  return (
    <Body1 as="p">
      {accepted}, since replaced by times {chordSourceText(chord.source)}.
    </Body1>
  );
}

function TimingActions({
  eventId,
  reportId,
  timing,
  onQueued,
}: {
  eventId: string;
  reportId: string;
  timing: TimingDetail;
  onQueued: (id: string) => void;
}) {
  const styles = useStyles();
  const accept = useAcceptTiming(eventId, timing.id);
  const conflict = replacesBetterTimingOf(accept.error);
  // The dialog opens from an answer, not a trigger: focus goes back to the accept button when it closes.
  const restoreFocus = useRestoreFocusTarget();
  const toRings = useDipsToRingEvents(eventId, timing.id);
  const mark = useMarkDip(eventId, reportId, timing.id, onQueued);
  const [ring, setRing] = useState('R1');
  const [ringError, setRingError] = useState<string | undefined>();
  const [dipStart, setDipStart] = useState('');
  const [dipEnd, setDipEnd] = useState('');
  const [dipErrors, setDipErrors] = useState<FieldErrors>({});
  const result = timing.result;
  // One edge is enough: a curve that starts or ends inside the event gives a single-edge chord.
  const canAccept = result != null && (result.disappearance !== null || result.reappearance !== null);

  const onRings = () => {
    const parsed = ringNameSchema.safeParse(ring);
    if (!parsed.success) {
      setRingError(parsed.error.issues[0]?.message);
      return;
    }
    setRingError(undefined);
    toRings.mutate(parsed.data);
  };
  const onMark = (event: FormEvent) => {
    event.preventDefault();
    const next: FieldErrors = {};
    const utc = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
    if (!utc.test(dipStart.trim())) next.startUtc = 'enter a UTC time such as 2028-03-14T02:14:30.5Z';
    if (!utc.test(dipEnd.trim())) next.endUtc = 'enter a UTC time such as 2028-03-14T02:14:31.0Z';
    if (Object.keys(next).length === 0 && Date.parse(dipEnd) <= Date.parse(dipStart))
      next.endUtc = 'must be after the start';
    setDipErrors(next);
    if (Object.keys(next).length > 0) return;
    mark.mutate(
      { startUtc: dipStart.trim(), endUtc: dipEnd.trim() },
      { onError: (error) => setDipErrors(fieldErrorsFromApi(error)) },
    );
  };

  return (
    <div className={styles.panel}>
      <div className={styles.row}>
        <Button
          appearance="primary"
          {...restoreFocus}
          disabled={!canAccept || accept.isPending || timing.inChord}
          onClick={() => accept.mutate({})}
        >
          Accept timing into chord
        </Button>
        {accept.isSuccess && <span role="status">Accepted into the chord.</span>}
      </div>
      {accept.isError && conflict === null && (
        <FormError title="Could not accept the timing" message={errorMessage(accept.error)} />
      )}
      <ReplaceTimingDialog
        conflict={conflict}
        pending={accept.isPending}
        onReplace={() => accept.mutate({ replaceTimedChord: true })}
        onKeep={() => accept.reset()}
      />
      <div className={styles.row}>
        <Field label="Ring name" validationMessage={ringError}>
          <Input value={ring} onChange={(_, d) => setRing(d.value)} />
        </Field>
        <Button
          disabled={
            (result?.dips.length ?? 0) === 0 || timing.ringEventsCreatedAt !== null || toRings.isPending
          }
          onClick={onRings}
        >
          Dips to ring events
        </Button>
        {(timing.ringEventsCreatedAt !== null || toRings.isSuccess) && (
          <span role="status">Ring events made from these dips.</span>
        )}
      </div>
      {toRings.isError && (
        <FormError title="Could not make ring events" message={errorMessage(toRings.error)} />
      )}
      <form aria-label="Mark a dip by hand" onSubmit={onMark} noValidate>
        <div className={styles.row}>
          <Field label="Dip start (UTC)" validationMessage={dipErrors.startUtc}>
            <Input value={dipStart} onChange={(_, d) => setDipStart(d.value)} />
          </Field>
          <Field label="Dip end (UTC)" validationMessage={dipErrors.endUtc}>
            <Input value={dipEnd} onChange={(_, d) => setDipEnd(d.value)} />
          </Field>
          <Button type="submit" disabled={mark.isPending}>
            Mark dip
          </Button>
        </div>
      </form>
    </div>
  );
}

/** One report's light curve: queue a timing, see it drawn with its times, and act on it. */
export function LightCurvePanel({ eventId, reportId, stationLabel, chord, canEdit }: LightCurvePanelProps) {
  const styles = useStyles();
  const timings = useTimings(eventId, reportId);
  const [selected, setSelected] = useState<string | null>(null);
  const newest = timings.data?.[0]?.id ?? null;
  useEffect(() => {
    if (selected === null && newest !== null) setSelected(newest);
  }, [selected, newest]);
  const timing = useTiming(eventId, selected);

  return (
    <section className={styles.panel} aria-label={`Light curve of ${stationLabel}`}>
      <Subtitle2 as="h3">Light curve of {stationLabel}</Subtitle2>
      {canEdit && <TimingForm eventId={eventId} reportId={reportId} onQueued={setSelected} />}
      {timings.isPending && <Loading label="Loading timings" />}
      {timings.isError && (
        <RequestFailed what="the timings" error={timings.error} onRetry={() => void timings.refetch()} />
      )}
      {timings.data !== undefined && timings.data.length > 1 && (
        <Field label="Timing run">
          <Select value={selected ?? ''} onChange={(_, d) => setSelected(d.value)}>
            {timings.data.map((t) => (
              <option key={t.id} value={t.id}>
                {utcText(t.createdAt)} ({t.state}
                {t.options.markedDips.length > 0 ? `, ${t.options.markedDips.length} marked dips` : ''}
                {t.inChord ? ', in the chord' : ''})
              </option>
            ))}
          </Select>
        </Field>
      )}
      {timings.data?.length === 0 && <p>No timing of this light curve yet.</p>}
      {timing.data && (timing.data.state === 'queued' || timing.data.state === 'running') && (
        <Loading label={`Timing ${timing.data.state}`} />
      )}
      {timing.data?.state === 'failed' && (
        <FormError title="The timing failed" message={timing.data.error ?? 'no reason given'} />
      )}
      {timing.data?.state === 'solved' && (
        <ChordStatus timing={timing.data} chord={chord} timings={timings.data ?? []} />
      )}
      {timing.data?.result && (
        <>
          <LightCurvePlot result={timing.data.result} stationLabel={stationLabel} />
          <TimesTable result={timing.data.result} />
          <DipsTable result={timing.data.result} />
          {canEdit && (
            <TimingActions
              eventId={eventId}
              reportId={reportId}
              timing={timing.data}
              onQueued={setSelected}
            />
          )}
        </>
      )}
    </section>
  );
}
