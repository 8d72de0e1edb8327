import { Body1 } from '@fluentui/react-components';
import { useQueryClient } from '@tanstack/react-query';
import { useSignedIn } from './app-layout';
import { meQueryKey } from '@/features/auth/api/get-me';
import { TeamPage } from '@/features/team/components/team-page';

export function TeamRoute() {
  const { me, team } = useSignedIn();
  const queryClient = useQueryClient();
  if (team === null) {
    return (
      <Body1 as="p">
        You are not in a team yet. A team&apos;s coordinator sends you an invitation by e-mail; its link adds
        you to the team.
      </Body1>
    );
  }
  return (
    <TeamPage
      teamId={team.id}
      teamName={team.name}
      // Site admins pass every role check on the server; the page offers them the same controls.
      canManage={me.isAdmin || team.roles.includes('coordinator')}
      currentUserId={me.id}
      onOwnMembershipChanged={() => void queryClient.invalidateQueries({ queryKey: meQueryKey })}
    />
  );
}
