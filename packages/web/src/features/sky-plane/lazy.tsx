import { lazy } from 'react';

// D3 and the plots load only when a page shows them, keeping them out of the first-load bundle.
export const LazySkyPlanePlot = lazy(() =>
  import('./components/sky-plane-plot').then((m) => ({ default: m.SkyPlanePlot })),
);
export const LazyResidualsPlot = lazy(() =>
  import('./components/residuals-plot').then((m) => ({ default: m.ResidualsPlot })),
);
