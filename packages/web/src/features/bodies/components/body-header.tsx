import { Body1, Button, Field, Input, makeStyles, Title2, tokens } from '@fluentui/react-components';
import { patchBodyPayloadSchema } from '@limbus/schema/bodies';
import { useState, type FormEvent } from 'react';
import { useDeleteBody } from '../api/delete-body';
import type { BodyDetail } from '../api/get-body';
import { useUpdateBody } from '../api/update-body';
import { ConfirmButton } from '@/components/confirm-button';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  header: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS },
  form: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalM,
    alignItems: 'start',
    maxWidth: '48em',
  },
  buttons: { display: 'flex', gap: tokens.spacingHorizontalS, marginTop: '26px' },
});

function EditBodyForm({ body, onDone }: { body: BodyDetail; onDone: () => void }) {
  const styles = useStyles();
  const [name, setName] = useState(body.name);
  const [designation, setDesignation] = useState(body.designation ?? '');
  const [errors, setErrors] = useState<FieldErrors>({});
  const update = useUpdateBody(body.id, body.teamId);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    // An emptied designation is cleared (null), not sent as an empty text the schema refuses.
    const parsed = patchBodyPayloadSchema.safeParse({
      name,
      designation: designation.trim() === '' ? null : designation,
    });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    update.mutate(parsed.data, {
      onSuccess: onDone,
      onError: (error) => setErrors(fieldErrorsFromApi(error)),
    });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Edit the body">
      <div className={styles.form}>
        <Field label="Name" required validationMessage={errors.name}>
          <Input value={name} onChange={(_, d) => setName(d.value)} />
        </Field>
        <Field label="Designation" validationMessage={errors.designation}>
          <Input value={designation} onChange={(_, d) => setDesignation(d.value)} />
        </Field>
        <div className={styles.buttons}>
          <Button type="submit" appearance="primary" disabled={update.isPending}>
            {update.isPending ? 'Saving…' : 'Save'}
          </Button>
          <Button onClick={onDone}>Cancel</Button>
        </div>
      </div>
      {update.isError && !(update.error instanceof ApiError && update.error.issues.length > 0) ? (
        <FormError title="The body was not changed" message={errorMessage(update.error)} />
      ) : null}
    </form>
  );
}

function DeleteBodyButton({ body, onDeleted }: { body: BodyDetail; onDeleted: () => void }) {
  const remove = useDeleteBody(body.id, body.teamId, onDeleted);
  return (
    <ConfirmButton
      size="medium"
      text="Delete body"
      name="Delete body"
      title={`Delete ${body.name}?`}
      description="A body can be deleted only while no event, active or archived, observes it. Its physical parameters go with it."
      confirmText="Delete"
      cancelText="Keep it"
      pending={remove.isPending}
      error={remove.error}
      onOpen={() => remove.reset()}
      onConfirm={(close) => remove.mutate(undefined, { onSuccess: close })}
    />
  );
}

/** The body's name and designation; coordinators rename it, and delete it once no event observes it. */
export function BodyHeader({
  body,
  canEdit,
  onDeleted,
}: {
  body: BodyDetail;
  canEdit: boolean;
  onDeleted: () => void;
}) {
  const styles = useStyles();
  const [editing, setEditing] = useState(false);
  return (
    <header className={styles.header}>
      <Title2 as="h2">{body.name}</Title2>
      <Body1 as="p">
        {body.designation === null ? 'No designation' : `Designation ${body.designation}`} ·{' '}
        {body.events.length} {body.events.length === 1 ? 'event' : 'events'}
      </Body1>
      {canEdit && editing ? <EditBodyForm body={body} onDone={() => setEditing(false)} /> : null}
      {canEdit && !editing ? (
        <div className={styles.actions}>
          <Button onClick={() => setEditing(true)}>Edit name and designation</Button>
          {body.events.length === 0 ? <DeleteBodyButton body={body} onDeleted={onDeleted} /> : null}
        </div>
      ) : null}
    </header>
  );
}
