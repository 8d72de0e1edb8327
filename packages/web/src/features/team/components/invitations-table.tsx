import {
  Badge,
  Body1,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { ConfirmButton } from '@/components/confirm-button';
import type { Invitation } from '../api/get-invitations';
import { useResendInvitation } from '../api/resend-invitation';
import { useRevokeInvitation } from '../api/revoke-invitation';
import { ScrollArea } from '@/components/scroll-area';
import { utcText } from '@/lib/utc-text';

const useStyles = makeStyles({
  time: { whiteSpace: 'nowrap' },
  expires: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'center', flexWrap: 'wrap' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
});

function InvitationRow({ teamId, invitation }: { teamId: string; invitation: Invitation }) {
  const styles = useStyles();
  const resend = useResendInvitation(teamId, invitation.id);
  const revoke = useRevokeInvitation(teamId, invitation.id);
  const { email } = invitation;
  return (
    <TableRow>
      <TableCell>{email}</TableCell>
      <TableCell>{invitation.roles.join(', ')}</TableCell>
      <TableCell>{invitation.invitedBy?.name ?? 'unknown'}</TableCell>
      <TableCell className={styles.time}>{utcText(invitation.lastSentAt)}</TableCell>
      <TableCell>
        <div className={styles.expires}>
          <span className={styles.time}>{utcText(invitation.expiresAt)}</span>
          {invitation.expired ? (
            <Badge appearance="tint" color="danger">
              expired
            </Badge>
          ) : null}
        </div>
      </TableCell>
      <TableCell>
        <div className={styles.actions}>
          <ConfirmButton
            text="Resend"
            name={`Resend the invitation to ${email}`}
            title={`Resend the invitation to ${email}?`}
            description="A new link goes out with a new expiry; the link sent before stops working."
            confirmText="Resend"
            pending={resend.isPending}
            error={resend.error}
            onOpen={() => resend.reset()}
            onConfirm={(close) => resend.mutate(undefined, { onSuccess: close })}
          />
          <ConfirmButton
            text="Revoke"
            name={`Revoke the invitation to ${email}`}
            title={`Revoke the invitation to ${email}?`}
            description="Its link stops working. You can invite the address again later."
            confirmText="Revoke"
            pending={revoke.isPending}
            error={revoke.error}
            onOpen={() => revoke.reset()}
            onConfirm={(close) => revoke.mutate(undefined, { onSuccess: close })}
          />
        </div>
      </TableCell>
    </TableRow>
  );
}

/** Invitations not yet accepted or revoked, with when they were last sent and when their link expires. */
export function InvitationsTable({ teamId, invitations }: { teamId: string; invitations: Invitation[] }) {
  if (invitations.length === 0) {
    return (
      <Body1 as="p">
        No open invitations. Invite someone with the form above; the invitation waits here until accepted.
      </Body1>
    );
  }
  return (
    <ScrollArea label="Pending invitations table">
      <Table aria-label="Pending invitations">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>E-mail</TableHeaderCell>
            <TableHeaderCell>Roles</TableHeaderCell>
            <TableHeaderCell>Invited by</TableHeaderCell>
            <TableHeaderCell>Sent</TableHeaderCell>
            <TableHeaderCell>Expires</TableHeaderCell>
            <TableHeaderCell>Actions</TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {invitations.map((invitation) => (
            <InvitationRow key={invitation.id} teamId={teamId} invitation={invitation} />
          ))}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
