import {
  Badge,
  Body1,
  Button,
  makeStyles,
  Subtitle1,
  Tab,
  TabList,
  Title3,
  tokens,
} from '@fluentui/react-components';
import type { ChordInput } from '@limbus/geometry';
import { Suspense, useMemo, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { EventDynamicsSection, EventLightCurvesSection, EventSetupSection } from './event-analysis';
import { EventPredictionSettingsSection } from './event-prediction-settings';
import { EventBriefingSection, EventShadowPathSection } from './event-shadow-path';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { ScrollArea } from '@/components/scroll-area';
import { StaleFitBadge } from '@/components/stale-fit';
import { paths } from '@/config/paths';
import { AuditPanel } from '@/features/audit/components/audit-panel';
import { useChords, type ChordRow } from '@/features/chords/api/get-chords';
import { ChordTable } from '@/features/chords/components/chord-table';
import { CsvImportDialog } from '@/features/chords/components/csv-import-dialog';
import { useEvent } from '@/features/event-setup/api/get-event';
import { FiguresPanel } from '@/features/figures/components/figures-panel';
import { useFit } from '@/features/fits/api/get-fit';
import { useFits } from '@/features/fits/api/get-fits';
import { useRefreshFitsOnDataChange } from '@/features/fits/api/refresh-fits';
import { FitOptionsForm } from '@/features/fits/components/fit-options-form';
import { FitView } from '@/features/fits/components/fit-view';
import { FitsList } from '@/features/fits/components/fits-list';
import { ReportsPanel } from '@/features/reports/components/reports-panel';
import { ReviewPanel } from '@/features/review/components/review-panel';
import { LazyResidualsPlot, LazySkyPlanePlot } from '@/features/sky-plane/lazy';
import { StationsPanel } from '@/features/stations/components/stations-panel';
import { utcText } from '@/lib/utc-text';

const SECTIONS = [
  { id: 'setup', label: 'Setup' },
  { id: 'stations', label: 'Stations & reports' },
  { id: 'shadow-path', label: 'Shadow path' },
  { id: 'briefing', label: 'Briefing' },
  { id: 'chords', label: 'Chords' },
  { id: 'sky', label: 'Sky plane' },
  { id: 'light-curves', label: 'Light curves' },
  { id: 'fits', label: 'Fits' },
  { id: 'review', label: 'Review' },
  { id: 'figures', label: 'Figures' },
  // The audit log answers to coordinators only; the tab shows for them (and site admins) alone.
  { id: 'audit', label: 'Audit' },
] as const;
type SectionId = (typeof SECTIONS)[number]['id'];

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  // Fluent's text components are inline; the heading and its summary line stack.
  header: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  plots: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '100%' },
  note: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalM, alignItems: 'center' },
});

/** The plot shows times in its tooltips; it takes the chords in the event file's own shape. */
function toChordInput(row: ChordRow): ChordInput | null {
  if (row.type === 'positive')
    return row.disappearance && row.reappearance
      ? {
          station: row.station,
          type: 'positive',
          disappearance: row.disappearance,
          reappearance: row.reappearance,
          timeOffsetSeconds: row.timeOffsetSeconds,
        }
      : null;
  return row.start && row.end
    ? {
        station: row.station,
        type: 'negative',
        start: row.start,
        end: row.end,
        timeOffsetSeconds: row.timeOffsetSeconds,
      }
    : null;
}

/** "1 fit", "3 fits", "… fits" while loading. */
function count(n: number | undefined, noun: string): string {
  return n === undefined ? `… ${noun}s` : `${n} ${noun}${n === 1 ? '' : 's'}`;
}

/**
 * One event's desk. The section and the fit shown live in the URL, so a link (or a reload) opens the
 * same view; without a chosen fit the plot shows the approved fit, else the newest solved one.
 */
export function EventRoute() {
  const styles = useStyles();
  const { eventId = '' } = useParams();
  const { me } = useSignedIn();
  const [search, setSearch] = useSearchParams();
  const event = useEvent(eventId);
  const fits = useFits(eventId);
  const chords = useChords(eventId);
  // Chords come apart from the event detail (stations, star, ephemeris, DUT1); either changing may leave a
  // fit based on older data.
  useRefreshFitsOnDataChange(eventId, [event.data?.dataSha256, chords.data]);

  const requested = search.get('section');
  const chosenFitId = search.get('fit');
  const newestFits = useMemo(
    () => [...(fits.data ?? [])].sort((a, b) => b.createdAt.localeCompare(a.createdAt)),
    [fits.data],
  );
  const defaultFitId =
    newestFits.find((f) => f.reviewState === 'approved')?.id ??
    newestFits.find((f) => f.state === 'solved')?.id ??
    null;
  const fitId = chosenFitId ?? defaultFitId;
  const fit = useFit(fitId);
  // The Review tab is about the fit in review (normally at most one), else the fit shown in Fits. When
  // the two differ, the reviewer or modeller may pin the shown one instead, for as long as it is shown.
  const [pinnedReviewFitId, setPinnedReviewFitId] = useState<string | null>(null);
  const inReview = newestFits.filter((f) => f.reviewState === 'in_review');
  const reviewFitId =
    pinnedReviewFitId !== null && pinnedReviewFitId === fitId
      ? pinnedReviewFitId
      : ((inReview.find((f) => f.id === fitId) ?? inReview[0])?.id ?? fitId);
  const reviewFit = useFit(reviewFitId);
  const fitLabel = (id: string | null) => {
    const found = newestFits.find((f) => f.id === id);
    return found === undefined ? 'the chosen fit' : `the fit of ${utcText(found.createdAt)}`;
  };

  const setParam = (key: string, value: string) =>
    setSearch(
      (params) => {
        const next = new URLSearchParams(params);
        next.set(key, value);
        return next;
      },
      { replace: key === 'fit' },
    );

  if (event.isPending) return <Loading label="Loading the event…" />;
  if (event.isError)
    return <RequestFailed what="the event" error={event.error} onRetry={() => void event.refetch()} />;

  const e = event.data;
  const roles = new Set<string>(me.teams.find((t) => t.id === e.teamId)?.roles ?? []);
  // Site admins pass every role check on the server; the desk offers them the same controls.
  const has = (...wanted: string[]) => me.isAdmin || wanted.some((r) => roles.has(r));
  const sections = SECTIONS.filter((s) => s.id !== 'audit' || has('coordinator'));
  const section: SectionId = sections.find((s) => s.id === requested)?.id ?? 'chords';
  const canEditChords = has('coordinator', 'modeller');
  const stationCodes = e.stations.map((s) => s.code);
  const ownStationIds = e.stations.filter((s) => s.observerId === me.id).map((s) => s.id);
  // An observer and nothing more sees only their own stations; the server already limits their reports.
  const observerOnly = !has('coordinator', 'modeller', 'reviewer');
  const visibleStations = observerOnly ? e.stations.filter((s) => s.observerId === me.id) : e.stations;
  const solution = fit.data?.state === 'solved' ? (fit.data.solution ?? null) : null;
  const chordInputs = (chords.data ?? []).map(toChordInput).filter((c): c is ChordInput => c !== null);
  const positiveStations = [
    ...new Set((chords.data ?? []).filter((c) => c.type === 'positive').map((c) => c.station)),
  ];

  return (
    <div className={styles.page}>
      <header className={styles.header}>
        <Title3 as="h2">{e.title}</Title3>
        <Body1 as="p">
          Body{' '}
          <RouterLink to={paths.body(e.bodyId)}>
            {e.bodyName}
            {e.bodyDesignation === null ? '' : ` (${e.bodyDesignation})`}
          </RouterLink>{' '}
          · event time {utcText(e.eventTimeUtc, 'minutes')}
        </Body1>
        <Body1 as="p">
          Star RA {e.star.raDeg.toFixed(6)}°, Dec {e.star.decDeg.toFixed(6)}° ·{' '}
          {count(e.stations.length, 'station')} · {count(chords.data?.length, 'chord')} ·{' '}
          {count(fits.data?.length, 'fit')} · your roles:{' '}
          {me.isAdmin ? 'admin' : [...roles].join(', ') || 'none'}
        </Body1>
      </header>
      <ScrollArea label="Section tabs">
        <TabList
          selectedValue={section}
          onTabSelect={(_, data) => setParam('section', String(data.value))}
          aria-label="Event sections"
        >
          {sections.map((s) => (
            <Tab key={s.id} value={s.id}>
              {s.label}
            </Tab>
          ))}
        </TabList>
      </ScrollArea>
      <div
        role="tabpanel"
        aria-label={sections.find((s) => s.id === section)?.label}
        className={styles.panel}
      >
        {section === 'setup' ? <EventSetupSection key={e.id} event={e} /> : null}
        {section === 'setup' ? <EventPredictionSettingsSection key={`prediction-${e.id}`} event={e} /> : null}
        {section === 'stations' ? (
          <>
            <Subtitle1 as="h3">Stations</Subtitle1>
            <StationsPanel
              eventId={e.id}
              teamId={e.teamId}
              stations={visibleStations}
              eventStationCount={e.stations.length}
              canEdit={has('coordinator')}
            />
            <Subtitle1 as="h3">Observer reports</Subtitle1>
            <ReportsPanel
              eventId={e.id}
              stations={e.stations}
              ownStationIds={ownStationIds}
              canDecide={has('coordinator')}
            />
          </>
        ) : null}
        {section === 'shadow-path' ? <EventShadowPathSection key={e.id} event={e} /> : null}
        {section === 'briefing' ? <EventBriefingSection key={e.id} event={e} /> : null}
        {section === 'chords' ? (
          <ChordTable
            eventId={e.id}
            stationCodes={stationCodes}
            canEdit={canEditChords}
            importButton={<CsvImportDialog eventId={e.id} />}
          />
        ) : null}
        {section === 'sky' ? (
          <div className={styles.plots}>
            {fitId === null ? <Body1 as="p">No solved fit yet: run one in the Fits section.</Body1> : null}
            {fit.isError ? (
              <RequestFailed what="the fit" error={fit.error} onRetry={() => void fit.refetch()} />
            ) : null}
            {fit.data !== undefined ? (
              <Body1 as="p">
                Showing the fit of {utcText(fit.data.createdAt)}{' '}
                <Badge appearance="outline">
                  {fit.data.reviewState === 'approved' ? 'approved' : fit.data.state}
                </Badge>{' '}
                {fit.data.inputMatchesEvent ? null : <StaleFitBadge />}
              </Body1>
            ) : null}
            {solution !== null ? (
              <Suspense fallback={<Loading label="Loading the plots…" />}>
                <LazySkyPlanePlot solution={solution} chordInputs={chordInputs} />
                <LazyResidualsPlot solution={solution} />
              </Suspense>
            ) : null}
          </div>
        ) : null}
        {section === 'fits' ? (
          <>
            {has('modeller', 'coordinator') ? (
              <>
                <Subtitle1 as="h3">Run a fit</Subtitle1>
                <FitOptionsForm
                  eventId={e.id}
                  stationCodes={positiveStations}
                  onQueued={(id) => setParam('fit', id)}
                />
              </>
            ) : null}
            <Subtitle1 as="h3">Fits</Subtitle1>
            <FitsList eventId={e.id} selectedFitId={fitId} onSelect={(id) => setParam('fit', id)} />
            {fitId !== null ? <FitView fitId={fitId} /> : null}
            <EventDynamicsSection eventId={e.id} canEdit={has('coordinator', 'modeller')} />
          </>
        ) : null}
        {section === 'light-curves' ? (
          <EventLightCurvesSection
            eventId={e.id}
            stations={e.stations}
            canEdit={has('coordinator', 'modeller')}
          />
        ) : null}
        {section === 'review' ? (
          <>
            {reviewFitId !== null && fitId !== null && reviewFitId !== fitId ? (
              <div className={styles.note}>
                <Body1>
                  The Fits section shows {fitLabel(fitId)}; this tab shows {fitLabel(reviewFitId)}, which is
                  in review.
                </Body1>
                <Button size="small" onClick={() => setPinnedReviewFitId(fitId)}>
                  Show {fitLabel(fitId)} here
                </Button>
              </div>
            ) : null}
            {pinnedReviewFitId !== null &&
            pinnedReviewFitId === fitId &&
            inReview.some((f) => f.id !== fitId) ? (
              <div className={styles.note}>
                <Body1>Another fit of this event is in review.</Body1>
                <Button size="small" onClick={() => setPinnedReviewFitId(null)}>
                  Show the fit in review
                </Button>
              </div>
            ) : null}
            {reviewFitId === null ? (
              <Body1 as="p">No fit yet: run one in the Fits section, then ask for its review here.</Body1>
            ) : null}
            {reviewFit.isError ? (
              <RequestFailed
                what="the fit"
                error={reviewFit.error}
                onRetry={() => void reviewFit.refetch()}
              />
            ) : null}
            {reviewFitId !== null && reviewFit.isPending ? <Loading label="Loading the fit…" /> : null}
            {reviewFit.data !== undefined ? (
              <ReviewPanel
                eventId={e.id}
                fit={reviewFit.data}
                userId={me.id}
                canRequest={has('modeller', 'coordinator')}
                canDecide={has('reviewer')}
              />
            ) : null}
          </>
        ) : null}
        {section === 'figures' ? (
          <FiguresPanel
            fitId={solution === null ? null : (fit.data?.id ?? null)}
            solution={solution}
            inputMatchesEvent={fit.data?.inputMatchesEvent ?? true}
            fileStem={e.title.replace(/[^\w-]+/g, '-')}
          />
        ) : null}
        {section === 'audit' ? <AuditPanel eventId={e.id} /> : null}
      </div>
    </div>
  );
}
