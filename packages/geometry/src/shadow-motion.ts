// How fast a station crosses the sky plane at a given instant, and how far the body is then: the two
// numbers a light-curve timing needs to turn seconds into kilometres (Fresnel scale, star disc). Computed
// by the same projection as the fits, so a timing and the fit that uses its times agree on the geometry.
import { projectEvent } from './project.js';
import { GeometryInputError, type EventInput, type SkyPointKm, type VelocityKmPerS } from './types.js';

export interface ShadowMotion {
  /** |v| of the station relative to the body's shadow in the sky plane, km/s. */
  speedKmPerS: number;
  velocityKmPerS: VelocityKmPerS;
  /** The station's sky-plane position relative to the body's ephemeris centre at that instant, km. */
  pointKm: SkyPointKm;
  /** Geocentric distance of the body, km. */
  distanceKm: number;
}

/**
 * The station's sky-plane velocity and the body's distance at `timeUtc`, from the event's star, ephemeris
 * and Earth rotation. The event's own chords and fit options play no part. Problems come back as
 * GeometryInputError naming `station` or `time` (e.g. a time outside the ephemeris span).
 */
export function shadowMotionAt(
  event: Pick<EventInput, 'star' | 'ephemeris' | 'earthRotation' | 'stations'>,
  stationId: string,
  timeUtc: string,
): ShadowMotion {
  if (!event.stations.some((s) => s.id === stationId))
    throw new GeometryInputError('station', `unknown station "${stationId}"`);
  const t = Date.parse(timeUtc);
  if (!Number.isFinite(t)) throw new GeometryInputError('time', `"${timeUtc}" is not an ISO 8601 UTC time`);
  // A one-second negative chord centred on the instant: its velocity is taken at its mid-time, and with
  // no positive chord the reference time (and so the distance) is that mid-time too.
  const probe: EventInput = {
    format: 'limbus-event/1',
    title: 'shadow motion',
    star: event.star,
    ephemeris: event.ephemeris,
    earthRotation: event.earthRotation,
    stations: event.stations,
    chords: [
      {
        station: stationId,
        type: 'negative',
        start: new Date(t - 500).toISOString(),
        end: new Date(t + 500).toISOString(),
        timeOffsetSeconds: 0,
      },
    ],
    ringEvents: [],
    fit: { limb: { fixed: {}, modelErrorKm: 0, fitTimeOffsets: [] }, ring: { centerFrom: 'limb' } },
  };
  let projected;
  try {
    projected = projectEvent(probe);
  } catch (error) {
    if (error instanceof GeometryInputError && error.path.startsWith('chords[0]'))
      throw new GeometryInputError('time', error.detail);
    throw error;
  }
  const chord = projected.chords[0] as { velocityKmPerS: VelocityKmPerS; path: SkyPointKm[] };
  const velocity = chord.velocityKmPerS;
  // The probe's two path ends, ±0.5 s: their mean is the position at the instant to within the track's
  // curvature over half a second (millimetres).
  const first = chord.path[0] as SkyPointKm;
  const last = chord.path[chord.path.length - 1] as SkyPointKm;
  return {
    speedKmPerS: Math.hypot(velocity.f, velocity.g),
    velocityKmPerS: velocity,
    pointKm: { fKm: (first.fKm + last.fKm) / 2, gKm: (first.gKm + last.gKm) / 2 },
    distanceKm: projected.distanceKm,
  };
}
