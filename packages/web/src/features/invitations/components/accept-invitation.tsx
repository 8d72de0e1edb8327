import { Body1, Button, Field, Input, makeStyles, tokens } from '@fluentui/react-components';
import { acceptInvitationPayloadSchema } from '@limbus/schema/team';
import { useState, type FormEvent, type ReactNode } from 'react';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';
import { Loading, RequestFailed } from '@/components/request-state';
import { ApiError } from '@/lib/api-client';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

/** "observer", "observer and reviewer", "coordinator, observer and reviewer". */
export function rolesText(roles: readonly string[]): string {
  if (roles.length <= 1) return roles.join('');
  return `${roles.slice(0, -1).join(', ')} and ${roles.at(-1) ?? ''}`;
}

export interface AcceptInvitationProps {
  token: string;
  onAccepted: () => void;
  /** Offered to someone with an account who no longer knows its password. */
  forgotPasswordLink?: ReactNode;
}

export function AcceptInvitation({ token, onAccepted, forgotPasswordLink }: AcceptInvitationProps) {
  const styles = useStyles();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation(token, onAccepted);
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  // A wrong password of an existing account comes back as 401 without a field; it belongs to the password.
  const refusedPassword =
    accept.error instanceof ApiError && accept.error.status === 401 ? accept.error.message : null;
  const errors: FieldErrors = {
    ...fieldErrorsFromApi(accept.error),
    ...(refusedPassword === null ? {} : { password: refusedPassword }),
    ...clientErrors,
  };

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
  const data = invitation.data;
  const { teamName, roles, email, expiresAt, existingAccount } = data;

  function submit(event: FormEvent) {
    event.preventDefault();
    if (existingAccount) {
      if (password === '') {
        setClientErrors({ password: 'Enter the password of your account' });
        return;
      }
      setClientErrors({});
      accept.mutate({ password });
      return;
    }
    const parsed = acceptInvitationPayloadSchema.safeParse({ name, password });
    if (!parsed.success) {
      setClientErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setClientErrors({});
    accept.mutate(parsed.data);
  }

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Accept the invitation">
      <Body1 as="p">
        You are invited to join <strong>{teamName}</strong> as <strong>{rolesText(roles)}</strong> with the
        address {email}. The invitation expires {utcText(expiresAt)}.
      </Body1>
      {existingAccount ? (
        <Body1 as="p">You already have an account: enter its password to join.</Body1>
      ) : null}
      {accept.isError && refusedPassword === null ? (
        <FormError title="Could not accept" message={errorMessage(accept.error)} />
      ) : null}
      {existingAccount ? null : (
        <Field label="Your name" required validationMessage={errors.name}>
          <Input autoComplete="name" value={name} onChange={(_, data) => setName(data.value)} />
        </Field>
      )}
      <Field
        label={existingAccount ? 'Password of your account' : 'Password'}
        required
        validationMessage={errors.password}
      >
        <Input
          type="password"
          autoComplete={existingAccount ? 'current-password' : 'new-password'}
          value={password}
          onChange={(_, data) => setPassword(data.value)}
        />
      </Field>
      {existingAccount ? forgotPasswordLink : null}
      <Button appearance="primary" type="submit" disabled={accept.isPending}>
        Join {teamName}
      </Button>
    </form>
  );
}
