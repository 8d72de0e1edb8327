// Render cost of the sky-plane plot with 200 chords (180 positive, 20 negative), in jsdom: React render
// plus the whole D3 draw, unmount included. `pnpm --filter @limbus/web bench` prints ms per render.
import { cleanup, render } from '@testing-library/react';
import { bench, describe } from 'vitest';
import { syntheticEvent } from '@/features/sky-plane/fixtures/solution-fixture';
import { SkyPlanePlot } from '@/features/sky-plane/components/sky-plane-plot';
import { ResidualsPlot } from '@/features/sky-plane/components/residuals-plot';

const large = syntheticEvent(180, 20);

describe('plots with 200 chords', () => {
  bench(
    'SkyPlanePlot render + draw',
    () => {
      render(<SkyPlanePlot solution={large.solution} chordInputs={large.chords} />);
      cleanup();
    },
    { iterations: 20, warmupIterations: 3 },
  );
  bench(
    'ResidualsPlot render + draw (360 endpoints)',
    () => {
      render(<ResidualsPlot solution={large.solution} />);
      cleanup();
    },
    { iterations: 20, warmupIterations: 3 },
  );
});
