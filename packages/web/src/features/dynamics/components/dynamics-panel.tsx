import {
  makeStyles,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { ContextInputFile } from '@limbus/schema';
import { useDynamics } from '../api/get-dynamics';
import { ContextForm } from './context-form';
import { DynamicsStrip } from './dynamics-strip';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

const km = (value: number, sigma: number) => `${value.toFixed(0)} ± ${sigma.toFixed(0)}`;
const ratio = (value: number, sigma: number) => `${value.toFixed(3)} ± ${sigma.toFixed(3)}`;

function bodyRadiusOf(input: Record<string, unknown>): number {
  const body = input.body;
  const r = typeof body === 'object' && body !== null ? Reflect.get(body, 'radiusKm') : undefined;
  return typeof r === 'number' ? r : 0;
}

/** The body's dynamics context beside the ring fit: the strip, the ring against each limit, and the inputs. */
export function DynamicsPanel({ eventId, canEdit }: { eventId: string; canEdit: boolean }) {
  const styles = useStyles();
  const dynamics = useDynamics(eventId);
  if (dynamics.isPending) return <Loading label="Loading the dynamics context" />;
  if (dynamics.isError) {
    return (
      <RequestFailed
        what="the dynamics context"
        error={dynamics.error}
        onRetry={() => void dynamics.refetch()}
      />
    );
  }
  const view = dynamics.data;
  return (
    <section className={styles.panel} aria-label="Dynamics context">
      <Subtitle2 as="h3">Dynamics context</Subtitle2>
      {view === null ? (
        <p>No dynamics context for this body yet.</p>
      ) : (
        <>
          <DynamicsStrip
            result={view.result}
            bodyRadiusKm={bodyRadiusOf(view.input)}
            ringFits={view.ringFits}
          />
          {view.ringFits.length > 0 && (
            <Table aria-label="Fitted ring radius against the context" size="small">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Ring</TableHeaderCell>
                  <TableHeaderCell>Radius (km)</TableHeaderCell>
                  <TableHeaderCell>Body radii</TableHeaderCell>
                  <TableHeaderCell>Fluid Roche limits</TableHeaderCell>
                  <TableHeaderCell>Rigid Roche limits</TableHeaderCell>
                  <TableHeaderCell>Synchronous radii</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {view.ringFits.map((r) => (
                  <TableRow key={r.ring}>
                    <TableCell>{r.ring}</TableCell>
                    <TableCell>{km(r.radiusKm, r.radiusKmSigma)}</TableCell>
                    <TableCell>{ratio(r.inBodyRadii, r.uncertainty.inBodyRadii)}</TableCell>
                    <TableCell>{ratio(r.inRocheFluid, r.uncertainty.inRocheFluid)}</TableCell>
                    <TableCell>{ratio(r.inRocheRigid, r.uncertainty.inRocheRigid)}</TableCell>
                    <TableCell>{ratio(r.inSynchronous, r.uncertainty.inSynchronous)}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
          )}
          <p>
            Hill radius {km(view.result.hillKm, view.result.uncertainty.hillKm)} km (off the strip).{' '}
            {view.result.notes.join(' ')}
          </p>
        </>
      )}
      {canEdit && (
        <ContextForm eventId={eventId} input={view === null ? null : (view.input as ContextInputFile)} />
      )}
    </section>
  );
}
