import { Body1, Field, makeStyles, Select, Subtitle1, tokens } from '@fluentui/react-components';
import type { TeamRole } from '@limbus/schema/team';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { EventDynamicsPanel } from '@/features/dynamics/components/dynamics-panel';
import { useBodies } from '@/features/bodies/api/get-bodies';
import { type EventDetail, useEvent } from '@/features/event-setup/api/get-event';
import { EventSetupForm } from '@/features/event-setup/components/event-setup-form';
import { LightCurvePanel } from '@/features/light-curves/components/light-curve-panel';
import { useReports, waitingForTiming, type Report } from '@/features/reports/api/get-reports';

// Composes the light-curve, dynamics and setup features into the event desk (event.tsx mounts these), so
// no feature needs to know about reports, fits or bodies beyond the ids it is given.

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface EventAnalysisProps {
  eventId: string;
  stations: Array<{ id: string; code: string }>;
  canEdit: boolean;
}

/** Reports that carry a light curve, those waiting for timing first, one chosen at a time, with its timing view. */
export function EventLightCurvesSection({ eventId, stations, canEdit }: EventAnalysisProps) {
  const styles = useStyles();
  const reports = useReports(eventId);
  const [chosen, setChosen] = useState<string | null>(null);
  if (reports.isPending) return <Loading label="Loading the reports…" />;
  if (reports.isError)
    return <RequestFailed what="the reports" error={reports.error} onRetry={() => void reports.refetch()} />;
  const withCurve = reports.data.filter((r) => r.lightCurve != null);
  const ordered = [...withCurve.filter(waitingForTiming), ...withCurve.filter((r) => !waitingForTiming(r))];
  const code = (r: Report) => stations.find((s) => s.id === r.stationId)?.code ?? r.station;
  const reportId = chosen ?? ordered[0]?.id ?? null;
  const report = ordered.find((r) => r.id === reportId);
  return (
    <section className={styles.section} aria-label="Light curves">
      <Subtitle1 as="h3">Light curves</Subtitle1>
      {ordered.length === 0 ? <Body1 as="p">No report has an uploaded light curve yet.</Body1> : null}
      {ordered.length > 1 ? (
        <Field label="Report">
          <Select value={reportId ?? ''} onChange={(_, d) => setChosen(d.value)}>
            {ordered.map((r) => (
              <option key={r.id} value={r.id}>
                {code(r)}: {r.lightCurve?.name ?? 'light curve'}
                {waitingForTiming(r) ? ' (waiting for timing)' : ''}
              </option>
            ))}
          </Select>
        </Field>
      ) : null}
      {report !== undefined ? (
        <LightCurvePanel
          key={report.id}
          eventId={eventId}
          reportId={report.id}
          stationLabel={code(report)}
          chord={report.chord}
          canEdit={canEdit}
        />
      ) : null}
    </section>
  );
}

/**
 * The body's dynamics strip beside the ring fit in the Fits section, read-only: the physical parameters
 * are the body's, edited on its page (`canEdit` words the link as an invitation to edit them there).
 */
export function EventDynamicsSection({ eventId, canEdit }: Omit<EventAnalysisProps, 'stations'>) {
  const event = useEvent(eventId);
  const body = event.data;
  return (
    <EventDynamicsPanel
      eventId={eventId}
      bodyLink={
        body === undefined ? null : (
          <RouterLink to={paths.body(body.bodyId)}>
            {canEdit ? 'Edit' : 'See'} the physical parameters of {body.bodyName}
          </RouterLink>
        )
      }
    />
  );
}

/**
 * The Setup section: the event's form with the team's bodies to move it between; coordinators and
 * modellers edit, coordinators delete (archive) it and land on the events list.
 */
export function EventSetupSection({ event }: { event: EventDetail }) {
  const { me } = useSignedIn();
  const navigate = useNavigate();
  const bodies = useBodies(event.teamId);
  const roles = me.teams.find((t) => t.id === event.teamId)?.roles ?? [];
  // Site admins pass every role check on the server; the desk offers them the same controls.
  const has = (...wanted: TeamRole[]) => me.isAdmin || wanted.some((r) => roles.includes(r));
  return (
    <EventSetupForm
      event={event}
      canEdit={has('coordinator', 'modeller')}
      canDelete={has('coordinator')}
      bodies={bodies.data ?? null}
      onDeleted={() => navigate(paths.events, { replace: true })}
    />
  );
}
