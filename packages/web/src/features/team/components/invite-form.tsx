import {
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  Text,
  tokens,
  useId,
} from '@fluentui/react-components';
import { createInvitationPayloadSchema, type TeamRole } from '@limbus/schema/team';
import { useState, type FormEvent } from 'react';
import { useCreateInvitation } from '../api/create-invitation';
import { RoleCheckboxes } from './role-checkboxes';
import { FormError } from '@/components/form-error';
import { errorMessage } from '@/components/form-errors';
import { ApiError } from '@/lib/api-client';

const useStyles = makeStyles({
  form: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    maxWidth: '36rem',
  },
  submit: { alignSelf: 'start' },
  error: { color: tokens.colorPaletteRedForeground1 },
});

type InviteField = 'email' | 'roles';
type InviteErrors = Partial<Record<InviteField, string>>;

/** The form's field a problem belongs to, from a path such as "email", "roles.1" or "body.email". */
function fieldOf(path: readonly PropertyKey[]): InviteField | null {
  if (path.includes('roles') || path.includes('role')) return 'roles';
  if (path.includes('email')) return 'email';
  return null;
}

function errorsOf(issues: ReadonlyArray<{ path: readonly PropertyKey[]; message: string }>): InviteErrors {
  const errors: InviteErrors = {};
  for (const issue of issues) {
    const field = fieldOf(issue.path);
    if (field !== null) errors[field] ??= issue.message;
  }
  return errors;
}

/**
 * The server's refusal placed on its field: 400 names the field; 409 (already a member, or already
 * invited) is about the address.
 */
function serverErrors(error: unknown): InviteErrors {
  if (!(error instanceof ApiError)) return {};
  const named = errorsOf(
    error.issues.map((issue) => ({ path: issue.path.split('.'), message: issue.message })),
  );
  if (error.status === 409) named.email ??= error.message;
  return named;
}

/** Coordinators invite by e-mail with one or more roles; a refusal leaves what was typed in place. */
export function InviteForm({ teamId, teamName }: { teamId: string; teamName: string }) {
  const styles = useStyles();
  const create = useCreateInvitation(teamId);
  const rolesHintId = useId('roles-hint');
  const rolesErrorId = useId('roles-error');
  const [email, setEmail] = useState('');
  const [roles, setRoles] = useState<TeamRole[]>(['observer']);
  const [clientErrors, setClientErrors] = useState<InviteErrors>({});
  const [sentTo, setSentTo] = useState<string | null>(null);
  const errors = { ...serverErrors(create.error), ...clientErrors };
  const placed = errors.email !== undefined || errors.roles !== undefined;

  function submit(event: FormEvent) {
    event.preventDefault();
    setSentTo(null);
    const parsed = createInvitationPayloadSchema.safeParse({ email, roles });
    if (!parsed.success) {
      setClientErrors(errorsOf(parsed.error.issues));
      return;
    }
    setClientErrors({});
    create.mutate(parsed.data, {
      onSuccess: () => {
        setSentTo(parsed.data.email);
        setEmail('');
      },
    });
  }

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-labelledby="invite-heading">
      <Subtitle2 as="h3" id="invite-heading">
        Invite someone to {teamName}
      </Subtitle2>
      {sentTo !== null ? (
        <MessageBar intent="success" role="status">
          <MessageBarBody>
            Invitation sent to {sentTo}. The link in it is valid for a limited time; it is listed below until
            accepted.
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {create.isError && !placed ? (
        <FormError title="The invitation was not sent" message={errorMessage(create.error)} />
      ) : null}
      <Field label="E-mail" required validationMessage={errors.email}>
        <Input
          type="email"
          autoComplete="off"
          value={email}
          onChange={(_, data) => {
            setEmail(data.value);
            if (create.isError) create.reset();
            setClientErrors(({ email: _old, ...rest }) => rest);
          }}
        />
      </Field>
      <div>
        <RoleCheckboxes
          legend="Roles"
          value={roles}
          onChange={(next) => {
            setRoles(next);
            setClientErrors(({ roles: _old, ...rest }) => rest);
          }}
          describedBy={errors.roles === undefined ? rolesHintId : `${rolesHintId} ${rolesErrorId}`}
        />
        <Text id={rolesHintId} size={200} block>
          A member may hold several roles.
        </Text>
        {errors.roles !== undefined ? (
          <Text id={rolesErrorId} role="alert" size={200} block className={styles.error}>
            {errors.roles}
          </Text>
        ) : null}
      </div>
      <Button className={styles.submit} appearance="primary" type="submit" disabled={create.isPending}>
        {create.isPending ? 'Sending…' : 'Send invitation'}
      </Button>
    </form>
  );
}
