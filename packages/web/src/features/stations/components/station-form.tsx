import { Button, Field, Input, makeStyles, Select, tokens } from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { stationInputSchema, type StationInput } from '../api/create-station';
import type { TeamMember } from '../api/get-team-members';
import { fieldErrorsFromApi, fieldErrorsFromZod, type FieldErrors } from '@/components/form-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'start' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, alignSelf: 'end' },
});

/** A station as the event answer sends it (WGS84 geodetic, height above the ellipsoid). */
export interface StationRow {
  id: string;
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  observerId?: string | null;
  observerName?: string | null;
  apertureMm?: number | null;
  camera?: string | null;
  exposureSeconds?: number | null;
  timeSource?: string | null;
}

// The observer choice: nobody, a member of the team (by user id), or a name typed for someone without
// an account.
const NOBODY = '';
const FREE_TEXT = 'free';
const memberChoice = (userId: string) => `member:${userId}`;

interface Draft {
  code: string;
  lat: string;
  lon: string;
  height: string;
  observer: string;
  observerName: string;
  aperture: string;
  camera: string;
  exposure: string;
  timeSource: string;
}

const text = (value: number | string | null | undefined) => (value == null ? '' : String(value));

function draftOf(station: StationRow | null): Draft {
  const observer = station?.observerId
    ? memberChoice(station.observerId)
    : station?.observerName
      ? FREE_TEXT
      : NOBODY;
  return {
    code: station?.code ?? '',
    lat: text(station?.latDeg),
    lon: text(station?.lonDeg),
    height: text(station?.heightM),
    observer,
    observerName: station?.observerId ? '' : (station?.observerName ?? ''),
    aperture: text(station?.apertureMm),
    camera: station?.camera ?? '',
    exposure: text(station?.exposureSeconds),
    timeSource: station?.timeSource ?? '',
  };
}

const numberOf = (value: string) => (value.trim() === '' ? Number.NaN : Number(value));
const numberOrNull = (value: string) => (value.trim() === '' ? null : Number(value));
const textOrNull = (value: string) => (value.trim() === '' ? null : value);

function candidateOf(d: Draft) {
  const memberId = d.observer.startsWith('member:') ? d.observer.slice('member:'.length) : null;
  return {
    code: d.code,
    latDeg: numberOf(d.lat),
    lonDeg: numberOf(d.lon),
    heightM: numberOf(d.height),
    observerId: memberId,
    observerName: d.observer === FREE_TEXT ? textOrNull(d.observerName) : null,
    apertureMm: numberOrNull(d.aperture),
    camera: textOrNull(d.camera),
    exposureSeconds: numberOrNull(d.exposure),
    timeSource: textOrNull(d.timeSource),
  };
}

/** Members with the observer role first, then the others, each group by name. */
function memberGroups(members: TeamMember[]) {
  const byName = [...members].sort((a, b) => a.name.localeCompare(b.name));
  return {
    observers: byName.filter((m) => m.roles.includes('observer')),
    others: byName.filter((m) => !m.roles.includes('observer')),
  };
}

export interface StationFormProps {
  /** The station being edited, or null for a new one. */
  station: StationRow | null;
  /** The team's members; undefined while they load. */
  members: TeamMember[] | undefined;
  formLabel: string;
  submitLabel: string;
  pending: boolean;
  /** The server's refusal, whose field issues land on the fields. */
  serverError: unknown;
  onSubmit: (input: StationInput, reset: () => void) => void;
  onCancel?: () => void;
}

/** The station's position, observer and equipment, checked before they are sent. */
export function StationForm({
  station,
  members,
  formLabel,
  submitLabel,
  pending,
  serverError,
  onSubmit,
  onCancel,
}: StationFormProps) {
  const styles = useStyles();
  const [draft, setDraft] = useState<Draft>(() => draftOf(station));
  const [errors, setErrors] = useState<FieldErrors>({});
  const shown = { ...fieldErrorsFromApi(serverError), ...errors };
  const set = (key: keyof Draft, value: string) => setDraft((d) => ({ ...d, [key]: value }));
  const groups = memberGroups(members ?? []);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = stationInputSchema.safeParse(candidateOf(draft));
    const next = parsed.success ? {} : fieldErrorsFromZod(parsed.error);
    if (draft.observer === FREE_TEXT && draft.observerName.trim() === '')
      next.observerName ??= 'type the observer’s name, or choose “No observer yet”';
    if (!parsed.success || Object.keys(next).length > 0) {
      setErrors(next);
      return;
    }
    setErrors({});
    onSubmit(parsed.data, () => setDraft(draftOf(null)));
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label={formLabel}>
      <Field label="Station id" required validationMessage={shown.code}>
        <Input value={draft.code} onChange={(_, d) => set('code', d.value)} />
      </Field>
      <Field label="Latitude (°)" required validationMessage={shown.latDeg}>
        <Input inputMode="decimal" value={draft.lat} onChange={(_, d) => set('lat', d.value)} />
      </Field>
      <Field label="Longitude (°, east positive)" required validationMessage={shown.lonDeg}>
        <Input inputMode="decimal" value={draft.lon} onChange={(_, d) => set('lon', d.value)} />
      </Field>
      <Field label="Height (m)" required validationMessage={shown.heightM}>
        <Input inputMode="decimal" value={draft.height} onChange={(_, d) => set('height', d.value)} />
      </Field>
      <Field
        label="Observer"
        validationMessage={shown.observerId}
        hint={members === undefined ? 'Loading the team’s members…' : undefined}
      >
        <Select value={draft.observer} onChange={(_, d) => set('observer', d.value)}>
          <option value={NOBODY}>No observer yet</option>
          {groups.observers.length > 0 ? (
            <optgroup label="Observers">
              {groups.observers.map((m) => (
                <option key={m.userId} value={memberChoice(m.userId)}>
                  {m.name}
                </option>
              ))}
            </optgroup>
          ) : null}
          {groups.others.length > 0 ? (
            <optgroup label="Other members">
              {groups.others.map((m) => (
                <option key={m.userId} value={memberChoice(m.userId)}>
                  {m.name}
                </option>
              ))}
            </optgroup>
          ) : null}
          {/* A member who left keeps the station until someone chooses again. */}
          {draft.observer.startsWith('member:') &&
          members !== undefined &&
          !members.some((m) => memberChoice(m.userId) === draft.observer) ? (
            <option value={draft.observer}>{station?.observerName ?? 'a former member'}</option>
          ) : null}
          <option value={FREE_TEXT}>Observer without an account</option>
        </Select>
      </Field>
      {draft.observer === FREE_TEXT ? (
        <Field label="Observer name" required validationMessage={shown.observerName}>
          <Input value={draft.observerName} onChange={(_, d) => set('observerName', d.value)} />
        </Field>
      ) : null}
      <Field label="Aperture (mm)" validationMessage={shown.apertureMm}>
        <Input inputMode="decimal" value={draft.aperture} onChange={(_, d) => set('aperture', d.value)} />
      </Field>
      <Field label="Camera" validationMessage={shown.camera}>
        <Input value={draft.camera} onChange={(_, d) => set('camera', d.value)} />
      </Field>
      <Field label="Exposure (s)" validationMessage={shown.exposureSeconds}>
        <Input inputMode="decimal" value={draft.exposure} onChange={(_, d) => set('exposure', d.value)} />
      </Field>
      <Field label="Time source" validationMessage={shown.timeSource} hint="e.g. GPS 1PPS, NTP">
        <Input value={draft.timeSource} onChange={(_, d) => set('timeSource', d.value)} />
      </Field>
      <div className={styles.actions}>
        <Button type="submit" appearance="primary" disabled={pending}>
          {pending ? 'Saving…' : submitLabel}
        </Button>
        {onCancel ? <Button onClick={onCancel}>Cancel</Button> : null}
      </div>
    </form>
  );
}
