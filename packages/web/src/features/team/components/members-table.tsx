import {
  Button,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  tokens,
  useId,
} from '@fluentui/react-components';
import { updateMemberPayloadSchema, type TeamRole } from '@limbus/schema/team';
import { useState } from 'react';
import { ConfirmButton } from '@/components/confirm-button';
import { RoleCheckboxes } from './role-checkboxes';
import type { Member } from '../api/get-members';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMember } from '../api/update-member';
import { errorMessage } from '@/components/form-errors';
import { ScrollArea } from '@/components/scroll-area';

const useStyles = makeStyles({
  roles: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap', alignItems: 'center' },
  error: { color: tokens.colorPaletteRedForeground1 },
});

export interface MembersTableProps {
  teamId: string;
  teamName: string;
  members: Member[];
  canManage: boolean;
  currentUserId: string;
  /** The signed-in user's own roles or membership changed: their account must be read again. */
  onOwnMembershipChanged: () => void;
}

function sameRoles(a: readonly TeamRole[], b: readonly TeamRole[]): boolean {
  return a.length === b.length && a.every((role) => b.includes(role));
}

function ManagedMemberRow({
  teamId,
  teamName,
  member,
  isSelf,
  onOwnMembershipChanged,
}: {
  teamId: string;
  teamName: string;
  member: Member;
  isSelf: boolean;
  onOwnMembershipChanged: () => void;
}) {
  const styles = useStyles();
  const errorId = useId('member-error');
  const [roles, setRoles] = useState<TeamRole[]>(member.roles);
  const [clientError, setClientError] = useState<string | null>(null);
  const afterOwnChange = isSelf ? onOwnMembershipChanged : undefined;
  const update = useUpdateMember(teamId, member.userId, afterOwnChange);
  const remove = useRemoveMember(teamId, member.userId, afterOwnChange);
  const rowError = clientError ?? (update.isError ? errorMessage(update.error) : null);

  function save() {
    const parsed = updateMemberPayloadSchema.safeParse({ roles });
    if (!parsed.success) {
      setClientError(parsed.error.issues[0]?.message ?? 'choose at least one role');
      return;
    }
    setClientError(null);
    update.mutate(parsed.data);
  }

  return (
    <TableRow>
      <TableCell>
        {member.name}
        {isSelf ? ' (you)' : ''}
      </TableCell>
      <TableCell>{member.email}</TableCell>
      <TableCell>
        <div className={styles.roles}>
          <RoleCheckboxes
            legend={`Roles of ${member.name}`}
            hideLegend
            value={roles}
            onChange={(next) => {
              setRoles(next);
              setClientError(null);
              update.reset();
            }}
            disabled={update.isPending}
            describedBy={rowError === null ? undefined : errorId}
          />
          {rowError !== null ? (
            <Text id={errorId} role="alert" size={200} className={styles.error}>
              {rowError}
            </Text>
          ) : null}
        </div>
      </TableCell>
      <TableCell>
        <div className={styles.actions}>
          <Button
            size="small"
            appearance="primary"
            aria-label={`Save roles of ${member.name}`}
            disabled={update.isPending || sameRoles(roles, member.roles)}
            onClick={save}
          >
            {update.isPending ? 'Saving…' : 'Save'}
          </Button>
          <ConfirmButton
            text="Remove"
            name={`Remove ${member.name}`}
            title={`Remove ${member.name} from ${teamName}?`}
            description={`${member.name} (${member.email}) loses access to the team's events, reports and fits at once. Stations they observed keep their name.`}
            confirmText="Remove"
            pending={remove.isPending}
            error={remove.error}
            onOpen={() => remove.reset()}
            onConfirm={(close) => remove.mutate(undefined, { onSuccess: close })}
          />
        </div>
      </TableCell>
    </TableRow>
  );
}

/** Everyone in the team with their roles; coordinators change roles and remove members row by row. */
export function MembersTable(props: MembersTableProps) {
  return (
    <ScrollArea label="Members table">
      <Table aria-label={`Members of ${props.teamName}`}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Name</TableHeaderCell>
            <TableHeaderCell>E-mail</TableHeaderCell>
            <TableHeaderCell>Roles</TableHeaderCell>
            {props.canManage ? <TableHeaderCell>Actions</TableHeaderCell> : null}
          </TableRow>
        </TableHeader>
        <TableBody>
          {props.members.map((member) =>
            props.canManage ? (
              // Keyed by the stored roles too, so a saved change resets the row's draft to what was stored.
              <ManagedMemberRow
                key={`${member.userId}:${member.roles.join(',')}`}
                teamId={props.teamId}
                teamName={props.teamName}
                member={member}
                isSelf={member.userId === props.currentUserId}
                onOwnMembershipChanged={props.onOwnMembershipChanged}
              />
            ) : (
              <TableRow key={member.userId}>
                <TableCell>
                  {member.name}
                  {member.userId === props.currentUserId ? ' (you)' : ''}
                </TableCell>
                <TableCell>{member.email}</TableCell>
                <TableCell>{member.roles.join(', ')}</TableCell>
              </TableRow>
            ),
          )}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
