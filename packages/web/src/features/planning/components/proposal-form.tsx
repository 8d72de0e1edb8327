import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { siteProposalPayloadSchema } from '@limbus/schema/planning';
import { useState, type FormEvent } from 'react';
import { useProposeSite } from '../api/propose-site';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(12em, 1fr))',
    gap: tokens.spacingHorizontalM,
  },
});

const FIELDS = [
  ['code', 'Station id', 'text'],
  ['latDeg', 'Latitude (°)', 'decimal'],
  ['lonDeg', 'Longitude (°, east positive)', 'decimal'],
  ['heightM', 'Height (m above the ellipsoid)', 'decimal'],
] as const;
type Key = (typeof FIELDS)[number][0] | 'notes';

const EMPTY: Record<Key, string> = { code: '', latDeg: '', lonDeg: '', heightM: '', notes: '' };
const numberOf = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));

/**
 * An observer proposes their own site for the event. It shows on the map as proposed, with them as its
 * observer, until a coordinator accepts it (a planned station) or declines it.
 */
export function ProposalForm({ eventId }: { eventId: string }) {
  const styles = useStyles();
  const propose = useProposeSite(eventId);
  const [values, setValues] = useState(EMPTY);
  const [errors, setErrors] = useState<Partial<Record<string, string>>>({});
  const [sent, setSent] = useState<string | null>(null);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setSent(null);
    const parsed = siteProposalPayloadSchema.safeParse({
      code: values.code.trim(),
      latDeg: numberOf(values.latDeg),
      lonDeg: numberOf(values.lonDeg),
      heightM: numberOf(values.heightM),
      ...(values.notes.trim() === '' ? {} : { notes: values.notes.trim() }),
    });
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) next[String(issue.path[0])] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    propose.mutate(parsed.data, {
      onSuccess: () => {
        setSent(parsed.data.code);
        setValues(EMPTY);
      },
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        const next: Record<string, string> = {};
        for (const issue of error.issues) next[issue.path] ??= issue.message;
        setErrors(next);
      },
    });
  };

  const placed = new Set<string>(['code', 'latDeg', 'lonDeg', 'heightM', 'notes']);
  const unplaced =
    propose.error instanceof ApiError ? propose.error.issues.filter((i) => !placed.has(i.path)) : [];

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Propose a site">
      <div className={styles.grid}>
        {FIELDS.map(([key, label, mode]) => (
          <Field key={key} label={label} required validationMessage={errors[key]}>
            <Input
              inputMode={mode}
              value={values[key]}
              onChange={(_, d) => setValues((v) => ({ ...v, [key]: d.value }))}
            />
          </Field>
        ))}
      </div>
      <Field
        label="Notes"
        hint="Access, horizon, permission to use the land: what the coordinator should know."
        validationMessage={errors.notes}
      >
        <Textarea value={values.notes} onChange={(_, d) => setValues((v) => ({ ...v, notes: d.value }))} />
      </Field>
      {propose.isError &&
      (!(propose.error instanceof ApiError) || unplaced.length > 0 || propose.error.issues.length === 0) ? (
        <FormError
          title="The site was not proposed"
          message={
            unplaced.length > 0
              ? unplaced.map((i) => `${i.path}: ${i.message}`).join('; ')
              : errorMessage(propose.error)
          }
        />
      ) : null}
      {sent !== null ? (
        <MessageBar intent="success">
          <MessageBarBody>Proposed {sent}: it waits for a coordinator to accept it.</MessageBarBody>
        </MessageBar>
      ) : null}
      <div>
        <Button appearance="primary" type="submit" disabled={propose.isPending}>
          {propose.isPending ? 'Proposing…' : 'Propose this site'}
        </Button>
      </div>
    </form>
  );
}
