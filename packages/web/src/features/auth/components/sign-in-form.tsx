import { Button, Field, Input, makeStyles, tokens } from '@fluentui/react-components';
import { useState, type FormEvent } from 'react';
import { signInInputSchema, useSignIn } from '../api/sign-in';
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

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const styles = useStyles();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [clientErrors, setClientErrors] = useState<FieldErrors>({});
  const signIn = useSignIn(onSignedIn);
  const errors = { ...fieldErrorsFromApi(signIn.error), ...clientErrors };

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = signInInputSchema.safeParse({ email: email.trim(), password });
    if (!parsed.success) {
      setClientErrors(fieldErrorsFromZod(parsed.error));
      return;
    }
    setClientErrors({});
    signIn.mutate(parsed.data);
  }

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Sign in">
      {signIn.isError ? <FormError title="Sign-in failed" message={errorMessage(signIn.error)} /> : null}
      <Field label="E-mail" required validationMessage={errors.email}>
        <Input
          type="email"
          autoComplete="username"
          value={email}
          onChange={(_, data) => setEmail(data.value)}
        />
      </Field>
      <Field label="Password" required validationMessage={errors.password}>
        <Input
          type="password"
          autoComplete="current-password"
          value={password}
          onChange={(_, data) => setPassword(data.value)}
        />
      </Field>
      <Button appearance="primary" type="submit" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
