import { Body1, Button, Field, Input, makeStyles, tokens } from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { acceptInvitationInputSchema, useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export function AcceptInvitation({ token, onAccepted }: { token: string; onAccepted: () => void }) {
  const styles = useStyles();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation(token, onAccepted);
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const errors = { ...fieldErrorsFromApi(accept.error), ...clientErrors };

  if (invitation.isPending) return <Loading label="Loading the invitation…" />;
  if (invitation.isError) {
    return (
      <RequestFailed
        what="the invitation"
        error={invitation.error}
        onRetry={() => void invitation.refetch()}
      />
    );
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = acceptInvitationInputSchema.safeParse({ name, password });
    if (!parsed.success) {
      setClientErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setClientErrors({});
    accept.mutate(parsed.data);
  }

  const { teamName, role, email, expiresAt } = invitation.data;
  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Accept the invitation">
      <Body1>
        You are invited to join <strong>{teamName}</strong> as <strong>{role}</strong> with the address{' '}
        {email}. The invitation expires {new Date(expiresAt).toLocaleString()}.
      </Body1>
      {accept.isError ? <FormError title="Could not accept" message={errorMessage(accept.error)} /> : null}
      <Field label="Your name" required validationMessage={errors.name}>
        <Input autoComplete="name" value={name} onChange={(_, data) => setName(data.value)} />
      </Field>
      <Field label="Password" required validationMessage={errors.password}>
        <Input
          type="password"
          autoComplete="new-password"
          value={password}
          onChange={(_, data) => setPassword(data.value)}
        />
      </Field>
      <Button appearance="primary" type="submit" disabled={accept.isPending}>
        Join {teamName}
      </Button>
    </form>
  );
}
