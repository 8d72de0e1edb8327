// Step in the data flow: geometry's TimingResult on the seconds axis -> the stored view on the UTC axis,
// with the series the client draws (data, model) so that the plot shows exactly what was fitted.
import type { TimedMark, TimingResult } from '@limbus/geometry';
import { formatUtc, type LightCurve, type UtcInstant } from '@limbus/schema';

export interface TimingDipView {
  start: TimedMark;
  end: TimedMark;
  apparentOpacity: number;
  apparentOpticalDepth: number | null;
  equivalentWidthKm: number;
  significance: number;
  marked: boolean;
}

export interface TimingView {
  format: 'limbus-timing/1';
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
  baselineFlux: number;
  bottomFlux: number | null;
  chi2: number;
  dof: number;
  fresnelScaleKm: number;
  starDiameterKm: number;
  noiseSigmaFlux: number | null;
  eventSignificance: number;
  dips: TimingDipView[];
  series: {
    originUtc: string;
    timesSeconds: number[];
    flux: number[];
    fluxErr: number[] | null;
    modelFlux: number[];
  };
}

function mark(origin: UtcInstant, edge: { timeSeconds: number; sigmaSeconds: number }): TimedMark {
  return { time: formatUtc(origin, edge.timeSeconds), sigmaSeconds: edge.sigmaSeconds };
}

export function timingView(series: LightCurve, result: TimingResult): TimingView {
  const o = series.origin;
  return {
    format: 'limbus-timing/1',
    disappearance: result.disappearance ? mark(o, result.disappearance) : null,
    reappearance: result.reappearance ? mark(o, result.reappearance) : null,
    baselineFlux: result.baselineFlux,
    bottomFlux: result.bottomFlux,
    chi2: result.chi2,
    dof: result.dof,
    fresnelScaleKm: result.fresnelScaleKm,
    starDiameterKm: result.starDiameterKm,
    noiseSigmaFlux: result.noiseSigmaFlux,
    eventSignificance: result.eventSignificance,
    dips: result.dips.map((d) => ({
      start: mark(o, d.start),
      end: mark(o, d.end),
      apparentOpacity: d.apparentOpacity,
      apparentOpticalDepth: d.apparentOpticalDepth,
      equivalentWidthKm: d.equivalentWidthKm,
      significance: d.significance,
      marked: d.marked,
    })),
    series: {
      originUtc: formatUtc(o, 0),
      timesSeconds: series.timesSeconds,
      flux: series.flux,
      fluxErr: series.fluxErr ?? null,
      modelFlux: Array.from(result.modelFlux),
    },
  };
}
