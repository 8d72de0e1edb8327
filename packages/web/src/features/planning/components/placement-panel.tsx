import {
  Body1,
  Button,
  Checkbox,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import {
  MAX_PLACEMENT_SITES,
  placementQuerySchema,
  type PlacementAnswer,
  type PlacementSuggestion,
} from '@limbus/schema/planning';
import { useState, type FormEvent } from 'react';
import { useCreatePlannedStation } from '../api/create-planned-station';
import { usePlacement, type PlacementRequest } from '../api/get-placement';
import { degText, utcAt } from '../planning-text';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';
import { ApiError } from '@/lib/api-client';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'flex-end' },
  region: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(11em, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
  number: { fontFamily: tokens.fontFamilyMonospace, whiteSpace: 'nowrap' },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
});

const REGION_FIELDS = [
  ['latMinDeg', 'Latitude from (°)'],
  ['latMaxDeg', 'Latitude to (°)'],
  ['lonMinDeg', 'Longitude from (°, east positive)'],
  ['lonMaxDeg', 'Longitude to (°, east positive)'],
] as const;
type RegionKey = (typeof REGION_FIELDS)[number][0];

const REFERENCE_WORDS: Record<PlacementAnswer['criteria']['reference']['kind'], string> = {
  stations: 'the team’s stations',
  region: 'the middle of the region',
  substellar: 'the point with the star overhead at closest approach',
};

function Criteria({ answer }: { answer: PlacementAnswer }) {
  const { criteria } = answer;
  const ref = criteria.reference;
  return (
    <Body1 as="p">
      Each ground point is at night with the star up when the shadow passes: the Sun more than{' '}
      {Math.abs(criteria.sunAltitudeBelowDeg)}° below the horizon and the star more than{' '}
      {criteria.starAltitudeAboveDeg}° above it
      {criteria.region === null
        ? ''
        : `, within latitude ${criteria.region.latMinDeg}° to ${criteria.region.latMaxDeg}° and longitude ${criteria.region.lonMinDeg}° to ${criteria.region.lonMaxDeg}°`}
      ; the nearest such point to {REFERENCE_WORDS[ref.kind]} ({degText(ref.latDeg)}, {degText(ref.lonDeg)})
      is given. The span to cover is {answer.spanKm.fromKm.toFixed(0)} to {answer.spanKm.toKm.toFixed(0)} km
      across the path ({answer.ringsToo ? 'the body and its rings' : 'the body'}); the path’s 1σ is{' '}
      {answer.sigmaCrossTrackKm.toFixed(1)} km. Largest gap now {answer.largestGapKmBefore.toFixed(1)} km,
      after these sites {answer.largestGapKmAfter.toFixed(1)} km; the farthest any part of the span lies from
      its nearest chord: now{' '}
      {answer.worstDistanceKmBefore === null
        ? 'no chord inside the span'
        : `${answer.worstDistanceKmBefore.toFixed(1)} km`}
      , after these sites {answer.worstDistanceKmAfter.toFixed(1)} km.
    </Body1>
  );
}

function SuggestionRow({
  eventId,
  suggestion,
  sigmaKm,
}: {
  eventId: string;
  suggestion: PlacementSuggestion;
  sigmaKm: number;
}) {
  const styles = useStyles();
  const create = useCreatePlannedStation(eventId);
  const [code, setCode] = useState(suggestion.code);
  const [made, setMade] = useState<string | null>(null);
  const site = suggestion.site;
  const codeError =
    create.error instanceof ApiError
      ? create.error.issues.find((i) => i.path === 'code')?.message
      : undefined;
  const offset = formatValueSigma(Math.abs(suggestion.crossTrackKm), sigmaKm);
  const sign = suggestion.crossTrackKm > 0 ? '+' : suggestion.crossTrackKm < 0 ? '−' : '';
  return (
    <TableRow>
      <TableCell>
        <Field validationMessage={codeError}>
          <Input
            aria-label={`Station id for the site at ${sign}${Math.abs(suggestion.crossTrackKm).toFixed(0)} km`}
            value={code}
            disabled={made !== null || site === null}
            onChange={(_, d) => setCode(d.value)}
          />
        </Field>
      </TableCell>
      <TableCell className={styles.number}>
        {sign}
        {offset} km
      </TableCell>
      <TableCell>{suggestion.crosses === 'body' ? 'the body' : 'rings only'}</TableCell>
      <TableCell className={styles.number}>
        {suggestion.gap.fromKm.toFixed(0)} to {suggestion.gap.toKm.toFixed(0)} km (
        {suggestion.gap.widthKm.toFixed(0)} km wide)
      </TableCell>
      {site === null ? (
        <TableCell colSpan={6}>
          {suggestion.noSiteReason ?? 'No ground point meets the conditions.'}
        </TableCell>
      ) : (
        <>
          <TableCell className={styles.number}>
            {site.latDeg.toFixed(4)}°, {site.lonDeg.toFixed(4)}°
          </TableCell>
          <TableCell className={styles.number}>{utcAt(site.timeUtc)}</TableCell>
          <TableCell className={styles.number}>
            {degText(site.starAltitudeDeg)} / {degText(site.starAzimuthDeg)}
          </TableCell>
          <TableCell className={styles.number}>{degText(site.sunAltitudeDeg)}</TableCell>
          <TableCell className={styles.number}>{site.distanceFromReferenceKm.toFixed(0)} km</TableCell>
          <TableCell>
            {made !== null ? (
              <span role="status">Planned as {made}</span>
            ) : (
              <>
                <Button
                  size="small"
                  aria-label={`Make a planned station ${code.trim()}`}
                  disabled={create.isPending || code.trim() === ''}
                  onClick={() => create.mutate({ code, site }, { onSuccess: () => setMade(code.trim()) })}
                >
                  Make a planned station
                </Button>
                {create.isError && codeError === undefined ? (
                  <FormError title="The station was not made" message={errorMessage(create.error)} />
                ) : null}
              </>
            )}
          </TableCell>
        </>
      )}
    </TableRow>
  );
}

/**
 * Where to send more observers: how many more sites the team can field, optionally within a region and
 * covering the rings too. The server suggests cross-track offsets that split the largest gaps in
 * coverage, each with the nearest ground point at night with the star up; a coordinator makes any of them
 * a planned station, which then shows on the map and in the coverage.
 */
export function PlacementPanel({ eventId }: { eventId: string }) {
  const styles = useStyles();
  const [sites, setSites] = useState('2');
  const [ringsToo, setRingsToo] = useState(false);
  const [region, setRegion] = useState<Record<RegionKey, string>>({
    latMinDeg: '',
    latMaxDeg: '',
    lonMinDeg: '',
    lonMaxDeg: '',
  });
  const [request, setRequest] = useState<PlacementRequest | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const placement = usePlacement(eventId, request);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const bounds = REGION_FIELDS.map(([k]) => region[k].trim());
    const given = bounds.filter((b) => b !== '').length;
    const next: Record<string, string> = {};
    if (given > 0 && given < 4) next.region = 'give all four bounds of the region, or none';
    // The server's own query schema, so the form refuses what the route would.
    const parsed = placementQuerySchema.safeParse({
      sites: sites.trim(),
      ringsToo: String(ringsToo),
      ...(given === 4 ? { region: bounds.join(',') } : {}),
    });
    if (!parsed.success)
      for (const issue of parsed.error.issues) next[String(issue.path[0] ?? 'sites')] ??= issue.message;
    setErrors(next);
    if (!parsed.success || Object.keys(next).length > 0) return;
    setRequest({
      sites: parsed.data.sites,
      ringsToo: parsed.data.ringsToo,
      region: parsed.data.region ?? null,
    });
  };

  const serverErrors: Record<string, string> = {};
  if (placement.error instanceof ApiError)
    for (const issue of placement.error.issues) serverErrors[issue.path] ??= issue.message;
  const shown = { ...serverErrors, ...errors };
  const answer = placement.data;

  return (
    <section className={styles.panel} aria-label="Placement">
      <form className={styles.panel} onSubmit={submit} noValidate aria-label="Suggest sites">
        <div className={styles.row}>
          <Field
            label="How many more sites"
            required
            hint={`1 to ${MAX_PLACEMENT_SITES}`}
            validationMessage={shown.sites}
          >
            <Input inputMode="numeric" value={sites} onChange={(_, d) => setSites(d.value)} />
          </Field>
          <Checkbox
            label="Cover the rings too"
            checked={ringsToo}
            onChange={(_, d) => setRingsToo(d.checked === true)}
          />
        </div>
        <Field
          label="Region (optional)"
          hint="Only sites within these bounds; a longitude range from east to west crosses ±180°."
          validationMessage={shown.region}
        >
          <div className={styles.region}>
            {REGION_FIELDS.map(([key, label]) => (
              <Field key={key} label={label}>
                <Input
                  inputMode="decimal"
                  value={region[key]}
                  onChange={(_, d) => setRegion((r) => ({ ...r, [key]: d.value }))}
                />
              </Field>
            ))}
          </div>
        </Field>
        <div className={styles.row}>
          <Button appearance="primary" type="submit" disabled={placement.isFetching}>
            {placement.isFetching ? 'Suggesting…' : request === null ? 'Suggest sites' : 'Suggest again'}
          </Button>
        </div>
      </form>
      {placement.isError && Object.keys(serverErrors).length === 0 ? (
        <FormError title="No suggestions" message={errorMessage(placement.error)} />
      ) : null}
      {answer !== undefined ? (
        <>
          <Criteria answer={answer} />
          {answer.cautions.length > 0 ? (
            <MessageBar intent="warning" layout="multiline">
              <MessageBarBody>
                <ul className={styles.list}>
                  {answer.cautions.map((c) => (
                    <li key={c}>{c}</li>
                  ))}
                </ul>
              </MessageBarBody>
            </MessageBar>
          ) : null}
          {answer.suggestions.length === 0 ? (
            <Body1 as="p">No gap is left to fill.</Body1>
          ) : (
            <ScrollArea label="Suggested sites table">
              <Table aria-label="Suggested sites" size="small">
                <TableHeader>
                  <TableRow>
                    {[
                      'Station id',
                      'Cross-track offset (km, path ±1σ)',
                      'Crosses',
                      'Gap it splits (km)',
                      'Ground point (lat, lon)',
                      'Shadow passes (UTC)',
                      'Star altitude / azimuth (°)',
                      'Sun altitude (°)',
                      'From the reference (km)',
                      'Make it a station',
                    ].map((h) => (
                      <TableHeaderCell key={h}>{h}</TableHeaderCell>
                    ))}
                  </TableRow>
                </TableHeader>
                <TableBody>
                  {answer.suggestions.map((s) => (
                    <SuggestionRow
                      key={`${s.crossTrackKm}-${s.code}`}
                      eventId={eventId}
                      suggestion={s}
                      sigmaKm={answer.sigmaCrossTrackKm}
                    />
                  ))}
                </TableBody>
              </Table>
            </ScrollArea>
          )}
        </>
      ) : null}
    </section>
  );
}
