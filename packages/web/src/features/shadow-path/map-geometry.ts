// The shadow-path map's lines, bands and night side as GeoJSON in degrees, made from the server's one
// description of the map (`GET /api/events/:eventId/prediction/map`, which the SVG/PNG/PDF figure and the
// GeoJSON/KML files draw too). D3 projects them; nothing here knows about pixels.
import type { PathPoint } from '@limbus/schema/planning';
import { geoArea, geoCircle } from 'd3';
import type { Feature, MultiLineString, Polygon, Position } from 'geojson';

/** Longitude wrapped into [−180, 180). */
export function wrapLonDeg(lonDeg: number): number {
  return ((((lonDeg + 180) % 360) + 360) % 360) - 180;
}

/**
 * The part of the Earth where the Sun's centre is more than `belowDeg` below the horizon: a spherical
 * cap of radius 90° − belowDeg around the antisolar point (the Earth taken as a sphere, enough to draw).
 */
export function nightCap(subsolar: { latDeg: number; lonDeg: number }, belowDeg = 0): Polygon {
  return geoCircle()
    .center([wrapLonDeg(subsolar.lonDeg + 180), -subsolar.latDeg])
    .radius(90 - belowDeg)
    .precision(1)();
}

/**
 * The grid step of a line in milliseconds (the smallest gap between its points), so that a larger gap
 * reads as the shadow having left the Earth, or the star having set, there.
 */
function gridStepMs(points: readonly PathPoint[]): number {
  let step = Number.POSITIVE_INFINITY;
  for (let i = 1; i < points.length; i++) {
    const gap = Date.parse(points[i]?.timeUtc ?? '') - Date.parse(points[i - 1]?.timeUtc ?? '');
    if (gap > 0 && gap < step) step = gap;
  }
  return step;
}

/** A path line as runs of consecutive grid points: the prediction lists only the points that exist. */
export function lineRuns(points: readonly PathPoint[]): PathPoint[][] {
  const step = gridStepMs(points);
  const runs: PathPoint[][] = [];
  let run: PathPoint[] = [];
  let lastMs = Number.NaN;
  for (const p of points) {
    const ms = Date.parse(p.timeUtc);
    if (run.length > 0 && ms - lastMs > 1.5 * step) {
      runs.push(run);
      run = [];
    }
    run.push(p);
    lastMs = ms;
  }
  if (run.length > 0) runs.push(run);
  return runs;
}

const position = (p: PathPoint): Position => [p.lonDeg, p.latDeg];

/** A line as GeoJSON; d3-geo draws it along great circles and cuts it at the map's edge. */
export function lineFeature(points: readonly PathPoint[]): Feature<MultiLineString> {
  return {
    type: 'Feature',
    properties: {},
    geometry: {
      type: 'MultiLineString',
      // A run of a single point draws nothing.
      coordinates: lineRuns(points)
        .filter((run) => run.length > 1)
        .map((run) => run.map(position)),
    },
  };
}

/**
 * The band between two edge lines of the path (R − kσ and R + kσ on one side), as one polygon per run of
 * grid times at which both edges have a point. Each ring is wound so that its inside is the band: d3-geo
 * reads a spherical ring's inside from its winding, and the wrong one would fill the rest of the globe.
 */
export function bandPolygons(inner: readonly PathPoint[], outer: readonly PathPoint[]): Polygon[] {
  const outerAt = new Map(outer.map((p) => [Date.parse(p.timeUtc), p]));
  const step = Math.min(gridStepMs(inner), gridStepMs(outer));
  const polygons: Polygon[] = [];
  let near: Position[] = [];
  let far: Position[] = [];
  let lastMs = Number.NaN;
  const flush = () => {
    if (near.length >= 2) {
      const ring = [...near, ...[...far].reverse(), near[0] as Position];
      const polygon: Polygon = { type: 'Polygon', coordinates: [ring] };
      polygons.push(
        geoArea(polygon) > 2 * Math.PI ? { type: 'Polygon', coordinates: [[...ring].reverse()] } : polygon,
      );
    }
    near = [];
    far = [];
  };
  for (const p of inner) {
    const ms = Date.parse(p.timeUtc);
    const q = outerAt.get(ms);
    if (q === undefined || ms - lastMs > 1.5 * step) flush();
    if (q !== undefined) {
      near.push(position(p));
      far.push(position(q));
      lastMs = ms;
    }
  }
  flush();
  return polygons;
}

/** Everything the map frames at first: the given lines and the stations. */
export function framingFeature(
  lines: ReadonlyArray<readonly PathPoint[]>,
  stations: ReadonlyArray<{ latDeg: number; lonDeg: number }>,
): Feature<MultiLineString> | null {
  const coordinates = lines.flatMap((line) =>
    lineRuns(line)
      .filter((run) => run.length > 1)
      .map((run) => run.map(position)),
  );
  // A station frames as a vanishing segment, so lines and points share one feature.
  for (const s of stations)
    coordinates.push([
      [s.lonDeg, s.latDeg],
      [s.lonDeg + 1e-6, s.latDeg],
    ]);
  if (coordinates.length === 0) return null;
  return { type: 'Feature', properties: {}, geometry: { type: 'MultiLineString', coordinates } };
}
