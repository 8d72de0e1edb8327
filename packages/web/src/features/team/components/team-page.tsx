import { Body1, makeStyles, Subtitle2, Title3, tokens } from '@fluentui/react-components';
import { useInvitations } from '../api/get-invitations';
import { useMembers } from '../api/get-members';
import { InvitationsTable } from './invitations-table';
import { InviteForm } from './invite-form';
import { MembersTable } from './members-table';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface TeamPageProps {
  teamId: string;
  teamName: string;
  /** Coordinators of the team and site admins: change roles, remove members, invite. */
  canManage: boolean;
  currentUserId: string;
  onOwnMembershipChanged: () => void;
}

function Invitations({ teamId }: { teamId: string }) {
  const invitations = useInvitations(teamId);
  if (invitations.isPending) return <Loading label="Loading the invitations…" />;
  if (invitations.isError) {
    return (
      <RequestFailed
        what="the invitations"
        error={invitations.error}
        onRetry={() => void invitations.refetch()}
      />
    );
  }
  return <InvitationsTable teamId={teamId} invitations={invitations.data} />;
}

/** The team's members for everyone; for coordinators also their roles, invitations and removals. */
export function TeamPage(props: TeamPageProps) {
  const styles = useStyles();
  const members = useMembers(props.teamId);
  return (
    <div className={styles.page}>
      <section className={styles.section} aria-labelledby="members-heading">
        <Title3 as="h2" id="members-heading">
          {props.teamName}
        </Title3>
        {members.isPending ? (
          <Loading label="Loading the members…" />
        ) : members.isError ? (
          <RequestFailed what="the members" error={members.error} onRetry={() => void members.refetch()} />
        ) : members.data.length === 0 ? (
          <Body1 as="p">
            {props.canManage
              ? 'The team has no members yet. Invite someone with the form below.'
              : 'The team has no members yet. A coordinator invites people from this page.'}
          </Body1>
        ) : (
          <MembersTable
            teamId={props.teamId}
            teamName={props.teamName}
            members={members.data}
            canManage={props.canManage}
            currentUserId={props.currentUserId}
            onOwnMembershipChanged={props.onOwnMembershipChanged}
          />
        )}
        {props.canManage ? null : (
          <Body1 as="p">Coordinators of the team invite new members and change roles.</Body1>
        )}
      </section>
      {props.canManage ? (
        <>
          <section className={styles.section}>
            <InviteForm teamId={props.teamId} teamName={props.teamName} />
          </section>
          <section className={styles.section} aria-labelledby="invitations-heading">
            <Subtitle2 as="h3" id="invitations-heading">
              Pending invitations
            </Subtitle2>
            <Invitations teamId={props.teamId} />
          </section>
        </>
      ) : null}
    </div>
  );
}
