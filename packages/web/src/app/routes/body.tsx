import { makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import type { TeamRole } from '@limbus/schema/team';
import { useNavigate, useParams } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { Loading, RequestFailed } from '@/components/request-state';
import { paths } from '@/config/paths';
import { useBody } from '@/features/bodies/api/get-body';
import { BodyEventsTable } from '@/features/bodies/components/body-events-table';
import { BodyHeader } from '@/features/bodies/components/body-header';
import { ComparisonView } from '@/features/comparison/components/comparison-view';
import { DynamicsPanel } from '@/features/dynamics/components/dynamics-panel';
import { ShapePanel } from '@/features/shape/components/shape-panel';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXL },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

/**
 * One body: its events with their approved limbs, then what the events say together — the comparison,
 * the joint ring pole, the 3D shape — and the physical parameters they are read against.
 */
export function BodyRoute() {
  const styles = useStyles();
  const { bodyId = '' } = useParams();
  const { me } = useSignedIn();
  const navigate = useNavigate();
  const body = useBody(bodyId);
  if (body.isPending) return <Loading label="Loading the body…" />;
  if (body.isError)
    return <RequestFailed what="the body" error={body.error} onRetry={() => void body.refetch()} />;

  const b = body.data;
  const roles = new Set(me.teams.find((t) => t.id === b.teamId)?.roles ?? []);
  // Site admins pass every role check on the server; the page offers them the same controls.
  const has = (...wanted: TeamRole[]) => me.isAdmin || wanted.some((r) => roles.has(r));
  return (
    <div className={styles.page}>
      <BodyHeader
        body={b}
        canEdit={has('coordinator')}
        onDeleted={() => navigate(paths.bodies, { replace: true })}
      />
      <section className={styles.section} aria-labelledby="body-events-heading">
        <Subtitle1 as="h3" id="body-events-heading">
          Events and their approved fits
        </Subtitle1>
        <BodyEventsTable events={b.events} />
      </section>
      {/* Keyed by the body, so going from one body's page to another's starts every form afresh. */}
      <ComparisonView
        key={`comparison-${b.id}`}
        bodyId={b.id}
        canFitJointPole={has('modeller', 'coordinator')}
      />
      <ShapePanel key={`shape-${b.id}`} bodyId={b.id} />
      <DynamicsPanel key={`dynamics-${b.id}`} bodyId={b.id} canEdit={has('coordinator', 'modeller')} />
    </div>
  );
}
