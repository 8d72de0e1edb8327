import { Body1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import type { PredictionMap } from '@limbus/schema/planning';
import { useSignedIn } from './app-layout';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import type { EventDetail } from '@/features/event-setup/api/get-event';
import { CoverageSection } from '@/features/planning/components/coverage-section';
import { MyBriefing } from '@/features/planning/components/my-briefing';
import { PlacementPanel } from '@/features/planning/components/placement-panel';
import { ProposalForm } from '@/features/planning/components/proposal-form';
import { ProposalsList } from '@/features/planning/components/proposals-list';
import { SendBriefing } from '@/features/planning/components/send-briefing';
import { usePredictionMap } from '@/features/shadow-path/api/get-prediction-map';
import { PathDownloads } from '@/features/shadow-path/components/path-downloads';
import { ShadowPathMap } from '@/features/shadow-path/components/shadow-path-map';
import { ApiError } from '@/lib/api-client';

// Composes the shadow-path map and the planning views into the desk's "Shadow path" section (event.tsx
// mounts it), so neither feature needs the other: the map gives the coverage its rings, the event gives the
// proposals and the briefing its stations.

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  beside: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalXL,
    alignItems: 'flex-start',
    '& > *': { flex: '1 1 440px', minWidth: 0 },
  },
  column: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, minWidth: 0 },
});

/** The rings' radii, as the map's ring limits give them (the left limit lies at +radius). */
function ringsOf(map: PredictionMap): Array<{ ring: string; radiusKm: number }> {
  return map.lines.flatMap((l) =>
    l.ring !== null && l.sigma === 0 && l.line === 'left' ? [{ ring: l.ring, radiusKm: l.offsetKm }] : [],
  );
}

/** Whether a refusal says the event has no prediction settings yet (the server names `prediction`). */
function lacksSettings(error: unknown): boolean {
  return error instanceof ApiError && error.issues.some((i) => i.path === 'prediction');
}

/**
 * The event before it happens: the shadow-path map with its downloads beside the coverage of the
 * stations; for observers a site to propose; for coordinators the placement of more sites and the
 * proposed sites to decide.
 */
export function EventShadowPathSection({ event }: { event: EventDetail }) {
  const styles = useStyles();
  const { me } = useSignedIn();
  const map = usePredictionMap(event.id);
  const roles = new Set<string>(me.teams.find((t) => t.id === event.teamId)?.roles ?? []);
  // Site admins pass every role check on the server; the desk offers them the same controls.
  const has = (...wanted: string[]) => me.isAdmin || wanted.some((r) => roles.has(r));
  const coordinator = has('coordinator');
  const proposed = event.stations.filter((s) => s.status === 'proposed');
  const fileStem = event.title.replace(/[^\w-]+/g, '-');

  if (map.isPending) return <Loading label="Predicting the shadow path…" />;
  if (map.isError && lacksSettings(map.error))
    return (
      <Body1 as="p">
        This event has no prediction settings yet: {coordinator ? 'set' : 'a coordinator sets'} the body’s
        radius and the uncertainty of its position in{' '}
        <RouterLink to={paths.eventSection(event.id, 'setup')}>Setup</RouterLink>.
      </Body1>
    );
  if (map.isError)
    return <RequestFailed what="the shadow path" error={map.error} onRetry={() => void map.refetch()} />;

  return (
    <div className={styles.section}>
      <div className={styles.beside}>
        <section className={styles.column} aria-label="Shadow path">
          <Subtitle1 as="h3">Shadow path</Subtitle1>
          <ShadowPathMap map={map.data} />
          <PathDownloads eventId={event.id} fileStem={fileStem} />
        </section>
        {/* The briefing answer lists every station to coordinators only; anyone else would see a part. */}
        {coordinator ? (
          <div className={styles.column}>
            <Subtitle1 as="h3">Coverage</Subtitle1>
            <CoverageSection eventId={event.id} rings={ringsOf(map.data)} />
          </div>
        ) : null}
      </div>
      {has('observer') ? (
        <>
          <Subtitle1 as="h3">Propose your own site</Subtitle1>
          <ProposalForm eventId={event.id} />
        </>
      ) : null}
      {coordinator ? (
        <>
          <Subtitle1 as="h3">Placement</Subtitle1>
          <PlacementPanel eventId={event.id} />
          <Subtitle1 as="h3">Proposed sites</Subtitle1>
          <ProposalsList
            eventId={event.id}
            sites={proposed.map((s) => ({
              id: s.id,
              code: s.code,
              latDeg: s.latDeg,
              lonDeg: s.lonDeg,
              heightM: s.heightM,
              observerName: s.observerName ?? null,
              notes: s.notes ?? null,
            }))}
          />
        </>
      ) : null}
    </div>
  );
}

/**
 * What the e-mailed briefing links to: the observer's own briefing (their stations' predicted times, watch
 * window, pointing, cautions) and, for coordinators, the sending of it to every observer.
 */
export function EventBriefingSection({ event }: { event: EventDetail }) {
  const styles = useStyles();
  const { me } = useSignedIn();
  const roles = new Set<string>(me.teams.find((t) => t.id === event.teamId)?.roles ?? []);
  const has = (...wanted: string[]) => me.isAdmin || wanted.some((r) => roles.has(r));
  // A proposal is not briefed until a coordinator accepts it (the server sends no e-mail for it either).
  const briefed = event.stations.filter((s) => s.status !== 'proposed');
  return (
    <div className={styles.section}>
      {has('coordinator') ? (
        <section className={styles.column} aria-label="Send the briefing">
          <Subtitle1 as="h3">Send the briefing</Subtitle1>
          <SendBriefing eventId={event.id} stations={briefed} />
        </section>
      ) : null}
      {has('observer') || event.stations.some((s) => s.observerId === me.id) ? (
        <>
          <Subtitle1 as="h3">Your briefing</Subtitle1>
          <MyBriefing eventId={event.id} userId={me.id} />
        </>
      ) : null}
      {!has('coordinator', 'observer') && !event.stations.some((s) => s.observerId === me.id) ? (
        <Body1 as="p">Briefings go to the observers of the event’s stations.</Body1>
      ) : null}
    </div>
  );
}
