import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  Subtitle2,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { createEventInputSchema, parseEphemerisLines, useCreateEvent } from '../api/create-event';
import { eventFileInputSchema, useImportEvent } from '../api/import-event';
import { ApiError } from '@/lib/api-client';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';

const useStyles = makeStyles({
  wrap: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(22em, 1fr))',
    gap: tokens.spacingHorizontalXXL,
  },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  pair: { display: 'flex', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
});

const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

function ImportEventForm({ teamId, onDone }: { teamId: string | null; onDone: (eventId: string) => void }) {
  const styles = useStyles();
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const imported = useImportEvent(onDone);
  const issues = imported.error instanceof ApiError ? imported.error.issues : [];

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = eventFileInputSchema.safeParse(file);
    if (!parsed.success) {
      setFileError(parsed.error.issues[0]?.message);
      return;
    }
    setFileError(undefined);
    imported.mutate({ file: parsed.data, teamId });
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Import an event file">
      <Subtitle2 as="h3">Import an event file</Subtitle2>
      <Field label="Event file (limbus-event/1 JSON)" validationMessage={fileError}>
        {(fieldProps) => (
          <input
            {...fieldProps}
            type="file"
            accept=".json,application/json"
            onChange={(event) => {
              imported.reset();
              setFile(event.currentTarget.files?.[0] ?? null);
            }}
          />
        )}
      </Field>
      {issues.length > 0 ? (
        <MessageBar intent="error" role="alert" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>The file was not imported</MessageBarTitle>
            <ul aria-label="Problems in the event file">
              {issues.map((issue, i) => (
                <li key={i}>
                  <code>{issue.path}</code>: {issue.message}
                </li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      ) : imported.isError ? (
        <FormError title="The file was not imported" message={errorMessage(imported.error)} />
      ) : null}
      <Button type="submit" disabled={imported.isPending}>
        {imported.isPending ? 'Importing…' : 'Import'}
      </Button>
    </form>
  );
}

function CreateEventForm({ teamId, onDone }: { teamId: string | null; onDone: (eventId: string) => void }) {
  const styles = useStyles();
  const [title, setTitle] = useState('');
  const [ra, setRa] = useState('');
  const [dec, setDec] = useState('');
  const [timeScale, setTimeScale] = useState<'UTC' | 'TT' | 'TDB'>('TDB');
  const [rows, setRows] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreateEvent(onDone);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = createEventInputSchema.safeParse({
      ...(teamId === null ? {} : { teamId }),
      title,
      star: { raDeg: numberOf(ra), decDeg: numberOf(dec) },
      ephemeris: { timeScale, rows: parseEphemerisLines(rows) },
    });
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) {
        const [first, second, index] = issue.path;
        const key = first === 'ephemeris' && second === 'rows' ? 'rows' : issue.path.join('.');
        next[key] ??= typeof index === 'number' ? `line ${index + 1}: ${issue.message}` : issue.message;
      }
      setErrors(next);
      return;
    }
    setErrors({});
    create.mutate(parsed.data);
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Create an event">
      <Subtitle2 as="h3">Create an event</Subtitle2>
      <Field label="Title" required validationMessage={errors.title}>
        <Input value={title} onChange={(_, d) => setTitle(d.value)} />
      </Field>
      <div className={styles.pair}>
        <Field label="Star RA (°)" required validationMessage={errors['star.raDeg']}>
          <Input inputMode="decimal" value={ra} onChange={(_, d) => setRa(d.value)} />
        </Field>
        <Field label="Star Dec (°)" required validationMessage={errors['star.decDeg']}>
          <Input inputMode="decimal" value={dec} onChange={(_, d) => setDec(d.value)} />
        </Field>
      </div>
      <Field label="Ephemeris time scale">
        <Select
          value={timeScale}
          onChange={(_, d) => setTimeScale(d.value === 'UTC' ? 'UTC' : d.value === 'TT' ? 'TT' : 'TDB')}
        >
          <option>TDB</option>
          <option>TT</option>
          <option>UTC</option>
        </Select>
      </Field>
      <Field
        label="Ephemeris rows"
        required
        hint="One row per line: time (no zone), RA (°), Dec (°), distance (km). At least 4 rows."
        validationMessage={errors.rows}
      >
        <Textarea value={rows} onChange={(_, d) => setRows(d.value)} rows={5} resize="vertical" />
      </Field>
      {create.isError ? (
        <FormError title="The event was not created" message={errorMessage(create.error)} />
      ) : null}
      <Button appearance="primary" type="submit" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create event'}
      </Button>
      <Body1 as="p">Stations and chords are added on the event's page.</Body1>
    </form>
  );
}

/** Two ways to start an event: a form for its star and ephemeris, or a whole event file. */
export function NewEvent({ teamId, onDone }: { teamId: string | null; onDone: (eventId: string) => void }) {
  const styles = useStyles();
  return (
    <section className={styles.wrap} aria-label="New event">
      <CreateEventForm teamId={teamId} onDone={onDone} />
      <ImportEventForm teamId={teamId} onDone={onDone} />
    </section>
  );
}
