import {
  Badge,
  Body1,
  makeStyles,
  Subtitle1,
  Tab,
  TabList,
  Title3,
  tokens,
} from '@fluentui/react-components';
import type { ChordInput } from '@limbus/geometry';
import { Suspense, useMemo } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { EventDynamicsSection, EventLightCurvesSection } from './event-analysis';
import { Loading, RequestFailed } from '@/components/request-state';
import { useChords, type ChordRow } from '@/features/chords/api/get-chords';
import { ChordTable } from '@/features/chords/components/chord-table';
import { CsvImportDialog } from '@/features/chords/components/csv-import-dialog';
import { useEvent } from '@/features/event-setup/api/get-event';
import { EventSetupForm } from '@/features/event-setup/components/event-setup-form';
import { FiguresPanel } from '@/features/figures/components/figures-panel';
import { useFit } from '@/features/fits/api/get-fit';
import { useFits } from '@/features/fits/api/get-fits';
import { FitOptionsForm } from '@/features/fits/components/fit-options-form';
import { FitView } from '@/features/fits/components/fit-view';
import { FitsList } from '@/features/fits/components/fits-list';
import { ReportsPanel } from '@/features/reports/components/reports-panel';
import { ReviewPanel } from '@/features/review/components/review-panel';
import { LazyResidualsPlot, LazySkyPlanePlot } from '@/features/sky-plane/lazy';
import { StationsPanel } from '@/features/stations/components/stations-panel';

const SECTIONS = [
  { id: 'setup', label: 'Setup' },
  { id: 'stations', label: 'Stations & reports' },
  { id: 'chords', label: 'Chords' },
  { id: 'sky', label: 'Sky plane' },
  { id: 'light-curves', label: 'Light curves' },
  { id: 'fits', label: 'Fits' },
  { id: 'review', label: 'Review' },
  { id: 'figures', label: 'Figures' },
] as const;
type SectionId = (typeof SECTIONS)[number]['id'];

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  // Fluent's text components are inline; the heading and its summary line stack.
  header: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  tabs: { overflowX: 'auto' },
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  plots: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, maxWidth: '100%' },
});

function utcText(iso: string): string {
  return `${iso.slice(0, 19).replace('T', ' ')} UTC`;
}

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

  const requested = search.get('section');
  const section: SectionId = SECTIONS.find((s) => s.id === requested)?.id ?? 'chords';
  const chosenFitId = search.get('fit');
  const defaultFitId = useMemo(() => {
    const list = fits.data ?? [];
    const newest = [...list].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
    return (
      newest.find((f) => f.reviewState === 'approved')?.id ??
      newest.find((f) => f.state === 'solved')?.id ??
      null
    );
  }, [fits.data]);
  const fitId = chosenFitId ?? defaultFitId;
  const fit = useFit(fitId);

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
  const roles = new Set(me.teams.find((t) => t.id === e.teamId)?.roles ?? []);
  // Site admins pass every role check on the server; the desk offers them the same controls.
  const has = (...wanted: string[]) => me.isAdmin || wanted.some((r) => roles.has(r));
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
          Star RA {e.star.raDeg.toFixed(6)}°, Dec {e.star.decDeg.toFixed(6)}° · {e.stations.length} stations ·{' '}
          {chords.data?.length ?? '…'} chords · your roles:{' '}
          {me.isAdmin ? 'admin' : [...roles].join(', ') || 'none'}
        </Body1>
      </header>
      <TabList
        className={styles.tabs}
        selectedValue={section}
        onTabSelect={(_, data) => setParam('section', String(data.value))}
        aria-label="Event sections"
      >
        {SECTIONS.map((s) => (
          <Tab key={s.id} value={s.id}>
            {s.label}
          </Tab>
        ))}
      </TabList>
      <div
        role="tabpanel"
        aria-label={SECTIONS.find((s) => s.id === section)?.label}
        className={styles.panel}
      >
        {section === 'setup' ? (
          <EventSetupForm key={e.id} event={e} canEdit={has('coordinator', 'modeller')} />
        ) : null}
        {section === 'stations' ? (
          <>
            <Subtitle1 as="h3">Stations</Subtitle1>
            <StationsPanel eventId={e.id} stations={visibleStations} canEdit={has('coordinator')} />
            <Subtitle1 as="h3">Observer reports</Subtitle1>
            <ReportsPanel
              eventId={e.id}
              stations={e.stations}
              ownStationIds={ownStationIds}
              canDecide={has('coordinator')}
            />
          </>
        ) : null}
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
                </Badge>
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
          fit.data === undefined ? (
            <Body1 as="p">Open a fit in the Fits section to review it.</Body1>
          ) : (
            <ReviewPanel
              fitId={fit.data.id}
              fitState={fit.data.state}
              reviewState={fit.data.reviewState}
              canRequest={has('modeller', 'coordinator')}
              canDecide={has('reviewer')}
            />
          )
        ) : null}
        {section === 'figures' ? (
          <FiguresPanel
            fitId={solution === null ? null : (fit.data?.id ?? null)}
            solution={solution}
            fileStem={e.title.replace(/[^\w-]+/g, '-')}
          />
        ) : null}
      </div>
    </div>
  );
}
