import { useSignedIn } from './app-layout';
import { ComparisonView } from '@/features/comparison/components/comparison-view';
import { ShapePanel } from '@/features/shape/components/shape-panel';

export function ComparisonRoute() {
  const { me, team } = useSignedIn();
  if (team === null) return <p>Join a team to compare its fits.</p>;
  const canFitJointPole = me.isAdmin || team.roles.includes('modeller') || team.roles.includes('coordinator');
  return (
    <>
      <ComparisonView teamId={team.id} teamName={team.name} canFitJointPole={canFitJointPole} />
      <ShapePanel teamId={team.id} />
    </>
  );
}
