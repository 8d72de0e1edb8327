// What an observer needs beside a station's prediction: the ± of each predicted contact that the offset's
// 1σ implies (contact-time-sigma.ts), when to record (the watch window), and where to point. The station's
// sky-plane velocity and the body's distance come from the prediction's own sky frame at the station's
// closest approach t*, so these numbers and the prediction's agree.
import { geodeticToEarthFixedKm } from '../astro/station.js';
import { MAS_PER_RAD } from '../math.js';
import { PredictionSky } from '../predict/sky-frame.js';
import type { Prediction, PredictionSettings, StationPrediction } from '../predict/types.js';
import { ttSecondsToUtcIso, utcIsoToTtSeconds } from '../time/scales.js';
import { GeometryInputError, type EventInput } from '../types.js';
import { contactTimeSigma } from './contact-time-sigma.js';
import { type Pointing, pointingAt } from './pointing.js';

/**
 * The watch window is never shorter than this either side of t*: recording a minute around the predicted
 * time costs nothing and catches a clock or ephemeris worse than stated (common practice, no source).
 */
export const MIN_WATCH_HALF_SECONDS = 60;
/** The watch window covers every contact the path shifted by up to this many σ could make. */
export const WATCH_SIGMAS = 3;

export interface StationBrief {
  station: string;
  velocityKmPerS: { f: number; g: number };
  speedKmPerS: number;
  /** 1σ of the body's place on the sky plane at t*, km (D·σ_raCosDec, D·σ_dec). */
  sigmaFKm: number;
  sigmaGKm: number;
  /** 1σ of the predicted disappearance and reappearance, s; null where the prediction has none. */
  disappearanceSigmaSeconds: number | null;
  reappearanceSigmaSeconds: number | null;
  rings: Array<{ ring: string; entrySigmaSeconds: number | null; exitSigmaSeconds: number | null }>;
  /** Record from … to …: t* ± the time to cross the outermost circle with the path moved by up to 3σ. */
  watch: { fromUtc: string; toUtc: string };
  pointing: Pointing;
}

export function briefStations(
  event: EventInput,
  settings: PredictionSettings,
  prediction: Prediction,
): StationBrief[] {
  const sky = new PredictionSky(event, settings.offsetMas);
  const outermostKm = Math.max(settings.bodyRadiusKm, ...settings.rings.map((r) => r.radiusKm));
  return prediction.stations.map((predicted: StationPrediction) => {
    const station = event.stations.find((s) => s.id === predicted.station);
    if (!station)
      throw new GeometryInputError(
        'stations',
        `the prediction names station "${predicted.station}", not in the event`,
      );
    const tt = utcIsoToTtSeconds(predicted.closestTimeUtc, 'closestTimeUtc');
    const state = sky.observer(geodeticToEarthFixedKm(station.latDeg, station.lonDeg, station.heightM), tt);
    const velocityKmPerS = { f: state.vfKmPerS, g: state.vgKmPerS };
    const speedKmPerS = Math.hypot(velocityKmPerS.f, velocityKmPerS.g);
    const distanceKm = sky.body(tt).distanceKm;
    const sigmaFKm = (distanceKm * settings.uncertaintyMas.raCosDec) / MAS_PER_RAD;
    const sigmaGKm = (distanceKm * settings.uncertaintyMas.dec) / MAS_PER_RAD;
    const sigmas = (radiusKm: number) =>
      Math.abs(predicted.crossTrackKm) < radiusKm
        ? contactTimeSigma({
            crossTrackKm: predicted.crossTrackKm,
            radiusKm,
            velocityKmPerS,
            sigmaFKm,
            sigmaGKm,
          })
        : null;
    const body = sigmas(settings.bodyRadiusKm);
    const uf = velocityKmPerS.f / speedKmPerS;
    const ug = velocityKmPerS.g / speedKmPerS;
    const sigmaAlongKm = Math.hypot(sigmaFKm * uf, sigmaGKm * ug);
    const reachKm = outermostKm + WATCH_SIGMAS * predicted.sigmaCrossTrackKm;
    const halfSeconds = Math.max(
      MIN_WATCH_HALF_SECONDS,
      (Math.sqrt(Math.max(0, reachKm ** 2 - predicted.crossTrackKm ** 2)) + WATCH_SIGMAS * sigmaAlongKm) /
        speedKmPerS,
    );
    return {
      station: station.id,
      velocityKmPerS,
      speedKmPerS,
      sigmaFKm,
      sigmaGKm,
      disappearanceSigmaSeconds: predicted.disappearanceUtc === null ? null : (body?.firstSeconds ?? null),
      reappearanceSigmaSeconds: predicted.reappearanceUtc === null ? null : (body?.lastSeconds ?? null),
      rings: settings.rings.map((ring) => {
        const window = predicted.rings.find((r) => r.ring === ring.ring)?.window ?? null;
        const s = window === null ? null : sigmas(ring.radiusKm);
        return {
          ring: ring.ring,
          entrySigmaSeconds: s?.firstSeconds ?? null,
          exitSigmaSeconds: s?.lastSeconds ?? null,
        };
      }),
      watch: { fromUtc: ttSecondsToUtcIso(tt - halfSeconds), toUtc: ttSecondsToUtcIso(tt + halfSeconds) },
      pointing: pointingAt(sky, station, tt),
    };
  });
}
