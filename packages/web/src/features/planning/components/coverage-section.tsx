import { Body1, makeStyles, tokens } from '@fluentui/react-components';
import { useBriefing } from '../api/get-briefing';
import { CoveragePlot } from './coverage-plot';
import { CoverageTable } from './coverage-table';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM, minWidth: 0 },
});

export interface CoverageSectionProps {
  eventId: string;
  /** The rings of the prediction settings, drawn around the body. */
  rings: ReadonlyArray<{ ring: string; radiusKm: number }>;
}

/**
 * How the stations cover the body and its rings: each station's predicted chord on the sky plane beside
 * the table of its predicted numbers (the briefing's, so the coordinator sees what the observers get).
 */
export function CoverageSection({ eventId, rings }: CoverageSectionProps) {
  const styles = useStyles();
  const briefing = useBriefing(eventId);
  if (briefing.isPending) return <Loading label="Predicting each station's chord…" />;
  if (briefing.isError)
    return (
      <RequestFailed what="the coverage" error={briefing.error} onRetry={() => void briefing.refetch()} />
    );
  const { stations, bodyRadiusKm } = briefing.data;
  return (
    <section className={styles.section} aria-label="Coverage">
      <CoveragePlot
        bodyRadiusKm={bodyRadiusKm}
        rings={rings}
        chords={stations.map((s) => ({
          code: s.code,
          status: s.status,
          outlook: s.outlook,
          crossTrackKm: s.crossTrackKm,
          sigmaCrossTrackKm: s.sigmaCrossTrackKm,
        }))}
      />
      {stations.length === 0 ? (
        <Body1 as="p">No station yet: add one in Stations & reports, or let placement suggest sites.</Body1>
      ) : (
        <CoverageTable stations={stations} />
      )}
    </section>
  );
}
