import { Body1 } from '@fluentui/react-components';
import { useSignedIn } from './app-layout';
import { BodiesList } from '@/features/bodies/components/bodies-list';

export function BodiesRoute() {
  const { me, team } = useSignedIn();
  if (team === null) return <Body1 as="p">Join a team to see the bodies it observes.</Body1>;
  // Adding a body is the coordinators' work (the server checks the same role).
  const canCreate = me.isAdmin || team.roles.includes('coordinator');
  return <BodiesList teamId={team.id} teamName={team.name} canCreate={canCreate} />;
}
