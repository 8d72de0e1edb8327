import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { requestPasswordResetInputSchema, useRequestPasswordReset } from '../api/request-password-reset';
import { FormError } from '@/components/form-error';
import { errorMessage, fieldErrorsFromZod, type FieldErrors } from '@/components/form-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export function ForgotPasswordForm() {
  const styles = useStyles();
  const [email, setEmail] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const request = useRequestPasswordReset();

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = requestPasswordResetInputSchema.safeParse({ email: email.trim() });
    if (!parsed.success) {
      setErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setErrors({});
    request.mutate(parsed.data);
  }

  if (request.isSuccess) {
    // The server answers the same whether or not the account exists, so the page must too.
    return (
      <MessageBar intent="success" role="status">
        <MessageBarBody>
          If an account exists for {email.trim()}, we have sent it a link to choose a new password.
        </MessageBarBody>
      </MessageBar>
    );
  }

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Request a password reset">
      {request.isError ? <FormError title="Request failed" message={errorMessage(request.error)} /> : null}
      <Field label="E-mail" required validationMessage={errors.email}>
        <Input type="email" autoComplete="email" value={email} onChange={(_, data) => setEmail(data.value)} />
      </Field>
      <Button appearance="primary" type="submit" disabled={request.isPending}>
        Send reset link
      </Button>
    </form>
  );
}
