// The prediction of an event before it happens (`limbus predict`): where the body's shadow crosses the
// Earth, and what each station should see. Validated event + prediction settings → sky frame (the solve's
// star, ephemeris, Earth orientation and station vectors, the body shifted by the stated offset) → the
// geocentre's closest approach, the path lines on the grid, and each station's closest approach, contact
// times and altitudes. docs/method.md, "Prediction", gives every formula.
import { geodeticToEarthFixedKm } from '../astro/station.js';
import { DEG, MAS_PER_RAD } from '../math.js';
import { ttSecondsToUtcIso } from '../time/scales.js';
import { GeometryInputError, type EventInput, type StationInput } from '../types.js';
import { stationAltitudesDeg } from './altitudes.js';
import { pathLines } from './path-lines.js';
import { PredictionSky } from './sky-frame.js';
import { closestApproach, levelCrossing, type Track } from './track-search.js';
import {
  PREDICTION_FORMAT,
  type PathPoint,
  type Prediction,
  type PredictionSettings,
  type StationPrediction,
} from './types.js';
import { predictionWindow, type PredictionWindow } from './window.js';

function requirePositive(value: number, path: string): void {
  if (!(value > 0) || !Number.isFinite(value))
    throw new GeometryInputError(path, 'must be a positive number of km');
}

function requireNonNegative(value: number, path: string): void {
  if (!(value >= 0) || !Number.isFinite(value))
    throw new GeometryInputError(path, 'must be zero or more (mas)');
}

function checkSettings(settings: PredictionSettings): void {
  requirePositive(settings.bodyRadiusKm, 'prediction.bodyRadiusKm');
  requireNonNegative(settings.uncertaintyMas.raCosDec, 'prediction.uncertaintyMas.raCosDec');
  requireNonNegative(settings.uncertaintyMas.dec, 'prediction.uncertaintyMas.dec');
  for (const [key, value] of Object.entries(settings.offsetMas))
    if (!Number.isFinite(value))
      throw new GeometryInputError(`prediction.offsetMas.${key}`, 'must be a number (mas)');
  const labels = new Set<string>();
  settings.rings.forEach((ring, i) => {
    requirePositive(ring.radiusKm, `prediction.rings[${i}].radiusKm`);
    if (labels.has(ring.ring))
      throw new GeometryInputError(`prediction.rings[${i}].ring`, `ring "${ring.ring}" is listed twice`);
    labels.add(ring.ring);
  });
}

/** Disappearance and reappearance of a circle of radius `levelKm` for a station, as UTC text. */
function contactTimes(
  track: Track,
  closestTt: number,
  distanceKm: number,
  levelKm: number,
  sky: PredictionSky,
): [string | null, string | null] | null {
  if (!(distanceKm < levelKm)) return null;
  const before = levelCrossing(track, closestTt, levelKm, -1, sky.ephemeris.startTtSeconds);
  const after = levelCrossing(track, closestTt, levelKm, 1, sky.ephemeris.endTtSeconds);
  return [
    before === null ? null : ttSecondsToUtcIso(before),
    after === null ? null : ttSecondsToUtcIso(after),
  ];
}

function predictStation(
  sky: PredictionSky,
  station: StationInput,
  index: number,
  settings: PredictionSettings,
  window: PredictionWindow,
): StationPrediction {
  const earthFixedKm = geodeticToEarthFixedKm(station.latDeg, station.lonDeg, station.heightM);
  const track: Track = (tt) => sky.observer(earthFixedKm, tt);
  const closest = closestApproach(track, window.fromTt, window.toTt);
  const { fKm, gKm, vfKmPerS, vgKmPerS } = closest.state;
  const speed = Math.hypot(vfKmPerS, vgKmPerS);
  if (!(speed > 0))
    throw new GeometryInputError(
      `stations[${index}]`,
      `the station does not move relative to the shadow at ${ttSecondsToUtcIso(closest.ttSeconds)}`,
    );
  // n_s: the station's own sky-plane velocity turned by +90°; positive when the station passes left.
  const crossTrackKm = (fKm * -vgKmPerS + gKm * vfKmPerS) / speed;
  // The path's 1σ across its own direction: the offset's 1σ (D·σ) projected on the path's left normal n.
  const body = sky.body(closest.ttSeconds);
  const n = sky.leftNormal(body, closest.ttSeconds);
  const sigmaCrossTrackKm = Math.hypot(
    (body.distanceKm * settings.uncertaintyMas.raCosDec * n.fKm) / MAS_PER_RAD,
    (body.distanceKm * settings.uncertaintyMas.dec * n.gKm) / MAS_PER_RAD,
  );
  const bodyContacts = contactTimes(track, closest.ttSeconds, closest.distanceKm, settings.bodyRadiusKm, sky);
  const rings = settings.rings.map((ring) => {
    const window = contactTimes(track, closest.ttSeconds, closest.distanceKm, ring.radiusKm, sky);
    // A ring window with an end beyond the ephemeris rows cannot be stated as a pair: null (documented).
    return {
      ring: ring.ring,
      window:
        window && window[0] !== null && window[1] !== null
          ? ([window[0], window[1]] as [string, string])
          : null,
    };
  });
  return {
    station: station.id,
    closestTimeUtc: ttSecondsToUtcIso(closest.ttSeconds),
    distanceKm: closest.distanceKm,
    crossTrackKm,
    sigmaCrossTrackKm,
    disappearanceUtc: bodyContacts?.[0] ?? null,
    reappearanceUtc: bodyContacts?.[1] ?? null,
    rings,
    ...stationAltitudesDeg(sky, station.latDeg * DEG, station.lonDeg * DEG, closest.ttSeconds),
  };
}

/**
 * The shadow path and every station's outlook for an event and its prediction settings. Problems a person
 * can fix come back as GeometryInputError naming the JSON path (e.g. `prediction.from`).
 */
export function predictEvent(event: EventInput, settings: PredictionSettings): Prediction {
  checkSettings(settings);
  const seen = new Map<string, number>();
  event.stations.forEach((s, i) => {
    const first = seen.get(s.id);
    if (first !== undefined)
      throw new GeometryInputError(
        `stations[${i}].id`,
        `duplicate station id "${s.id}" (also stations[${first}])`,
      );
    seen.set(s.id, i);
  });
  const sky = new PredictionSky(event, settings.offsetMas);
  const window = predictionWindow(sky.ephemeris, settings);

  const geocentre = closestApproach((tt) => sky.geocentre(tt), window.fromTt, window.toTt);
  const radius = settings.bodyRadiusKm;
  const offsetsKm = [0, radius, -radius, ...settings.rings.flatMap((r) => [r.radiusKm, -r.radiusKm])];
  const lines = pathLines(sky, window.gridTt, offsetsKm);
  const line = (k: number): PathPoint[] => lines[k] as PathPoint[];

  return {
    format: PREDICTION_FORMAT,
    closestApproach: {
      timeUtc: ttSecondsToUtcIso(geocentre.ttSeconds),
      distanceKm: geocentre.distanceKm,
      speedKmPerS: Math.hypot(geocentre.state.vfKmPerS, geocentre.state.vgKmPerS),
    },
    centralLine: line(0),
    limits: { left: line(1), right: line(2) },
    rings: settings.rings.map((r, i) => ({ ring: r.ring, left: line(3 + 2 * i), right: line(4 + 2 * i) })),
    stations: event.stations.map((s, i) => predictStation(sky, s, i, settings, window)),
  };
}
