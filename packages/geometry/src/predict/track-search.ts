// Searches along one point's track on the sky plane, (f, g)(t) with its rate: the instant of least
// |(f, g)| in a window, and the instants where |(f, g)| reaches a given radius. The track of a station
// is the body's motion plus the Earth's rotation, so |(f, g)| can have more than one local minimum over
// a long window (a slow body near its stationary point): every local minimum of a scan is refined and
// the least kept.
import { clamp } from '../math.js';
import { safeNewton } from './root.js';
import type { SkyState } from './sky-frame.js';

export type Track = (ttSeconds: number) => SkyState;

/** Scan step for minima: far shorter than the day over which the Earth's rotation bends a track. */
export const SCAN_SECONDS = 60;
const MIN_SCAN_INTERVALS = 64;
/** Times are refined to 1 µs; the output is written to the millisecond. */
export const TIME_TOLERANCE_SECONDS = 1e-6;
const MIN_CROSSING_STEP_SECONDS = 1e-3;
const MAX_CROSSING_STEP_SECONDS = 60;

export interface TrackMinimum {
  ttSeconds: number;
  state: SkyState;
  distanceKm: number;
}

export function radiusKm(s: SkyState): number {
  return Math.hypot(s.fKm, s.gKm);
}

/** ½ d|(f, g)|²/dt = (f, g)·(ḟ, ġ): negative while approaching, zero at the least distance. */
function approachRate(s: SkyState): number {
  return s.fKm * s.vfKmPerS + s.gKm * s.vgKmPerS;
}

/**
 * The approach rate and its slope |(ḟ, ġ)|² + (f, g)·(f̈, g̈), the acceleration term left out: it is the
 * station's ≈ 3e-5 km/s² times (f, g), ≤ 1e-3 of |v|² for a station within 10 000 km, which slows
 * Newton's convergence by that factor at most.
 */
function approachRateAndSlope(track: Track): (t: number) => [number, number] {
  return (t) => {
    const s = track(t);
    return [approachRate(s), s.vfKmPerS * s.vfKmPerS + s.vgKmPerS * s.vgKmPerS];
  };
}

/** |(f, g)| − level and its exact rate (f, g)·(ḟ, ġ)/|(f, g)|. */
function radiusAboveLevel(track: Track, levelKm: number): (t: number) => [number, number] {
  return (t) => {
    const s = track(t);
    const r = radiusKm(s);
    return [r - levelKm, r > 0 ? approachRate(s) / r : 0];
  };
}

function atTime(track: Track, ttSeconds: number): TrackMinimum {
  const state = track(ttSeconds);
  return { ttSeconds, state, distanceKm: radiusKm(state) };
}

/** The least |(f, g)| within [lo, hi] around a scan node, given that no node nearby is lower. */
function refine(track: Track, lo: number, node: number, hi: number): TrackMinimum {
  const a = atTime(track, lo);
  const b = atTime(track, hi);
  if (approachRate(a.state) < 0 && approachRate(b.state) > 0)
    return atTime(track, safeNewton(approachRateAndSlope(track), lo, hi, TIME_TOLERANCE_SECONDS));
  // No turn inside: the least distance is at an end of the window (or the scan met a flat stretch).
  return [a, atTime(track, node), b].reduce((best, c) => (c.distanceKm < best.distanceKm ? c : best));
}

/** The instant of least |(f, g)| in [fromTt, toTt]: scan, then refine each local minimum of the scan. */
export function closestApproach(track: Track, fromTt: number, toTt: number): TrackMinimum {
  const intervals = Math.max(MIN_SCAN_INTERVALS, Math.ceil((toTt - fromTt) / SCAN_SECONDS));
  const times = Array.from({ length: intervals + 1 }, (_, i) =>
    i === intervals ? toTt : fromTt + ((toTt - fromTt) * i) / intervals,
  );
  const distances = times.map((t) => radiusKm(track(t)));
  const at = (i: number): number => distances[i] as number;
  let best: TrackMinimum | null = null;
  for (let i = 0; i <= intervals; i++) {
    if ((i > 0 && at(i - 1) < at(i)) || (i < intervals && at(i + 1) < at(i))) continue;
    const candidate = refine(
      track,
      times[Math.max(i - 1, 0)] as number,
      times[i] as number,
      times[Math.min(i + 1, intervals)] as number,
    );
    if (best === null || candidate.distanceKm < best.distanceKm) best = candidate;
  }
  return best as TrackMinimum;
}

/**
 * The first instant, going from `startTt` in `direction`, where |(f, g)| reaches `levelKm` (which must
 * exceed |(f, g)(startTt)|), or null when it does not before `boundTt`. A straight track at the start's
 * speed reaches it after √(level² − d²)/|v|; the root is sought first in a narrow bracket around that
 * (2 % + 1 s), and where the track's bend puts it outside, by steps of a quarter of level/|v| from the
 * start; then Newton within the bracket.
 */
export function levelCrossing(
  track: Track,
  startTt: number,
  levelKm: number,
  direction: 1 | -1,
  boundTt: number,
): number | null {
  const start = track(startTt);
  const speed = Math.hypot(start.vfKmPerS, start.vgKmPerS);
  const above = (t: number): boolean => radiusKm(track(t)) >= levelKm;
  const within = (t: number): number => (direction > 0 ? Math.min(t, boundTt) : Math.max(t, boundTt));
  const straight = Math.sqrt(Math.max(levelKm * levelKm - radiusKm(start) ** 2, 0)) / speed;
  if (Number.isFinite(straight)) {
    const margin = 0.02 * straight + 1;
    const lo = startTt + direction * Math.max(0, straight - margin);
    const hi = within(startTt + direction * (straight + margin));
    if (direction * (hi - lo) > 0 && !above(lo) && above(hi))
      return safeNewton(radiusAboveLevel(track, levelKm), lo, hi, TIME_TOLERANCE_SECONDS);
  }
  const step = clamp(levelKm / (4 * speed), MIN_CROSSING_STEP_SECONDS, MAX_CROSSING_STEP_SECONDS);
  let a = startTt;
  for (;;) {
    const next = a + direction * step;
    const last = direction > 0 ? next >= boundTt : next <= boundTt;
    const b = last ? boundTt : next;
    if (above(b)) return safeNewton(radiusAboveLevel(track, levelKm), a, b, TIME_TOLERANCE_SECONDS);
    if (last) return null;
    a = b;
  }
}
