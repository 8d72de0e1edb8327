// The shadow-path map as data (@limbus/schema/planning `predictionMapSchema`): the prediction's central
// line, limits and ring limits, the 1σ and 3σ band edges, time ticks, the point under the Sun and each
// station's outlook. The client's map, the server's SVG/PNG/PDF and the GeoJSON/KML exports draw this one
// description.
import { pathMapExtras } from '@limbus/geometry';
import { type PredictionMap, stationOutlook } from '@limbus/schema';
import type { PlanningSnapshot } from './prediction-cache';

/** The cautions any map or path export carries (common practice, no source). */
export const PATH_CAUTIONS = [
  'A prediction, not an observation: the path can lie farther off than its 3σ band when the star position or the ephemeris is worse than stated.',
  'Lines are drawn at height 0 on the WGS84 ellipsoid; a site high above it sees the path shifted towards the star by about its height times the cotangent of the star altitude.',
];

const maps = new WeakMap<PlanningSnapshot, PredictionMap>();

/** Built once per cached prediction (snapshots are frozen and replaced when the event changes). */
export function predictionMapOf(snapshot: PlanningSnapshot): PredictionMap {
  const known = maps.get(snapshot);
  if (known) return known;
  const { prediction, settings } = snapshot;
  const extras = pathMapExtras(snapshot.file, settings, prediction);
  const radiusKm = settings.bodyRadiusKm;
  const limit = (line: 'central' | 'left' | 'right', ring: string | null, offsetKm: number) => ({
    line,
    ring,
    sigma: 0 as const,
    edge: 'limit' as const,
    offsetKm,
  });
  const map: PredictionMap = {
    eventId: snapshot.eventId,
    eventTitle: snapshot.title,
    closestApproachUtc: prediction.closestApproach.timeUtc,
    subsolarPoint: extras.subsolarPoint,
    sigmaCrossTrackKm: extras.sigmaCrossTrackKm,
    lines: [
      { ...limit('central', null, 0), points: prediction.centralLine },
      { ...limit('left', null, radiusKm), points: prediction.limits.left },
      { ...limit('right', null, -radiusKm), points: prediction.limits.right },
      ...prediction.rings.flatMap((r) => {
        const radius = settings.rings.find((s) => s.ring === r.ring)?.radiusKm ?? 0;
        return [
          { ...limit('left', r.ring, radius), points: r.left },
          { ...limit('right', r.ring, -radius), points: r.right },
        ];
      }),
      ...extras.bands.map((b) => ({
        line: b.line,
        ring: null,
        sigma: b.sigma,
        edge: b.edge,
        offsetKm: b.offsetKm,
        points: b.points,
      })),
    ],
    ticks: extras.ticks.map((t) => ({
      timeUtc: t.timeUtc,
      latDeg: t.latDeg,
      lonDeg: t.lonDeg,
      label: `${t.timeUtc.slice(11, 16)} UTC`,
    })),
    stations: snapshot.stations.map((s, i) => {
      const predicted = prediction.stations[i];
      if (predicted?.station !== s.code) throw new Error(`prediction out of step with station ${s.code}`);
      return {
        stationId: s.id,
        code: s.code,
        status: s.status,
        latDeg: s.latDeg,
        lonDeg: s.lonDeg,
        outlook: stationOutlook(predicted),
      };
    }),
    cautions: PATH_CAUTIONS,
  };
  maps.set(snapshot, map);
  return map;
}

/**
 * A line's points cut where it leaves the ground or the star sets (a gap of more than one grid step
 * between neighbouring times), so that no drawing joins two separate stretches across the gap.
 */
export function pathParts<P extends { timeUtc: string }>(points: readonly P[], stepSeconds: number): P[][] {
  const parts: P[][] = [];
  let previousMs = Number.NaN;
  for (const p of points) {
    const ms = Date.parse(p.timeUtc);
    if (parts.length === 0 || !(ms - previousMs <= stepSeconds * 1500)) parts.push([]);
    (parts.at(-1) as P[]).push(p);
    previousMs = ms;
  }
  return parts;
}
