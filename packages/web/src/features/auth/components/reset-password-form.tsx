import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  tokens,
} from '@fluentui/react-components';
import { useState, type FormEvent, type ReactNode } from 'react';
import { confirmPasswordResetInputSchema, useConfirmPasswordReset } from '../api/confirm-password-reset';
import { FormError } from '@/components/form-error';
import {
  errorMessage,
  fieldErrorsFromApi,
  fieldErrorsFromZod,
  type FieldErrors,
} from '@/components/form-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export function ResetPasswordForm({ token, signInLink }: { token: string; signInLink: ReactNode }) {
  const styles = useStyles();
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const confirm = useConfirmPasswordReset();
  const errors = { ...fieldErrorsFromApi(confirm.error), ...clientErrors };

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = confirmPasswordResetInputSchema.safeParse({ token, password });
    const next = parsed.success ? {} : fieldErrorsFromZod(parsed.error);
    if (repeat !== password) next.repeat = 'The two passwords differ';
    setClientErrors(next);
    if (parsed.success && next.repeat === undefined) confirm.mutate(parsed.data);
  }

  if (confirm.isSuccess) {
    return (
      <MessageBar intent="success" role="status">
        <MessageBarBody>Your password has been changed. {signInLink}</MessageBarBody>
      </MessageBar>
    );
  }

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Choose a new password">
      {confirm.isError ? (
        <FormError title="Could not change the password" message={errorMessage(confirm.error)} />
      ) : null}
      <Field label="New password" required validationMessage={errors.password}>
        <Input
          type="password"
          autoComplete="new-password"
          value={password}
          onChange={(_, data) => setPassword(data.value)}
        />
      </Field>
      <Field label="Repeat the new password" required validationMessage={errors.repeat}>
        <Input
          type="password"
          autoComplete="new-password"
          value={repeat}
          onChange={(_, data) => setRepeat(data.value)}
        />
      </Field>
      <Button appearance="primary" type="submit" disabled={confirm.isPending}>
        Change password
      </Button>
    </form>
  );
}
