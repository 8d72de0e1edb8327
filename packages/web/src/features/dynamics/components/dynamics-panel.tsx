import {
  Body1,
  makeStyles,
  Subtitle1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { ContextInputFile } from '@limbus/schema';
import type { ReactNode } from 'react';
import type { DynamicsView } from '../api/dynamics-schema';
import { useBodyDynamics } from '../api/get-body-dynamics';
import { useEventDynamics } from '../api/get-event-dynamics';
import { ContextForm } from './context-form';
import { DynamicsStrip } from './dynamics-strip';
import { NearestResonances } from './nearest-resonances';
import { Loading, RequestFailed } from '@/components/request-state';
import { ScrollArea } from '@/components/scroll-area';

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

/** The strip, each fitted ring against each limit, and the Hill radius, from one stored context. */
function DynamicsResult({ view, showEvent }: { view: DynamicsView; showEvent: boolean }) {
  return (
    <>
      <DynamicsStrip result={view.result} bodyRadiusKm={bodyRadiusOf(view.input)} ringFits={view.ringFits} />
      {view.ringFits.length > 0 && (
        <ScrollArea label="Ring radii table">
          <Table aria-label="Fitted ring radius against the context" size="small">
            <TableHeader>
              <TableRow>
                {showEvent ? <TableHeaderCell>Event</TableHeaderCell> : null}
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
                <TableRow key={`${r.fitId}-${r.ring}`}>
                  {showEvent ? <TableCell>{r.eventTitle}</TableCell> : null}
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
        </ScrollArea>
      )}
      <NearestResonances
        showEvent={showEvent}
        rings={[
          ...view.result.ringResonances.map((r) => ({ key: `context-${r.ring}`, event: null, ...r })),
          ...view.ringFits.map((r) => ({
            key: `${r.fitId}-${r.ring}`,
            event: r.eventTitle,
            ring: `${r.ring} (fit)`,
            radiusKm: r.radiusKm,
            radiusKmSigma: r.radiusKmSigma,
            nearest: r.nearestResonances,
          })),
        ]}
      />
      <Body1 as="p">
        Hill radius {km(view.result.hillKm, view.result.uncertainty.hillKm)} km (off the strip).{' '}
        {view.result.notes.join(' ')}
      </Body1>
    </>
  );
}

/**
 * The body's physical parameters (its dynamics context) on the body page: the strip with every event's
 * fitted rings against it, and for coordinators and modellers the form that edits the parameters.
 */
export function DynamicsPanel({ bodyId, canEdit }: { bodyId: string; canEdit: boolean }) {
  const styles = useStyles();
  const dynamics = useBodyDynamics(bodyId);
  if (dynamics.isPending) return <Loading label="Loading the physical parameters…" />;
  if (dynamics.isError)
    return (
      <RequestFailed
        what="the physical parameters"
        error={dynamics.error}
        onRetry={() => void dynamics.refetch()}
      />
    );
  const view = dynamics.data;
  return (
    <section className={styles.panel} aria-labelledby="dynamics-heading">
      <Subtitle1 as="h3" id="dynamics-heading">
        Physical parameters and dynamics context
      </Subtitle1>
      {view === null ? (
        <Body1 as="p">No physical parameters entered for this body yet.</Body1>
      ) : (
        <DynamicsResult view={view} showEvent />
      )}
      {canEdit && (
        <ContextForm bodyId={bodyId} input={view === null ? null : (view.input as ContextInputFile)} />
      )}
    </section>
  );
}

/**
 * The event's body's dynamics context beside the event's ring fit, read-only: the parameters belong to
 * the body and are edited on its page (`bodyLink` says where).
 */
export function EventDynamicsPanel({ eventId, bodyLink }: { eventId: string; bodyLink: ReactNode }) {
  const styles = useStyles();
  const dynamics = useEventDynamics(eventId);
  if (dynamics.isPending) return <Loading label="Loading the dynamics context…" />;
  if (dynamics.isError)
    return (
      <RequestFailed
        what="the dynamics context"
        error={dynamics.error}
        onRetry={() => void dynamics.refetch()}
      />
    );
  const view = dynamics.data;
  return (
    <section className={styles.panel} aria-label="Dynamics context">
      <Subtitle1 as="h3">Dynamics context</Subtitle1>
      {view === null ? (
        <Body1 as="p">No physical parameters entered for this body yet.</Body1>
      ) : (
        <DynamicsResult view={view} showEvent={false} />
      )}
      {bodyLink}
    </section>
  );
}
