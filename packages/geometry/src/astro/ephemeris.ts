// The body's geocentric astrometric ephemeris as a smooth function of time: the rows' (RA, Dec, distance)
// turned into Cartesian km (no 0°/360° wrap to handle) and each component interpolated by a not-a-knot
// cubic spline in TT; the velocity is the spline's derivative.
import { DEG } from '../math.js';
import { isoToTtSeconds } from '../time/scales.js';
import { GeometryInputError, type EphemerisRow, type TimeScale } from '../types.js';
import { cubicSpline, evaluateSpline, type CubicSpline } from './spline.js';
import { fromRaDec, norm, scale, type Vec3 } from './vec3.js';

export interface Ephemeris {
  startTtSeconds: number;
  endTtSeconds: number;
  /** "2028-03-14T02:00:00 – 02:40:00 TT", for error messages. */
  spanText: string;
  stateAt(ttSeconds: number): { positionKm: Vec3; velocityKmPerS: Vec3 };
  distanceKmAt(ttSeconds: number): number;
}

function spanText(rows: readonly EphemerisRow[], scaleName: TimeScale): string {
  const first = (rows[0] as EphemerisRow).time;
  const last = (rows[rows.length - 1] as EphemerisRow).time;
  const sameDay = first.slice(0, 11) === last.slice(0, 11);
  return `${first} – ${sameDay ? last.slice(11) : last} ${scaleName}`;
}

/** Builds the interpolant; problems are reported at `ephemeris.rows…` paths. */
export function buildEphemeris(rows: readonly EphemerisRow[], timeScale: TimeScale): Ephemeris {
  if (rows.length < 4)
    throw new GeometryInputError('ephemeris.rows', `at least 4 rows are needed, got ${rows.length}`);
  const times: number[] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  const zs: number[] = [];
  rows.forEach((row, i) => {
    const tt = isoToTtSeconds(row.time, timeScale, `ephemeris.rows[${i}].time`);
    const previous = times[times.length - 1];
    if (previous !== undefined && tt <= previous)
      throw new GeometryInputError(
        `ephemeris.rows[${i}].time`,
        'rows must be in strictly increasing time order',
      );
    if (!(row.distanceKm > 0))
      throw new GeometryInputError(`ephemeris.rows[${i}].distanceKm`, 'must be positive');
    times.push(tt);
    const r = scale(fromRaDec(row.raDeg * DEG, row.decDeg * DEG), row.distanceKm);
    xs.push(r[0]);
    ys.push(r[1]);
    zs.push(r[2]);
  });
  const t0 = times[0] as number;
  // Knots relative to the first row so that the spline's arithmetic works on small numbers.
  const knots = times.map((t) => t - t0);
  const splines: [CubicSpline, CubicSpline, CubicSpline] = [
    cubicSpline(knots, xs),
    cubicSpline(knots, ys),
    cubicSpline(knots, zs),
  ];
  const stateAt = (ttSeconds: number): { positionKm: Vec3; velocityKmPerS: Vec3 } => {
    const [x, y, z] = splines.map((s) => evaluateSpline(s, ttSeconds - t0)) as [
      { value: number; derivative: number },
      { value: number; derivative: number },
      { value: number; derivative: number },
    ];
    return {
      positionKm: [x.value, y.value, z.value],
      velocityKmPerS: [x.derivative, y.derivative, z.derivative],
    };
  };
  return {
    startTtSeconds: t0,
    endTtSeconds: times[times.length - 1] as number,
    spanText: spanText(rows, timeScale),
    stateAt,
    distanceKmAt: (ttSeconds) => norm(stateAt(ttSeconds).positionKm),
  };
}

/** Throws the brief's span error when an instant falls outside the rows. */
export function requireWithinSpan(ephemeris: Ephemeris, ttSeconds: number, path: string): void {
  if (ttSeconds < ephemeris.startTtSeconds || ttSeconds > ephemeris.endTtSeconds)
    throw new GeometryInputError(path, `outside the ephemeris span ${ephemeris.spanText}`);
}
