import { Body1, makeStyles, Title3, tokens } from '@fluentui/react-components';
import { Suspense, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Loading } from '@/components/request-state';
import { syntheticEvent } from '@/features/sky-plane/fixtures/solution-fixture';
import { LazyResidualsPlot, LazySkyPlanePlot } from '@/features/sky-plane/lazy';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
});

const DEFAULT_CHORDS = 7;
const MAX_CHORDS = 1000;

/**
 * The event desk's plots on an invented occultation, for working on the plots (?chords=200 draws that
 * many). Development builds only: the router leaves it out of the product.
 */
export function PlotsPreviewRoute() {
  const styles = useStyles();
  const [search] = useSearchParams();
  const requested = Number(search.get('chords') ?? DEFAULT_CHORDS);
  const chordCount =
    Number.isInteger(requested) && requested >= 2 ? Math.min(requested, MAX_CHORDS) : DEFAULT_CHORDS;
  const negativeCount = Math.max(1, Math.round(chordCount * 0.1));
  const event = useMemo(
    () => syntheticEvent(chordCount - negativeCount, negativeCount),
    [chordCount, negativeCount],
  );
  return (
    <div className={styles.page}>
      <Title3 as="h2">Plot preview</Title3>
      <Body1 as="p">
        An invented occultation by the invented body Vesperine: {chordCount - negativeCount} positive and{' '}
        {negativeCount} negative chords, one ring.
      </Body1>
      <Suspense fallback={<Loading label="Loading the plots…" />}>
        <LazySkyPlanePlot solution={event.solution} chordInputs={event.chords} />
        <LazyResidualsPlot solution={event.solution} />
      </Suspense>
    </div>
  );
}
