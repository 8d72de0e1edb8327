// The shadow-path map as an SVG document, for the SVG, PNG and PDF downloads (the PNG and PDF draw this
// same SVG through exports/raster.ts). The Earth is drawn with d3-geo from Natural Earth (world-atlas,
// 1:50m, public domain) in an orthographic view centred on the path; graticule every 10°; the night side
// at closest approach shaded (the hemisphere away from the point under the Sun); the lines, ticks and
// station markers of the map description (prediction-map.ts). Sizes in points, text in Lato.
import { readFileSync } from 'node:fs';
import type {
  Feature,
  FeatureCollection,
  GeoJsonProperties,
  Geometry,
  LineString,
  MultiPolygon,
  Point,
} from 'geojson';
import { geoCircle, geoGraticule10, geoOrthographic, geoPath, type GeoProjection } from 'd3-geo';
import { feature, mesh } from 'topojson-client';
import { type PredictionMap, STATION_OUTLOOK_LABELS, type StationOutlook } from '@limbus/schema';
import { FIGURE_FONT_FAMILY, latoFontFaceCss } from '../exports/fonts';
import { PT_PER_MM, wrapText } from '../exports/figure-svg';
import type { FigureMeta } from '../exports/raster';
import { escapeXml as esc, svgNumber as n } from '../exports/svg-text';
import { pathParts } from './prediction-map';

/** Okabe–Ito colours, as the sky-plane figure (exports/figure-svg.ts) and the client's map. */
const COLOUR = {
  ocean: '#eef4f8',
  land: '#e3e0d6',
  border: '#b9b4a6',
  graticule: '#c9d3da',
  night: '#1b2a3a',
  central: '#000000',
  limit: '#0072B2',
  band: '#56B4E9',
  ring: '#CC79A7',
  tick: '#000000',
  text: '#3b4a4f',
  inside: '#0072B2',
  ringOnly: '#CC79A7',
  outside: '#7a7a7a',
  starDown: '#D55E00',
  sunUp: '#E69F00',
} as const;

const FONT_PT = 7;
const TITLE_PT = 8;
const SMALL_PT = 5.5;
const MARGIN_PT = 6;

export interface MapFigureInput {
  map: PredictionMap;
  stepSeconds: number;
  widthMm: number;
  embedFont: boolean;
  sizeUnit: 'mm' | 'pt';
  meta: FigureMeta;
}

export interface SvgMap {
  svg: string;
  widthPt: number;
  heightPt: number;
}

interface World {
  land: Feature<MultiPolygon>;
  borders: Geometry;
}

let world: World | null = null;

/** Natural Earth land and country borders at 1:50m, read once per process. */
function naturalEarth(): World {
  if (world === null) {
    // The topology's types come with topojson-client's (topojson-specification), read through its API.
    const topology = JSON.parse(
      readFileSync(require.resolve('world-atlas/countries-50m.json'), 'utf8'),
    ) as Parameters<typeof mesh>[0];
    const objects = topology.objects as Record<'countries' | 'land', NonNullable<Parameters<typeof mesh>[1]>>;
    world = {
      land: feature(topology, objects.land) as unknown as Feature<MultiPolygon>,
      borders: mesh(topology, objects.countries, (a, b) => a !== b),
    };
  }
  return world;
}

const MARKER_COLOUR: Record<StationOutlook, string> = {
  inside: COLOUR.inside,
  'ring-only': COLOUR.ringOnly,
  outside: COLOUR.outside,
  'star-down': COLOUR.starDown,
  'sun-up': COLOUR.sunUp,
};

/** A marker shape per outlook, so the map reads without colour too; planned and proposed are hollow. */
function marker(outlook: StationOutlook, x: number, y: number, hollow: boolean, dashed: boolean): string {
  const colour = MARKER_COLOUR[outlook];
  const fill = hollow ? '#ffffff' : colour;
  const stroke = `stroke="${colour}" stroke-width="0.8"${dashed ? ' stroke-dasharray="1 0.8"' : ''}`;
  const r = 2.4;
  switch (outlook) {
    case 'inside':
      return `<circle cx="${n(x)}" cy="${n(y)}" r="${r}" fill="${fill}" ${stroke}/>`;
    case 'ring-only':
      return `<path d="M${n(x)},${n(y - r * 1.2)}L${n(x + r * 1.2)},${n(y)}L${n(x)},${n(y + r * 1.2)}L${n(x - r * 1.2)},${n(y)}Z" fill="${fill}" ${stroke}/>`;
    case 'outside':
      return `<circle cx="${n(x)}" cy="${n(y)}" r="${r}" fill="#ffffff" ${stroke}/><path d="M${n(x - 1)},${n(y)}H${n(x + 1)}" ${stroke}/>`;
    case 'star-down':
      return `<path d="M${n(x - r)},${n(y - r)}L${n(x + r)},${n(y + r)}M${n(x - r)},${n(y + r)}L${n(x + r)},${n(y - r)}" fill="none" ${stroke}/>`;
    case 'sun-up':
      return `<path d="M${n(x)},${n(y - r * 1.2)}L${n(x + r * 1.1)},${n(y + r * 0.8)}L${n(x - r * 1.1)},${n(y + r * 0.8)}Z" fill="${fill}" ${stroke}/>`;
  }
}

function lineStyle(line: PredictionMap['lines'][number]): string {
  if (line.line === 'central') return `stroke="${COLOUR.central}" stroke-width="0.9"`;
  if (line.ring !== null) return `stroke="${COLOUR.ring}" stroke-width="0.8" stroke-dasharray="3 1.2"`;
  if (line.edge === 'limit') return `stroke="${COLOUR.limit}" stroke-width="0.9"`;
  return `stroke="${COLOUR.band}" stroke-width="${line.sigma === 1 ? 0.7 : 0.5}" stroke-dasharray="${line.sigma === 1 ? '2 1' : '0.8 1.2'}"`;
}

/** The view: orthographic, centred on the middle of the central line (else on the stations, else 0°, 0°). */
function projectionFor(
  map: PredictionMap,
  lines: Feature<LineString>[],
  extent: [[number, number], [number, number]],
): GeoProjection {
  const central = map.lines.find((l) => l.line === 'central')?.points ?? [];
  const middle = central[Math.floor(central.length / 2)] ?? map.stations[0] ?? { latDeg: 0, lonDeg: 0 };
  const projection = geoOrthographic().rotate([-middle.lonDeg, -middle.latDeg]).clipAngle(90);
  const stations: Feature<Point>[] = map.stations.map((s) => ({
    type: 'Feature',
    properties: {},
    geometry: { type: 'Point', coordinates: [s.lonDeg, s.latDeg] },
  }));
  const all: FeatureCollection<Geometry, GeoJsonProperties> = {
    type: 'FeatureCollection',
    features: [...lines, ...stations],
  };
  if (all.features.length === 0) return projection.fitExtent(extent, { type: 'Sphere' });
  projection.fitExtent(extent, all);
  // Show some ground beyond the lines, and never zoom in closer than about 1500 km across: zoom out about
  // the extent's centre, where fitExtent put the middle of the features.
  const fitted = projection.scale();
  const widthPt = extent[1][0] - extent[0][0];
  const k = Math.min(0.85, (widthPt * (6371 / 1500)) / fitted);
  const [tx, ty] = projection.translate();
  const cx = (extent[0][0] + extent[1][0]) / 2;
  const cy = (extent[0][1] + extent[1][1]) / 2;
  return projection.scale(fitted * k).translate([cx + (tx - cx) * k, cy + (ty - cy) * k]);
}

export function renderPathMapSvg(input: MapFigureInput): SvgMap {
  const { map } = input;
  const widthPt = input.widthMm * PT_PER_MM;
  const left = MARGIN_PT;
  const top = MARGIN_PT + TITLE_PT * 1.6;
  const plotW = widthPt - 2 * MARGIN_PT;
  const plotH = plotW * 0.72;
  const lineFeatures = map.lines.flatMap((line) =>
    pathParts(line.points, input.stepSeconds)
      .filter((part) => part.length >= 2)
      .map((part): Feature<LineString> => ({
        type: 'Feature',
        properties: {},
        geometry: { type: 'LineString', coordinates: part.map((p) => [p.lonDeg, p.latDeg]) },
      })),
  );
  const projection = projectionFor(map, lineFeatures, [
    [left + 4, top + 4],
    [left + plotW - 4, top + plotH - 4],
  ]);
  const path = geoPath(projection);
  const d = (object: Parameters<typeof path>[0]) => path(object) ?? '';
  const { land, borders } = naturalEarth();
  const antisolar: [number, number] = [
    map.subsolarPoint.lonDeg > 0 ? map.subsolarPoint.lonDeg - 180 : map.subsolarPoint.lonDeg + 180,
    -map.subsolarPoint.latDeg,
  ];
  const body: string[] = [];
  const clip = `<clipPath id="map-area"><rect x="${n(left)}" y="${n(top)}" width="${n(plotW)}" height="${n(plotH)}"/></clipPath>`;
  const plot: string[] = [
    `<path data-role="sphere" fill="${COLOUR.ocean}" stroke="${COLOUR.graticule}" stroke-width="0.5" d="${d({ type: 'Sphere' })}"/>`,
    `<path data-role="land" fill="${COLOUR.land}" stroke="none" d="${d(land)}"/>`,
    `<path data-role="borders" fill="none" stroke="${COLOUR.border}" stroke-width="0.3" d="${d(borders)}"/>`,
    `<path data-role="graticule" fill="none" stroke="${COLOUR.graticule}" stroke-width="0.25" d="${d(geoGraticule10())}"/>`,
    `<path data-role="night" fill="${COLOUR.night}" fill-opacity="0.22" stroke="none" d="${d(geoCircle().center(antisolar).radius(90)())}"/>`,
  ];
  // Bands under limits under the central line, so the line that matters most is on top.
  const order = (l: PredictionMap['lines'][number]) =>
    l.sigma > 0 ? 0 : l.ring !== null ? 1 : l.line === 'central' ? 3 : 2;
  for (const line of [...map.lines].sort((a, b) => order(a) - order(b))) {
    const parts = pathParts(line.points, input.stepSeconds).filter((p) => p.length >= 2);
    if (parts.length === 0) continue;
    const geometry = {
      type: 'MultiLineString' as const,
      coordinates: parts.map((part) => part.map((p) => [p.lonDeg, p.latDeg])),
    };
    plot.push(
      `<path data-path-line="${line.line}"${line.ring === null ? '' : ` data-ring="${esc(line.ring)}"`} data-sigma="${line.sigma}" fill="none" ${lineStyle(line)} d="${d(geometry)}"/>`,
    );
  }
  for (const tick of map.ticks) {
    const xy = projection([tick.lonDeg, tick.latDeg]);
    if (xy === null) continue;
    plot.push(
      `<g data-role="tick"><circle cx="${n(xy[0])}" cy="${n(xy[1])}" r="1" fill="${COLOUR.tick}"/>` +
        `<text x="${n(xy[0] + 2)}" y="${n(xy[1] - 1.5)}" font-size="${SMALL_PT}" fill="${COLOUR.text}">${esc(tick.label.slice(0, 5))}</text></g>`,
    );
  }
  for (const s of map.stations) {
    const xy = projection([s.lonDeg, s.latDeg]);
    if (xy === null) continue;
    plot.push(
      `<g data-station="${esc(s.stationId)}" data-outlook="${s.outlook}" data-status="${s.status}">` +
        marker(s.outlook, xy[0], xy[1], s.status !== 'observing', s.status === 'proposed') +
        `<text x="${n(xy[0] + 3.2)}" y="${n(xy[1] + 2)}" font-size="${SMALL_PT}" fill="${COLOUR.text}">${esc(s.code)}</text></g>`,
    );
  }
  body.push(
    `<text x="${n(left)}" y="${n(MARGIN_PT + TITLE_PT)}" font-size="${TITLE_PT}" font-weight="bold" fill="#000">${esc(`Shadow path map: ${map.eventTitle}`)}</text>`,
    `<g clip-path="url(#map-area)">${plot.join('')}</g>`,
    `<rect x="${n(left)}" y="${n(top)}" width="${n(plotW)}" height="${n(plotH)}" fill="none" stroke="${COLOUR.text}" stroke-width="0.5"/>`,
  );

  // Legend: what this map draws, flowed into rows.
  const swatch = (style: string) => `<path d="M0,0H12" fill="none" ${style}/>`;
  const entries: Array<{ label: string; swatch: string }> = [
    { label: 'Central line', swatch: swatch(`stroke="${COLOUR.central}" stroke-width="0.9"`) },
    { label: 'Limits of the body', swatch: swatch(`stroke="${COLOUR.limit}" stroke-width="0.9"`) },
  ];
  if (map.lines.some((l) => l.sigma === 1))
    entries.push({
      label: '1-sigma band edges',
      swatch: swatch(`stroke="${COLOUR.band}" stroke-width="0.7" stroke-dasharray="2 1"`),
    });
  if (map.lines.some((l) => l.sigma === 3))
    entries.push({
      label: '3-sigma band edges',
      swatch: swatch(`stroke="${COLOUR.band}" stroke-width="0.5" stroke-dasharray="0.8 1.2"`),
    });
  if (map.lines.some((l) => l.ring !== null))
    entries.push({
      label: 'Ring limits',
      swatch: swatch(`stroke="${COLOUR.ring}" stroke-width="0.8" stroke-dasharray="3 1.2"`),
    });
  entries.push({
    label: 'Night at closest approach',
    swatch: `<rect x="0" y="-2.5" width="12" height="5" fill="${COLOUR.night}" fill-opacity="0.22"/>`,
  });
  for (const outlook of Object.keys(STATION_OUTLOOK_LABELS) as StationOutlook[])
    if (map.stations.some((s) => s.outlook === outlook))
      entries.push({ label: STATION_OUTLOOK_LABELS[outlook], swatch: marker(outlook, 6, 0, false, false) });
  if (map.stations.some((s) => s.status !== 'observing'))
    entries.push({
      label: 'Planned (hollow), proposed (dashed)',
      swatch: marker('inside', 6, 0, true, true),
    });
  const legendTop = top + plotH + 8;
  const rowPt = FONT_PT * 1.5;
  const legend: string[] = [];
  let lx = left;
  let row = 0;
  for (const e of entries) {
    const w = 16 + e.label.length * 0.5 * FONT_PT + 8;
    if (lx + w > widthPt - MARGIN_PT && lx > left) {
      lx = left;
      row++;
    }
    legend.push(
      `<g transform="translate(${n(lx)},${n(legendTop + row * rowPt)})">${e.swatch}<text x="16" y="${n(FONT_PT * 0.35)}" font-size="${FONT_PT}" fill="${COLOUR.text}">${esc(e.label)}</text></g>`,
    );
    lx += w;
  }
  body.push(`<g data-role="legend">${legend.join('')}</g>`);

  const caption =
    `Closest approach ${map.closestApproachUtc.slice(0, 19).replace('T', ' ')} UTC. ` +
    `Path 1-sigma across the track ±${map.sigmaCrossTrackKm.toFixed(1)} km. Ticks on the central line in UTC. ` +
    map.cautions.join(' ').replace(/σ/g, '-sigma');
  const captionTop = legendTop + (row + 1) * rowPt + 2;
  const captionLines = wrapText(caption, widthPt - 2 * MARGIN_PT, SMALL_PT + 0.5);
  const step = (SMALL_PT + 0.5) * 1.3;
  body.push(
    `<text data-role="caption" font-size="${SMALL_PT + 0.5}" fill="#000">` +
      captionLines
        .map((l, i) => `<tspan x="${n(left)}" y="${n(captionTop + (i + 1) * step)}">${esc(l)}</tspan>`)
        .join('') +
      '</text>',
  );
  const footerTop = captionTop + captionLines.length * step + 3;
  const footerLines = wrapText(
    `${input.meta.line} · Natural Earth (public domain) via world-atlas`,
    widthPt - 2 * MARGIN_PT,
    SMALL_PT - 0.5,
  );
  body.push(
    `<text data-role="provenance" font-size="${SMALL_PT - 0.5}" fill="#555">` +
      footerLines
        .map(
          (l, i) =>
            `<tspan x="${n(left)}" y="${n(footerTop + (i + 1) * (SMALL_PT - 0.5) * 1.3)}">${esc(l)}</tspan>`,
        )
        .join('') +
      '</text>',
  );
  const heightPt = footerTop + footerLines.length * (SMALL_PT - 0.5) * 1.3 + MARGIN_PT;
  const size =
    input.sizeUnit === 'mm'
      ? `width="${n(input.widthMm)}mm" height="${n(heightPt / PT_PER_MM)}mm"`
      : `width="${n(widthPt)}" height="${n(heightPt)}"`;
  const metadata = input.meta.entries.map(([k, v]) => ` ${k}="${esc(v)}"`).join('');
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<!-- ${esc(input.meta.line).replace(/--/g, '- -')} -->\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" ${size} viewBox="0 0 ${n(widthPt)} ${n(heightPt)}" ` +
    `font-family="${FIGURE_FONT_FAMILY}, sans-serif" role="img" aria-label="${esc(`Shadow path map: ${map.eventTitle}`)}">` +
    `<title>${esc(`Shadow path map: ${map.eventTitle}`)}</title><desc>${esc(caption)}</desc>` +
    `<metadata><limbus:provenance xmlns:limbus="urn:limbus:provenance"${metadata}/></metadata>` +
    `<defs>${input.embedFont ? `<style>${latoFontFaceCss()}</style>` : ''}${clip}</defs>` +
    `<rect width="${n(widthPt)}" height="${n(heightPt)}" fill="#fff"/>` +
    body.join('') +
    '</svg>\n';
  return { svg, widthPt, heightPt };
}
