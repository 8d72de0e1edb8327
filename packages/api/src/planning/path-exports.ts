// The shadow path in two open formats, from the map description (prediction-map.ts):
//   GeoJSON, RFC 7946: a FeatureCollection of LineString features, positions [longitude, latitude] in
//   WGS84 degrees (sec. 3.1.1, 4); a line that crosses the ±180° meridian is cut there into two features
//   (sec. 3.1.9), and a line that leaves the ground is cut at the gap. Foreign members (sec. 6.1) name the
//   format of the prediction it came from.
//   KML, OGC 07-147r2 (KML 2.2): a Document with one Style per kind of line and a Placemark per line part,
//   <coordinates> as "lon,lat,0" tuples (sec. 16.9.1), altitudeMode clampToGround, ExtendedData naming the
//   line; parts are cut at ±180° the same way.
import type { PathPoint, PredictionMap } from '@limbus/schema';
import { escapeXml } from '../exports/svg-text';
import { pathParts } from './prediction-map';

type Line = PredictionMap['lines'][number];

/** Positions [lon, lat] of one part, cut where a step crosses ±180° (the crossing interpolated in lon). */
export function splitAtAntimeridian(points: readonly PathPoint[]): Array<Array<[number, number]>> {
  const parts: Array<Array<[number, number]>> = [];
  let current: Array<[number, number]> = [];
  points.forEach((p, i) => {
    const previous = points[i - 1];
    if (previous !== undefined && Math.abs(p.lonDeg - previous.lonDeg) > 180) {
      // Unwrap the step, find where it meets the meridian, close this part there and open the next.
      const east = previous.lonDeg > 0;
      const edge = east ? 180 : -180;
      const unwrapped = p.lonDeg + (east ? 360 : -360);
      const fraction = (edge - previous.lonDeg) / (unwrapped - previous.lonDeg);
      const lat = previous.latDeg + fraction * (p.latDeg - previous.latDeg);
      current.push([edge, lat]);
      parts.push(current);
      current = [[-edge, lat]];
    }
    current.push([p.lonDeg, p.latDeg]);
  });
  if (current.length > 0) parts.push(current);
  return parts.filter((part) => part.length >= 2);
}

/** Each drawable stretch of a line: cut at gaps in time and at ±180°. */
function stretches(
  line: Line,
  stepSeconds: number,
): Array<{ points: PathPoint[]; positions: Array<[number, number]> }> {
  return pathParts(line.points, stepSeconds).flatMap((points) =>
    splitAtAntimeridian(points).map((positions) => ({ points, positions })),
  );
}

function lineName(line: Line): string {
  const side = line.line === 'central' ? 'Central line' : line.line === 'left' ? 'Left' : 'Right';
  if (line.ring !== null) return `${side} limit of ring ${line.ring}`;
  if (line.edge === 'limit') return line.line === 'central' ? side : `${side} limit of the body`;
  return `${side} ${line.sigma}σ band, ${line.edge} edge`;
}

const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;

export function pathGeoJson(map: PredictionMap, stepSeconds: number): string {
  const features = map.lines.flatMap((line) =>
    stretches(line, stepSeconds).map((s, part) => ({
      type: 'Feature' as const,
      properties: {
        name: lineName(line),
        line: line.line,
        ring: line.ring,
        sigma: line.sigma,
        edge: line.edge,
        offsetKm: round(line.offsetKm, 3),
        part,
        fromUtc: s.points[0]?.timeUtc ?? null,
        toUtc: s.points.at(-1)?.timeUtc ?? null,
      },
      geometry: {
        type: 'LineString' as const,
        // 1e-6° is 0.1 m: far below the prediction's accuracy, and keeps the file small.
        coordinates: s.positions.map(([lon, lat]) => [round(lon, 6), round(lat, 6)]),
      },
    })),
  );
  const document = {
    type: 'FeatureCollection',
    limbus: {
      source: 'limbus-prediction/1',
      eventId: map.eventId,
      eventTitle: map.eventTitle,
      closestApproachUtc: map.closestApproachUtc,
      sigmaCrossTrackKm: round(map.sigmaCrossTrackKm, 3),
      cautions: map.cautions,
    },
    features,
  };
  return `${JSON.stringify(document)}\n`;
}

/** Okabe–Ito colours as KML's aabbggrr (figure-svg.ts cites the palette). */
const KML_STYLES: Record<string, { colour: string; widthPx: number }> = {
  central: { colour: 'ff000000', widthPx: 2 },
  limit: { colour: 'ffb27200', widthPx: 2 },
  ring: { colour: 'ffa779cc', widthPx: 2 },
  band1: { colour: 'cce9b456', widthPx: 1 },
  band3: { colour: '99e9b456', widthPx: 1 },
};

function styleOf(line: Line): string {
  if (line.line === 'central') return 'central';
  if (line.ring !== null) return 'ring';
  if (line.edge === 'limit') return 'limit';
  return line.sigma === 1 ? 'band1' : 'band3';
}

export function pathKml(map: PredictionMap, stepSeconds: number): string {
  const styles = Object.entries(KML_STYLES)
    .map(
      ([id, s]) =>
        `<Style id="${id}"><LineStyle><color>${s.colour}</color><width>${s.widthPx}</width></LineStyle></Style>`,
    )
    .join('');
  const placemarks = map.lines.flatMap((line) =>
    stretches(line, stepSeconds).map((s) => {
      const data = [
        ['line', line.line],
        ['ring', line.ring ?? ''],
        ['sigma', String(line.sigma)],
        ['edge', line.edge],
        ['offsetKm', String(round(line.offsetKm, 3))],
        ['fromUtc', s.points[0]?.timeUtc ?? ''],
        ['toUtc', s.points.at(-1)?.timeUtc ?? ''],
      ]
        .map(([k, v]) => `<Data name="${k}"><value>${escapeXml(v ?? '')}</value></Data>`)
        .join('');
      const coordinates = s.positions.map(([lon, lat]) => `${round(lon, 6)},${round(lat, 6)},0`).join(' ');
      return (
        `<Placemark><name>${escapeXml(lineName(line))}</name><styleUrl>#${styleOf(line)}</styleUrl>` +
        `<ExtendedData>${data}</ExtendedData>` +
        `<LineString><tessellate>1</tessellate><altitudeMode>clampToGround</altitudeMode>` +
        `<coordinates>${coordinates}</coordinates></LineString></Placemark>`
      );
    }),
  );
  const description = [
    `Closest approach ${map.closestApproachUtc}; path 1σ ±${round(map.sigmaCrossTrackKm, 1)} km across the track.`,
    ...map.cautions,
  ].join(' ');
  return (
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    '<kml xmlns="http://www.opengis.net/kml/2.2"><Document>' +
    `<name>${escapeXml(`Shadow path: ${map.eventTitle}`)}</name>` +
    `<description>${escapeXml(description)}</description>` +
    styles +
    placemarks.join('') +
    '</Document></kml>\n'
  );
}
