// Step in the data flow: geometry's TimingResult on the seconds axis -> the stored view on the UTC axis:
// the limbus-timing/1 document (one builder in @limbus/schema, shared with `limbus time`) with the series
// the client draws (data, model), so that the plot shows exactly what was fitted.
import type { TimingResult } from '@limbus/geometry';
import { formatUtc, type LightCurve, timingDocument, type TimingDocument } from '@limbus/schema';

export type TimingDipView = TimingDocument['dips'][number];

export interface TimingView extends TimingDocument {
  series: {
    originUtc: string;
    timesSeconds: number[];
    flux: number[];
    fluxErr: number[] | null;
    modelFlux: number[];
  };
}

export function timingView(series: LightCurve, result: TimingResult): TimingView {
  return {
    ...timingDocument(result, series.origin),
    series: {
      originUtc: formatUtc(series.origin, 0),
      timesSeconds: series.timesSeconds,
      flux: series.flux,
      fluxErr: series.fluxErr ?? null,
      modelFlux: Array.from(result.modelFlux),
    },
  };
}
