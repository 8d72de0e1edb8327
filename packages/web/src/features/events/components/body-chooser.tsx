import { Field, Input, makeStyles, Select, tokens } from '@fluentui/react-components';

/** One of the team's bodies, as the chooser lists it. */
export interface BodyOption {
  id: string;
  name: string;
  designation: string | null;
}

/** '' nothing chosen, NEW_BODY a new one, FILE_BODY the one the event file names, else a body id. */
export const NEW_BODY = '__new';
export const FILE_BODY = '__file';

export interface BodyChooserValue {
  choice: string;
  newName: string;
  newDesignation: string;
}

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM },
});

/** A team with one body starts on it, a team without any on a new one; otherwise the person chooses. */
export function initialBodyChoice(bodies: BodyOption[] | null): BodyChooserValue {
  const only = bodies?.length === 1 ? bodies[0] : undefined;
  return {
    choice: only !== undefined ? only.id : bodies?.length === 0 ? NEW_BODY : '',
    newName: '',
    newDesignation: '',
  };
}

/**
 * The body an event observes: the team's bodies in a select, plus "New body…" with its name (and, where
 * the route takes it, its designation). Refusals arrive by the server's paths: `bodyId`, `newBody.name`
 * (or `bodyName` for an import), `newBody.designation`.
 */
export function BodyChooser({
  bodies,
  value,
  onChange,
  errors,
  fileBodyName = null,
  withDesignation,
}: {
  bodies: BodyOption[] | null;
  value: BodyChooserValue;
  onChange: (value: BodyChooserValue) => void;
  errors: Record<string, string>;
  /** The body an imported file names; it is then the default. */
  fileBodyName?: string | null;
  withDesignation: boolean;
}) {
  const styles = useStyles();
  return (
    <>
      <Field
        label="Body"
        required
        validationMessage={errors.bodyId}
        hint={fileBodyName === null ? undefined : `The file names the body “${fileBodyName}”.`}
      >
        <Select value={value.choice} onChange={(_, d) => onChange({ ...value, choice: d.value })}>
          {fileBodyName !== null ? (
            <option value={FILE_BODY}>As the file says: {fileBodyName}</option>
          ) : (
            <option value="">{bodies === null ? 'Loading the bodies…' : 'Choose a body…'}</option>
          )}
          {(bodies ?? []).map((b) => (
            <option key={b.id} value={b.id}>
              {b.designation === null ? b.name : `${b.name} (${b.designation})`}
            </option>
          ))}
          <option value={NEW_BODY}>New body…</option>
        </Select>
      </Field>
      {value.choice === NEW_BODY ? (
        <div className={styles.row}>
          <Field label="New body name" required validationMessage={errors['newBody.name'] ?? errors.bodyName}>
            <Input value={value.newName} onChange={(_, d) => onChange({ ...value, newName: d.value })} />
          </Field>
          {withDesignation ? (
            <Field
              label="New body designation"
              hint="Optional"
              validationMessage={errors['newBody.designation']}
            >
              <Input
                value={value.newDesignation}
                onChange={(_, d) => onChange({ ...value, newDesignation: d.value })}
              />
            </Field>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
