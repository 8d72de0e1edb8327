import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { stationInputSchema, useCreateStation } from '../api/create-station';
import { useDeleteStation } from '../api/delete-station';
import { FormError } from '@/components/form-error';
import { errorMessage, fieldErrorsFromApi, type FieldErrors } from '@/components/form-errors';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  form: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'start' },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end' },
  scroll: { overflowX: 'auto' },
});

export interface StationRow {
  id: string;
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  observerName?: string | null;
}

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

function AddStation({ eventId }: { eventId: string }) {
  const styles = useStyles();
  const [fields, setFields] = useState({ code: '', lat: '', lon: '', height: '', observer: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateStation(eventId);
  const shown = { ...fieldErrorsFromApi(create.error), ...errors };
  const set = (key: keyof typeof fields, value: string) => setFields((f) => ({ ...f, [key]: value }));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = stationInputSchema.safeParse({
      code: fields.code,
      latDeg: numberOf(fields.lat),
      lonDeg: numberOf(fields.lon),
      heightM: numberOf(fields.height),
      observerName: fields.observer.trim() === '' ? null : fields.observer,
    });
    if (!parsed.success) {
      const next: FieldErrors = {};
      for (const issue of parsed.error.issues) next[String(issue.path[0])] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: () => setFields({ code: '', lat: '', lon: '', height: '', observer: '' }),
    });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Add station">
      <Field label="Station id" required validationMessage={shown.code}>
        <Input value={fields.code} onChange={(_, d) => set('code', d.value)} />
      </Field>
      <Field label="Latitude (°)" required validationMessage={shown.latDeg}>
        <Input inputMode="decimal" value={fields.lat} onChange={(_, d) => set('lat', d.value)} />
      </Field>
      <Field label="Longitude (°, east positive)" required validationMessage={shown.lonDeg}>
        <Input inputMode="decimal" value={fields.lon} onChange={(_, d) => set('lon', d.value)} />
      </Field>
      <Field label="Height (m)" required validationMessage={shown.heightM}>
        <Input inputMode="decimal" value={fields.height} onChange={(_, d) => set('height', d.value)} />
      </Field>
      <Field label="Observer name" validationMessage={shown.observerName}>
        <Input value={fields.observer} onChange={(_, d) => set('observer', d.value)} />
      </Field>
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? 'Adding…' : 'Add station'}
      </Button>
      {create.isError ? (
        <FormError title="The station was not added" message={errorMessage(create.error)} />
      ) : null}
    </form>
  );
}

/** The event's stations (WGS84 geodetic, height above the ellipsoid); coordinators add and remove them. */
export function StationsPanel({
  eventId,
  stations,
  canEdit,
}: {
  eventId: string;
  stations: StationRow[];
  canEdit: boolean;
}) {
  const styles = useStyles();
  const remove = useDeleteStation(eventId);
  return (
    <section className={styles.panel} aria-label="Stations">
      {stations.length === 0 ? (
        <Body1 as="p">No stations yet.</Body1>
      ) : (
        <div className={styles.scroll}>
          <Table aria-label="Stations" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Station</TableHeaderCell>
                <TableHeaderCell>Latitude (°)</TableHeaderCell>
                <TableHeaderCell>Longitude (°E)</TableHeaderCell>
                <TableHeaderCell>Height (m)</TableHeaderCell>
                <TableHeaderCell>Observer</TableHeaderCell>
                {canEdit ? <TableHeaderCell>Actions</TableHeaderCell> : null}
              </TableRow>
            </TableHeader>
            <TableBody>
              {stations.map((s) => (
                <TableRow key={s.id}>
                  <TableCell>{s.code}</TableCell>
                  <TableCell className={styles.number}>{s.latDeg.toFixed(5)}</TableCell>
                  <TableCell className={styles.number}>{s.lonDeg.toFixed(5)}</TableCell>
                  <TableCell className={styles.number}>{s.heightM.toFixed(0)}</TableCell>
                  <TableCell>{s.observerName ?? '—'}</TableCell>
                  {canEdit ? (
                    <TableCell>
                      <Button
                        size="small"
                        aria-label={`Delete station ${s.code}`}
                        disabled={remove.isPending}
                        onClick={() => remove.mutate(s.id)}
                      >
                        Delete
                      </Button>
                    </TableCell>
                  ) : null}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        </div>
      )}
      {remove.isError ? (
        <FormError title="The station was not deleted" message={errorMessage(remove.error)} />
      ) : null}
      {canEdit ? <AddStation eventId={eventId} /> : null}
    </section>
  );
}
