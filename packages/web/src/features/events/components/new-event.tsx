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
import { parseDeclination, parseRightAscension, type AngleParse } from '@limbus/schema/angles';
import { useState, type FormEvent } from 'react';
import {
  type BodyChoice,
  createEventPayloadOf,
  type CreateEventDraft,
  fieldErrorsOfIssues,
  type FieldErrors,
  useCreateEvent,
} from '../api/create-event';
import {
  bodyNamedInEventFile,
  eventFileInputSchema,
  type ImportBody,
  useImportEvent,
} from '../api/import-event';
import {
  BodyChooser,
  type BodyChooserValue,
  type BodyOption,
  FILE_BODY,
  initialBodyChoice,
  NEW_BODY,
} from './body-chooser';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  wrap: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(22em, 1fr))',
    gap: tokens.spacingHorizontalXXL,
  },
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  pair: { display: 'flex', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
});

/** Under an angle field: what was read, in degrees, while the person types. */
function angleHint(text: string, parsed: AngleParse, example: string): string {
  if (text.trim() === '') return example;
  return parsed.ok ? `= ${parsed.deg.toFixed(6)}°` : parsed.message;
}

function bodyChoiceOf(value: BodyChooserValue): BodyChoice {
  if (value.choice === NEW_BODY)
    return { kind: 'new', name: value.newName, designation: value.newDesignation };
  if (value.choice === '' || value.choice === FILE_BODY) return { kind: 'none' };
  return { kind: 'existing', bodyId: value.choice };
}

function ImportEventForm({
  teamId,
  bodies,
  onDone,
}: {
  teamId: string | null;
  bodies: BodyOption[] | null;
  onDone: (eventId: string) => void;
}) {
  const styles = useStyles();
  const [file, setFile] = useState<File | null>(null);
  const [fileBodyName, setFileBodyName] = useState<string | null>(null);
  const [body, setBody] = useState<BodyChooserValue>(() => initialBodyChoice(bodies));
  const [errors, setErrors] = useState<FieldErrors>({});
  const imported = useImportEvent(onDone);
  const issues = imported.error instanceof ApiError ? imported.error.issues : [];
  const bodyIssues = ['bodyId', 'bodyName', 'file.body.name'];
  const fileIssues = issues.filter((i) => !bodyIssues.includes(i.path));

  const chooseFile = async (chosen: File | null) => {
    imported.reset();
    setFile(chosen);
    const named = chosen === null ? null : await bodyNamedInEventFile(chosen);
    setFileBodyName(named);
    // The file's body becomes the default unless another was chosen on purpose.
    setBody((old) => {
      if (
        named !== null &&
        (old.choice === '' || old.choice === FILE_BODY || old.choice === initialBodyChoice(bodies).choice)
      )
        return { ...old, choice: FILE_BODY };
      if (named === null && old.choice === FILE_BODY) return initialBodyChoice(bodies);
      return old;
    });
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const next: FieldErrors = {};
    const parsed = eventFileInputSchema.safeParse(file);
    if (!parsed.success) next.file = parsed.error.issues[0]?.message ?? 'choose an event file';
    let target: ImportBody = {};
    if (body.choice === NEW_BODY) {
      if (body.newName.trim() === '') next.bodyName = 'name the new body';
      target = { bodyName: body.newName.trim() };
    } else if (body.choice === '') {
      next.bodyId = 'choose the body this event observes, or add a new one';
    } else if (body.choice !== FILE_BODY) {
      target = { bodyId: body.choice };
    }
    setErrors(next);
    if (!parsed.success || Object.keys(next).length > 0) return;
    imported.mutate(
      { file: parsed.data, teamId, body: target },
      {
        onError: (error) => {
          if (!(error instanceof ApiError)) return;
          const onBody: FieldErrors = {};
          for (const issue of error.issues) {
            if (issue.path === 'bodyId') onBody.bodyId ??= issue.message;
            if (issue.path === 'bodyName' || issue.path === 'file.body.name')
              onBody.bodyName ??= issue.message;
          }
          // A refused name of the file's own body is shown on the body field, where another can be chosen.
          if (onBody.bodyName !== undefined && body.choice !== NEW_BODY) onBody.bodyId ??= onBody.bodyName;
          setErrors(onBody);
        },
      },
    );
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Import an event file">
      <Subtitle2 as="h3">Import an event file</Subtitle2>
      <Field label="Event file (limbus-event/1 JSON)" required validationMessage={errors.file}>
        {(fieldProps) => (
          <input
            {...fieldProps}
            type="file"
            accept=".json,application/json"
            onChange={(event) => void chooseFile(event.currentTarget.files?.[0] ?? null)}
          />
        )}
      </Field>
      <BodyChooser
        bodies={bodies}
        value={body}
        onChange={setBody}
        errors={errors}
        fileBodyName={fileBodyName}
        withDesignation={false}
      />
      {fileIssues.length > 0 ? (
        <MessageBar intent="error" role="alert" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>The file was not imported</MessageBarTitle>
            <ul aria-label="Problems in the event file">
              {fileIssues.map((issue, i) => (
                <li key={i}>
                  <code>{issue.path}</code>: {issue.message}
                </li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      ) : imported.isError && issues.length === 0 ? (
        <FormError title="The file was not imported" message={errorMessage(imported.error)} />
      ) : null}
      <Button type="submit" disabled={imported.isPending}>
        {imported.isPending ? 'Importing…' : 'Import'}
      </Button>
    </form>
  );
}

// The fields the create form shows, by the server's path for each; other refusals are listed below it.
const PLACED = new Set([
  'title',
  'bodyId',
  'newBody.name',
  'newBody.designation',
  'star.raDeg',
  'star.decDeg',
  'star.pmRaCosDecMasPerYear',
  'star.pmDecMasPerYear',
  'star.parallaxMas',
  'star.catalogEpochJyear',
  'star.angularDiameterMas',
  'earthRotation.dut1Seconds',
  'eventTimeUtc',
  'ephemeris.timeScale',
  'ephemeris.rows',
]);

const EMPTY_DRAFT: Omit<CreateEventDraft, 'teamId' | 'body'> = {
  title: '',
  ra: '',
  dec: '',
  pmRa: '0',
  pmDec: '0',
  parallax: '0',
  epoch: '2016.0',
  angularDiameter: '',
  dut1: '0',
  eventTime: '',
  timeScale: 'TDB',
  rows: '',
};
type TextKey = Exclude<keyof typeof EMPTY_DRAFT, 'timeScale'>;

function CreateEventForm({
  teamId,
  bodies,
  onDone,
}: {
  teamId: string | null;
  bodies: BodyOption[] | null;
  onDone: (eventId: string) => void;
}) {
  const styles = useStyles();
  const [draft, setDraft] = useState(EMPTY_DRAFT);
  const [body, setBody] = useState<BodyChooserValue>(() => initialBodyChoice(bodies));
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateEvent(onDone);
  const set = (key: TextKey) => (_: unknown, d: { value: string }) =>
    setDraft((x) => ({ ...x, [key]: d.value }));
  const ra = parseRightAscension(draft.ra);
  const dec = parseDeclination(draft.dec);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const built = createEventPayloadOf({ ...draft, teamId, body: bodyChoiceOf(body) });
    if (!built.ok) {
      setErrors(built.errors);
      return;
    }
    setErrors({});
    create.mutate(built.input, {
      onError: (error) => {
        if (error instanceof ApiError) setErrors(fieldErrorsOfIssues(error.issues));
      },
    });
  };

  const unplaced = Object.entries(errors).filter(([path]) => !PLACED.has(path));
  const numberField = (key: TextKey, path: string, label: string, hint?: string, required = true) => (
    <Field label={label} required={required} hint={hint} validationMessage={errors[path]}>
      <Input inputMode="decimal" value={draft[key]} onChange={set(key)} />
    </Field>
  );

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Create an event">
      <Subtitle2 as="h3">Create an event</Subtitle2>
      <Field label="Title" required validationMessage={errors.title}>
        <Input value={draft.title} onChange={set('title')} />
      </Field>
      <BodyChooser bodies={bodies} value={body} onChange={setBody} errors={errors} withDesignation />
      <div className={styles.pair}>
        <Field
          label="Star RA (° or h m s)"
          required
          hint={
            errors['star.raDeg'] === undefined
              ? angleHint(draft.ra, ra, 'e.g. 116.328942 or 7h45m18.946s')
              : undefined
          }
          validationMessage={errors['star.raDeg']}
        >
          <Input value={draft.ra} onChange={set('ra')} />
        </Field>
        <Field
          label="Star Dec (° or ° ′ ″)"
          required
          hint={
            errors['star.decDeg'] === undefined
              ? angleHint(draft.dec, dec, 'e.g. 28.026183 or +28°01′34.26″')
              : undefined
          }
          validationMessage={errors['star.decDeg']}
        >
          <Input value={draft.dec} onChange={set('dec')} />
        </Field>
      </div>
      <div className={styles.pair}>
        {numberField('pmRa', 'star.pmRaCosDecMasPerYear', 'Proper motion μα* (mas/yr)', 'μα cos δ')}
        {numberField('pmDec', 'star.pmDecMasPerYear', 'Proper motion μδ (mas/yr)')}
      </div>
      <div className={styles.pair}>
        {numberField('parallax', 'star.parallaxMas', 'Parallax (mas)')}
        {numberField('epoch', 'star.catalogEpochJyear', 'Catalogue epoch (Julian year)', 'Gaia DR3: 2016.0')}
        {numberField(
          'angularDiameter',
          'star.angularDiameterMas',
          'Angular diameter (mas)',
          'Optional',
          false,
        )}
      </div>
      <div className={styles.pair}>
        {numberField(
          'dut1',
          'earthRotation.dut1Seconds',
          'DUT1 = UT1 − UTC (s)',
          'Within ±0.9 s; from the IERS bulletins',
        )}
        <Field
          label="Event time (UTC)"
          hint="Optional: defaults to the middle of the ephemeris. e.g. 2028-03-14 02:11:04"
          validationMessage={errors.eventTimeUtc}
        >
          <Input value={draft.eventTime} onChange={set('eventTime')} />
        </Field>
      </div>
      <Field label="Ephemeris time scale" validationMessage={errors['ephemeris.timeScale']}>
        <Select
          value={draft.timeScale}
          onChange={(_, d) =>
            setDraft((x) => ({
              ...x,
              timeScale: d.value === 'UTC' ? 'UTC' : d.value === 'TT' ? 'TT' : 'TDB',
            }))
          }
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
        validationMessage={errors['ephemeris.rows']}
      >
        <Textarea value={draft.rows} onChange={set('rows')} rows={5} resize="vertical" />
      </Field>
      {unplaced.length > 0 ? (
        <MessageBar intent="error" role="alert" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>The event was not created</MessageBarTitle>
            <ul aria-label="Other problems">
              {unplaced.map(([path, message]) => (
                <li key={path}>
                  <code>{path}</code>: {message}
                </li>
              ))}
            </ul>
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {create.isError && !(create.error instanceof ApiError && create.error.issues.length > 0) ? (
        <FormError title="The event was not created" message={errorMessage(create.error)} />
      ) : null}
      <Button appearance="primary" type="submit" disabled={create.isPending}>
        {create.isPending ? 'Creating…' : 'Create event'}
      </Button>
      <Body1 as="p">Stations and chords are added on the event's page.</Body1>
    </form>
  );
}

/** Two ways to start an event: a form for its body, star and ephemeris, or a whole event file. */
export function NewEvent({
  teamId,
  bodies,
  onDone,
}: {
  teamId: string | null;
  /** The team's bodies; null while they load. */
  bodies: BodyOption[] | null;
  onDone: (eventId: string) => void;
}) {
  const styles = useStyles();
  return (
    <section className={styles.wrap} aria-label="New event">
      <CreateEventForm teamId={teamId} bodies={bodies} onDone={onDone} />
      <ImportEventForm teamId={teamId} bodies={bodies} onDone={onDone} />
    </section>
  );
}
