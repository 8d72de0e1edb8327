// Sky-plane projection of an event: every chord endpoint, negative chord path and ring dip as (f, g) km
// on the fundamental plane through the geocentre perpendicular to the star's direction s, with
//   (f, g) = ((O(t) − B(t))·e_f, (O(t) − B(t))·e_g),
// O the station's and B the body's geocentric vectors (J2000/ICRS axes) at the corrected UTC t: the star's
// shadow ray through the station, relative to the body's ephemeris centre. docs/method.md, "Sky plane".
import { buildEphemeris, requireWithinSpan, type Ephemeris } from './astro/ephemeris.js';
import { skyPlaneBasis, starDirection, type SkyPlaneBasis } from './astro/star.js';
import { EarthOrientation, stationFromInput, type Station } from './astro/station.js';
import { dot, sub } from './astro/vec3.js';
import type { LimbPoint, NegativePath } from './fit/limb-fit.js';
import type { RingPoint } from './fit/ring-fit.js';
import { clamp } from './math.js';
import { ttSecondsToUtcIso, utcIsoToTtSeconds } from './time/scales.js';
import {
  GeometryInputError,
  type DipOpacity,
  type EventInput,
  type SkyPointKm,
  type SolutionChord,
  type VelocityKmPerS,
} from './types.js';

export type { SkyPlaneBasis } from './astro/star.js';

export interface RingDip {
  station: string;
  start: SkyPointKm;
  end: SkyPointKm;
  /** The dip's corrected end minus start. */
  durationSeconds: number;
  startSigmaSeconds: number;
  endSigmaSeconds: number;
  /** The station's sky-plane velocity at the dip's mid-time (that of its ring point). */
  velocity: VelocityKmPerS;
  apparentOpacity?: DipOpacity;
}

export interface ProjectedEvent {
  basis: SkyPlaneBasis;
  /** Mean of the positive chords' corrected mid-times; else of the ring dips'; else of the negative chords'. */
  referenceTimeUtc: string;
  /** Geocentric body distance at the reference time. */
  distanceKm: number;
  chords: SolutionChord[];
  limbPoints: LimbPoint[];
  negatives: NegativePath[];
  ringPoints: Map<string, RingPoint[]>;
  ringDips: Map<string, RingDip[]>;
  /** Per ring label: the mean of its dips' mid-times and the body distance then (astrometry without a limb). */
  ringReferences: Map<string, { referenceTimeUtc: string; distanceKm: number }>;
}

export interface ProjectOptions {
  /** Fitted clock offsets per station, added to the event's own timeOffsetSeconds. */
  timeOffsetsSeconds?: Record<string, number>;
}

/**
 * Negative chords are sampled every quarter of the longest positive chord's duration, within these bounds:
 * every path across the body's middle half then has a sample inside it, and the fit's clearance test works
 * on straight segments between samples, exact up to the path's curvature (sagitta ≤ 0.1 m at 5 s). See
 * docs/method.md, "Sky plane".
 */
export const PATH_STEP_FRACTION_OF_LONGEST_CHORD = 0.25;
export const PATH_STEP_MIN_SECONDS = 0.1;
export const PATH_STEP_MAX_SECONDS = 5;
export const PATH_MAX_POINTS = 5001;

interface Timed {
  ttSeconds: number;
  path: string;
}

/** One timed edge of a positive chord, at its corrected time. */
interface TimedEdge extends Timed {
  event: 'disappearance' | 'reappearance';
  sigmaSeconds: number;
}

/**
 * A chord's corrected times: [a, b] is the span it covers (a positive chord's edges, or a negative chord's
 * start and end); a positive chord with one edge has a = b = that edge.
 */
interface ChordTimes {
  station: Station;
  a: Timed;
  b: Timed;
  edges: TimedEdge[];
}

function mean(values: readonly number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

function requirePositiveSigma(sigmaSeconds: number, path: string): void {
  if (!(sigmaSeconds > 0) || !Number.isFinite(sigmaSeconds))
    throw new GeometryInputError(path, 'must be a positive number of seconds');
}

/** The sky-plane geometry of one event, at its reference time. */
class SkyPlane {
  constructor(
    readonly basis: SkyPlaneBasis,
    private readonly ephemeris: Ephemeris,
    private readonly orientation: EarthOrientation,
  ) {}

  point(station: Station, ttSeconds: number): SkyPointKm {
    const o = this.orientation.celestialState(station.earthFixedKm, ttSeconds).positionKm;
    const rel = sub(o, this.ephemeris.stateAt(ttSeconds).positionKm);
    return { fKm: dot(rel, this.basis.eF), gKm: dot(rel, this.basis.eG) };
  }

  velocity(station: Station, ttSeconds: number): VelocityKmPerS {
    const o = this.orientation.celestialState(station.earthFixedKm, ttSeconds).velocityKmPerS;
    const rel = sub(o, this.ephemeris.stateAt(ttSeconds).velocityKmPerS);
    return { f: dot(rel, this.basis.eF), g: dot(rel, this.basis.eG) };
  }
}

export function projectEvent(event: EventInput, options: ProjectOptions = {}): ProjectedEvent {
  const stations = new Map<string, Station>();
  event.stations.forEach((input, i) => {
    if (stations.has(input.id))
      throw new GeometryInputError(`stations[${i}].id`, `station "${input.id}" is listed twice`);
    stations.set(input.id, stationFromInput(input));
  });
  const stationAt = (id: string, path: string): Station => {
    const station = stations.get(id);
    if (!station) throw new GeometryInputError(path, `unknown station "${id}"`);
    return station;
  };
  const fitted = options.timeOffsetsSeconds ?? {};
  // A station's fixed clock offset is stated on its chord; its ring dips take the same offset.
  const fixedOffset = new Map<string, number>();
  for (const chord of event.chords)
    if (!fixedOffset.has(chord.station)) fixedOffset.set(chord.station, chord.timeOffsetSeconds);
  const correctedTt = (text: string, station: string, path: string, chordOffset?: number): Timed => ({
    ttSeconds:
      utcIsoToTtSeconds(text, path) + (chordOffset ?? fixedOffset.get(station) ?? 0) + (fitted[station] ?? 0),
    path,
  });

  const ephemeris = buildEphemeris(event.ephemeris.rows, event.ephemeris.timeScale);

  const chordTimes = event.chords.map((chord, i): ChordTimes => {
    const station = stationAt(chord.station, `chords[${i}].station`);
    if (chord.type === 'positive') {
      const edge = (event: 'disappearance' | 'reappearance'): TimedEdge | null => {
        const mark = chord[event];
        if (mark === undefined) return null;
        requirePositiveSigma(mark.sigmaSeconds, `chords[${i}].${event}.sigmaSeconds`);
        return {
          event,
          sigmaSeconds: mark.sigmaSeconds,
          ...correctedTt(mark.time, chord.station, `chords[${i}].${event}.time`, chord.timeOffsetSeconds),
        };
      };
      const edges = [edge('disappearance'), edge('reappearance')].filter((e): e is TimedEdge => e !== null);
      const [first, last] = [edges[0], edges[edges.length - 1]];
      if (first === undefined || last === undefined)
        throw new GeometryInputError(
          `chords[${i}]`,
          'a positive chord needs a disappearance, a reappearance or both',
        );
      if (edges.length === 2 && last.ttSeconds <= first.ttSeconds)
        throw new GeometryInputError(last.path, 'reappearance is not after disappearance');
      return { station, a: first, b: last, edges };
    }
    const a = correctedTt(chord.start, chord.station, `chords[${i}].start`, chord.timeOffsetSeconds);
    const b = correctedTt(chord.end, chord.station, `chords[${i}].end`, chord.timeOffsetSeconds);
    if (b.ttSeconds <= a.ttSeconds) throw new GeometryInputError(b.path, 'chord ends before it starts');
    return { station, a, b, edges: [] };
  });
  const dipTimes = event.ringEvents.map((dip, i) => {
    const station = stationAt(dip.station, `ringEvents[${i}].station`);
    requirePositiveSigma(dip.start.sigmaSeconds, `ringEvents[${i}].start.sigmaSeconds`);
    requirePositiveSigma(dip.end.sigmaSeconds, `ringEvents[${i}].end.sigmaSeconds`);
    const a = correctedTt(dip.start.time, dip.station, `ringEvents[${i}].start.time`);
    const b = correctedTt(dip.end.time, dip.station, `ringEvents[${i}].end.time`);
    if (b.ttSeconds <= a.ttSeconds) throw new GeometryInputError(b.path, 'dip ends before it starts');
    return { station, a, b };
  });
  for (const t of [...chordTimes, ...dipTimes]) {
    requireWithinSpan(ephemeris, t.a.ttSeconds, t.a.path);
    requireWithinSpan(ephemeris, t.b.ttSeconds, t.b.path);
  }

  // A single-edge chord's own time stands in for its mid-time (a = b), in the reference time and for its
  // velocity.
  const midTt = (t: { a: Timed; b: Timed }): number => (t.a.ttSeconds + t.b.ttSeconds) / 2;
  const positiveMids = chordTimes.filter((_, i) => event.chords[i]?.type === 'positive').map(midTt);
  const referenceTt =
    positiveMids.length > 0
      ? mean(positiveMids)
      : dipTimes.length > 0
        ? mean(dipTimes.map(midTt))
        : chordTimes.length > 0
          ? mean(chordTimes.map(midTt))
          : (ephemeris.startTtSeconds + ephemeris.endTtSeconds) / 2;

  const basis = skyPlaneBasis(starDirection(event.star, referenceTt));
  const sky = new SkyPlane(basis, ephemeris, new EarthOrientation(event.earthRotation.dut1Seconds));

  // Only a chord with both edges has a duration; a single-edge chord has none to scale the step by.
  const longestPositiveSeconds = Math.max(
    0,
    ...chordTimes.filter((t) => t.edges.length === 2).map((t) => t.b.ttSeconds - t.a.ttSeconds),
  );
  const baseStepSeconds =
    longestPositiveSeconds > 0
      ? clamp(
          longestPositiveSeconds * PATH_STEP_FRACTION_OF_LONGEST_CHORD,
          PATH_STEP_MIN_SECONDS,
          PATH_STEP_MAX_SECONDS,
        )
      : PATH_STEP_MAX_SECONDS;

  const chords: SolutionChord[] = [];
  const limbPoints: LimbPoint[] = [];
  const negatives: NegativePath[] = [];
  event.chords.forEach((chord, i) => {
    const t = chordTimes[i] as ChordTimes;
    const velocity = sky.velocity(t.station, midTt(t));
    const speed = Math.hypot(velocity.f, velocity.g);
    if (chord.type === 'positive') {
      // Both edges: the velocity at the chord's mid-time, shared by its two points. One edge: the velocity
      // at that edge's own corrected time.
      const points: SolutionChord['points'] = [];
      for (const edge of t.edges) {
        const point = sky.point(t.station, edge.ttSeconds);
        points.push({ ...point, event: edge.event, sigmaKm: edge.sigmaSeconds * speed });
        limbPoints.push({
          station: chord.station,
          event: edge.event,
          ...point,
          sigmaSeconds: edge.sigmaSeconds,
          velocity,
        });
      }
      chords.push({ station: chord.station, type: 'positive', points, path: [], velocityKmPerS: velocity });
      return;
    }
    const duration = t.b.ttSeconds - t.a.ttSeconds;
    const steps = Math.min(PATH_MAX_POINTS - 1, Math.max(1, Math.ceil(duration / baseStepSeconds)));
    const path: SkyPointKm[] = [];
    for (let k = 0; k <= steps; k++) path.push(sky.point(t.station, t.a.ttSeconds + (duration * k) / steps));
    chords.push({ station: chord.station, type: 'negative', points: [], path, velocityKmPerS: velocity });
    negatives.push({ station: chord.station, pathKm: path });
  });

  const ringPoints = new Map<string, RingPoint[]>();
  const ringDips = new Map<string, RingDip[]>();
  const ringMids = new Map<string, number[]>();
  event.ringEvents.forEach((dip, i) => {
    const t = dipTimes[i] as (typeof dipTimes)[number];
    const mid = midTt(t);
    const point: RingPoint = {
      station: dip.station,
      ...sky.point(t.station, mid),
      // σt = ½√(σstart² + σend²): the mid-time is the mean of two independent timings.
      sigmaSeconds: 0.5 * Math.hypot(dip.start.sigmaSeconds, dip.end.sigmaSeconds),
      velocity: sky.velocity(t.station, mid),
    };
    const list = ringPoints.get(dip.ring) ?? [];
    list.push(point);
    ringPoints.set(dip.ring, list);
    const dips = ringDips.get(dip.ring) ?? [];
    dips.push({
      station: dip.station,
      start: sky.point(t.station, t.a.ttSeconds),
      end: sky.point(t.station, t.b.ttSeconds),
      durationSeconds: t.b.ttSeconds - t.a.ttSeconds,
      startSigmaSeconds: dip.start.sigmaSeconds,
      endSigmaSeconds: dip.end.sigmaSeconds,
      velocity: point.velocity,
      ...(dip.apparentOpacity === undefined ? {} : { apparentOpacity: dip.apparentOpacity }),
    });
    ringDips.set(dip.ring, dips);
    const mids = ringMids.get(dip.ring) ?? [];
    mids.push(mid);
    ringMids.set(dip.ring, mids);
  });
  const ringReferences = new Map<string, { referenceTimeUtc: string; distanceKm: number }>();
  for (const [ring, mids] of ringMids) {
    const tt = mean(mids);
    ringReferences.set(ring, {
      referenceTimeUtc: ttSecondsToUtcIso(tt),
      distanceKm: ephemeris.distanceKmAt(tt),
    });
  }

  return {
    basis,
    referenceTimeUtc: ttSecondsToUtcIso(referenceTt),
    distanceKm: ephemeris.distanceKmAt(referenceTt),
    chords,
    limbPoints,
    negatives,
    ringPoints,
    ringDips,
    ringReferences,
  };
}
