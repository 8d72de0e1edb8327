// What the shadow-path map draws beyond the prediction document: the edges of the 1σ and 3σ bands of the
// path (the limits moved out and in by kσ, σ the path's cross-track 1σ at closest approach), time ticks on
// the central line at whole minutes, and the point under the Sun at closest approach (day/night). Lines
// come from the prediction's own path-line function, on the prediction's own grid.
import { pathLines } from '../predict/path-lines.js';
import { PredictionSky } from '../predict/sky-frame.js';
import type { PathPoint, Prediction, PredictionSettings } from '../predict/types.js';
import { predictionWindow } from '../predict/window.js';
import { utcIsoToTtSeconds } from '../time/scales.js';
import type { EventInput } from '../types.js';
import { pathSigmaCrossTrackKm } from './path-sigma.js';
import { subsolarPoint } from './pointing.js';

/** The band edges drawn, in σ (1σ holds about 68 % of paths, 3σ about 99.7 %; Gaussian, from memory). */
export const BAND_SIGMAS = [1, 3] as const;
/** Tick spacings tried, minutes, the first that gives at most MAX_TICKS ticks in the window. */
const TICK_MINUTES = [1, 2, 5, 10, 15, 30, 60, 120, 360, 720, 1440] as const;
const MAX_TICKS = 40;

export interface BandEdge {
  line: 'left' | 'right';
  sigma: (typeof BAND_SIGMAS)[number];
  /** outer: R + kσ from the centre; inner: R − kσ (absent when kσ ≥ R). */
  edge: 'outer' | 'inner';
  offsetKm: number;
  points: PathPoint[];
}

export interface PathMapExtras {
  sigmaCrossTrackKm: number;
  subsolarPoint: { latDeg: number; lonDeg: number };
  bands: BandEdge[];
  ticks: Array<PathPoint & { minuteSpacing: number }>;
}

export function pathMapExtras(
  event: EventInput,
  settings: PredictionSettings,
  prediction: Prediction,
): PathMapExtras {
  const sky = new PredictionSky(event, settings.offsetMas);
  const window = predictionWindow(sky.ephemeris, settings);
  const closestTt = utcIsoToTtSeconds(prediction.closestApproach.timeUtc, 'closestApproach.timeUtc');
  const sigmaCrossTrackKm = pathSigmaCrossTrackKm(sky, settings, closestTt);
  const radiusKm = settings.bodyRadiusKm;
  const edges: Array<Omit<BandEdge, 'points'>> = [];
  if (sigmaCrossTrackKm > 0)
    for (const sigma of BAND_SIGMAS) {
      const spread = sigma * sigmaCrossTrackKm;
      edges.push({ line: 'left', sigma, edge: 'outer', offsetKm: radiusKm + spread });
      edges.push({ line: 'right', sigma, edge: 'outer', offsetKm: -(radiusKm + spread) });
      if (spread < radiusKm) {
        edges.push({ line: 'left', sigma, edge: 'inner', offsetKm: radiusKm - spread });
        edges.push({ line: 'right', sigma, edge: 'inner', offsetKm: -(radiusKm - spread) });
      }
    }
  const lines = pathLines(
    sky,
    window.gridTt,
    edges.map((e) => e.offsetKm),
  );

  // Ticks on whole UTC minutes where the central line is on the ground, spaced so that there are at most
  // MAX_TICKS of them.
  const first = prediction.centralLine[0];
  const last = prediction.centralLine.at(-1);
  const tickTt: number[] = [];
  let minuteSpacing = 1;
  if (first !== undefined && last !== undefined) {
    const startMs = Date.parse(first.timeUtc);
    const endMs = Date.parse(last.timeUtc);
    minuteSpacing = TICK_MINUTES.find((m) => (endMs - startMs) / 60_000 / m <= MAX_TICKS) ?? 1440;
    const spacingMs = minuteSpacing * 60_000;
    for (let ms = Math.ceil(startMs / spacingMs) * spacingMs; ms <= endMs; ms += spacingMs)
      tickTt.push(utcIsoToTtSeconds(new Date(ms).toISOString(), 'tick'));
  }
  const [tickLine] = pathLines(sky, tickTt, [0]);
  return {
    sigmaCrossTrackKm,
    subsolarPoint: subsolarPoint(sky, closestTt),
    bands: edges.map((e, i) => ({ ...e, points: lines[i] ?? [] })),
    ticks: (tickLine ?? []).map((p) => ({ ...p, minuteSpacing })),
  };
}
