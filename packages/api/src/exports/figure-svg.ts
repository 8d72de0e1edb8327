// The sky-plane figure of one fit as an SVG document, for papers: sizes in millimetres, text in points,
// Lato, +f (east) to the LEFT and g (north) up as seen on the sky. The PDF and PNG exports draw this same
// SVG, so the three formats show one figure.
import {
  ellipseOutline,
  type LimbEllipse,
  type RingSolution,
  type SkyPointKm,
  type Solution,
} from '@limbus/geometry';
import { FIGURE_FONT_FAMILY, latoFontFaceCss } from './fonts';
import { type Provenance, provenanceEntries, provenanceLine } from './provenance';
import { escapeXml as esc, svgNumber as n } from './svg-text';

/** Okabe–Ito colours, as in the client's plot (packages/web/src/features/sky-plane/palette.ts cites the source). */
const COLOUR = {
  positive: '#0072B2',
  negative: '#D55E00',
  limb: '#000000',
  band: '#56B4E9',
  ring: '#CC79A7',
  crossing: '#E69F00',
  centre: '#009E73',
  axis: '#3b4a4f',
} as const;

export const PT_PER_MM = 72 / 25.4;
const FONT_PT = 7;
const TICK_FONT_PT = 6.5;
const CAPTION_FONT_PT = 6.5;
const FOOTER_FONT_PT = 5;
const MARGIN_PT = { top: 8, right: 8, bottom: 26, left: 34 };
const OUTLINE_POINTS = 180;
const BAND_DIRECTIONS = 180;

export interface FitFigureInput {
  solution: Solution;
  caption: string;
  provenance: Provenance;
  widthMm: number;
  /** Inline the WOFF2 font; off for the rasteriser and PDF writer, which load Lato themselves. */
  embedFont: boolean;
  /**
   * Unit of the root width and height: millimetres for people and the rasteriser; points for the PDF
   * writer, which reads unit-less sizes as points but millimetres at 96 px per inch.
   */
  sizeUnit: 'mm' | 'pt';
}

export interface SvgFigure {
  svg: string;
  widthPt: number;
  heightPt: number;
}

/** 1, 2 or 5 times a power of ten, the usual "nice" axis steps (common practice, no source). */
export function niceStep(roughStep: number): number {
  const power = 10 ** Math.floor(Math.log10(roughStep));
  const m = roughStep / power;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * power;
}

function ringEllipse(ring: RingSolution): LimbEllipse {
  // A circle of radius R seen at opening angle B is an ellipse with semi-axes R and R·|sin B|, the
  // semi-minor axis at the ring's position angle (the same convention as the limb ellipse).
  return {
    centerFKm: ring.centerFKm,
    centerGKm: ring.centerGKm,
    equatorialRadiusKm: ring.radiusKm,
    oblateness: 1 - Math.abs(Math.sin((ring.openingAngleDeg * Math.PI) / 180)),
    positionAngleDeg: ring.positionAngleDeg,
  };
}

/** Distance from `origin` (inside the ellipse) to its edge along position angle `paRad`; null if outside. */
function rayToEllipseKm(origin: SkyPointKm, paRad: number, e: LimbEllipse): number | null {
  const p = (e.positionAngleDeg * Math.PI) / 180;
  const a = e.equatorialRadiusKm;
  const b = a * (1 - e.oblateness);
  // Ellipse frame: w along the semi-minor axis (position angle P), u along the semi-major axis.
  const sinP = Math.sin(p);
  const cosP = Math.cos(p);
  const df = origin.fKm - e.centerFKm;
  const dg = origin.gKm - e.centerGKm;
  const dirF = Math.sin(paRad);
  const dirG = Math.cos(paRad);
  const u0 = df * cosP - dg * sinP;
  const w0 = df * sinP + dg * cosP;
  const du = dirF * cosP - dirG * sinP;
  const dw = dirF * sinP + dirG * cosP;
  const qa = (du * du) / (a * a) + (dw * dw) / (b * b);
  const qb = 2 * ((u0 * du) / (a * a) + (w0 * dw) / (b * b));
  const qc = (u0 * u0) / (a * a) + (w0 * w0) / (b * b) - 1;
  if (!(qc < 0) || !(qa > 0)) return null;
  return (-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
}

/** Inner and outer edge, direction by direction from the fitted centre, of the sampled 1-sigma ellipses. */
function bandEnvelope(
  centre: SkyPointKm,
  samples: LimbEllipse[],
): { inner: SkyPointKm[]; outer: SkyPointKm[] } | null {
  const inner: SkyPointKm[] = [];
  const outer: SkyPointKm[] = [];
  for (let i = 0; i < BAND_DIRECTIONS; i++) {
    const pa = (2 * Math.PI * i) / BAND_DIRECTIONS;
    let lo = Infinity;
    let hi = -Infinity;
    for (const s of samples) {
      const r = rayToEllipseKm(centre, pa, s);
      if (r === null) continue;
      lo = Math.min(lo, r);
      hi = Math.max(hi, r);
    }
    if (!Number.isFinite(lo)) return null;
    inner.push({ fKm: centre.fKm + lo * Math.sin(pa), gKm: centre.gKm + lo * Math.cos(pa) });
    outer.push({ fKm: centre.fKm + hi * Math.sin(pa), gKm: centre.gKm + hi * Math.cos(pa) });
  }
  return { inner, outer };
}

/** Greedy line breaking by an average Lato advance of 0.47 em per character (measured loosely; errs wide). */
export function wrapText(text: string, widthPt: number, fontPt: number): string[] {
  const maxChars = Math.max(10, Math.floor(widthPt / (0.47 * fontPt)));
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line === '') line = word;
    else if (line.length + 1 + word.length <= maxChars) line += ' ' + word;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line !== '') lines.push(line);
  return lines;
}

function extentKm(solution: Solution): { fMin: number; fMax: number; gMin: number; gMax: number } {
  const pts: SkyPointKm[] = [];
  for (const c of solution.chords) pts.push(...c.points, ...(c.type === 'negative' ? [] : c.path));
  if (solution.limb !== null) pts.push(...ellipseOutline(solution.limb, 72));
  for (const r of solution.rings) pts.push(...ellipseOutline(ringEllipse(r), 72));
  // Negative chords run far past the body; they set the extent only when nothing else does.
  if (pts.length === 0) for (const c of solution.chords) pts.push(...c.path);
  if (pts.length === 0) pts.push({ fKm: -1, gKm: -1 }, { fKm: 1, gKm: 1 });
  const fs = pts.map((p) => p.fKm);
  const gs = pts.map((p) => p.gKm);
  return { fMin: Math.min(...fs), fMax: Math.max(...fs), gMin: Math.min(...gs), gMax: Math.max(...gs) };
}

export function renderFitFigureSvg(input: FitFigureInput): SvgFigure {
  const { solution, provenance } = input;
  const widthPt = input.widthMm * PT_PER_MM;
  const plotPt = widthPt - MARGIN_PT.left - MARGIN_PT.right;
  const left = MARGIN_PT.left;
  const top = MARGIN_PT.top;

  // One km scale on both axes, square plot, 8 % padding around the drawn shapes.
  const ext = extentKm(solution);
  const spanKm = Math.max(ext.fMax - ext.fMin, ext.gMax - ext.gMin) * 1.16 || 2;
  const fMid = (ext.fMax + ext.fMin) / 2;
  const gMid = (ext.gMax + ext.gMin) / 2;
  const fHi = fMid + spanKm / 2;
  const gHi = gMid + spanKm / 2;
  const ptPerKm = plotPt / spanKm;
  // +f to the left: x grows as f falls.
  const x = (fKm: number): number => left + (fHi - fKm) * ptPerKm;
  const y = (gKm: number): number => top + (gHi - gKm) * ptPerKm;
  const pathOf = (pts: SkyPointKm[], closed: boolean): string =>
    pts.map((p, i) => `${i === 0 ? 'M' : 'L'}${n(x(p.fKm))},${n(y(p.gKm))}`).join('') + (closed ? 'Z' : '');
  const body: string[] = [];
  const clip = `<clipPath id="plot-area"><rect x="${n(left)}" y="${n(top)}" width="${n(plotPt)}" height="${n(plotPt)}"/></clipPath>`;

  // Axes and ticks.
  const step = niceStep(spanKm / 5);
  const ticks: string[] = [];
  for (let v = Math.ceil((fHi - spanKm) / step) * step; v <= fHi + 1e-9; v += step) {
    const px = x(v);
    ticks.push(
      `<line x1="${n(px)}" y1="${n(top + plotPt)}" x2="${n(px)}" y2="${n(top + plotPt + 3)}"/>` +
        `<text stroke="none" x="${n(px)}" y="${n(top + plotPt + 3 + TICK_FONT_PT)}" text-anchor="middle" font-size="${TICK_FONT_PT}">${n(v)}</text>`,
    );
  }
  for (let v = Math.ceil((gHi - spanKm) / step) * step; v <= gHi + 1e-9; v += step) {
    const py = y(v);
    ticks.push(
      `<line x1="${n(left - 3)}" y1="${n(py)}" x2="${n(left)}" y2="${n(py)}"/>` +
        `<text stroke="none" x="${n(left - 4.5)}" y="${n(py + TICK_FONT_PT * 0.35)}" text-anchor="end" font-size="${TICK_FONT_PT}">${n(v)}</text>`,
    );
  }
  body.push(
    `<g data-role="axes" stroke="${COLOUR.axis}" stroke-width="0.5" fill="${COLOUR.axis}">` +
      `<rect x="${n(left)}" y="${n(top)}" width="${n(plotPt)}" height="${n(plotPt)}" fill="none"/>` +
      ticks.join('') +
      `<text stroke="none" x="${n(left + plotPt / 2)}" y="${n(top + plotPt + 20)}" text-anchor="middle" font-size="${FONT_PT}">f (km)</text>` +
      `<text stroke="none" transform="translate(${n(left - 24)},${n(top + plotPt / 2)}) rotate(-90)" text-anchor="middle" font-size="${FONT_PT}">g (km)</text>` +
      '</g>',
  );

  const plot: string[] = [];
  const limb = solution.limb;
  if (limb !== null) {
    const env = bandEnvelope({ fKm: limb.centerFKm, gKm: limb.centerGKm }, limb.band);
    if (env !== null)
      plot.push(
        `<path data-role="band" fill="${COLOUR.band}" fill-opacity="0.35" fill-rule="evenodd" stroke="none" d="${pathOf(env.outer, true)}${pathOf([...env.inner].reverse(), true)}"/>`,
      );
    plot.push(
      `<path data-role="limb" fill="none" stroke="${COLOUR.limb}" stroke-width="0.8" d="${pathOf(ellipseOutline(limb, OUTLINE_POINTS), true)}"/>`,
    );
  }
  for (const ring of solution.rings)
    plot.push(
      `<path data-ring="${esc(ring.ring)}" fill="none" stroke="${COLOUR.ring}" stroke-width="0.7" stroke-dasharray="3 1.2" d="${pathOf(ellipseOutline(ringEllipse(ring), OUTLINE_POINTS), true)}"/>`,
    );
  for (const chord of solution.chords) {
    const station = esc(chord.station);
    if (chord.type === 'negative') {
      plot.push(
        `<g data-chord="${station}" data-type="negative"><path fill="none" stroke="${COLOUR.negative}" stroke-width="0.6" stroke-dasharray="2.5 1.5" d="${pathOf(chord.path, false)}"/></g>`,
      );
      continue;
    }
    const v = chord.velocityKmPerS;
    const speed = Math.hypot(v.f, v.g) || 1;
    const parts: string[] = [];
    if (chord.points.length >= 2)
      parts.push(`<path fill="none" stroke-width="0.7" d="${pathOf(chord.points, false)}"/>`);
    for (const p of chord.points) {
      // Timing errors move the point along the chord, so the error bar lies along the velocity.
      const a = { fKm: p.fKm - (v.f / speed) * p.sigmaKm, gKm: p.gKm - (v.g / speed) * p.sigmaKm };
      const b = { fKm: p.fKm + (v.f / speed) * p.sigmaKm, gKm: p.gKm + (v.g / speed) * p.sigmaKm };
      parts.push(
        `<path data-event="${p.event}" stroke-width="1.4" stroke-opacity="0.55" fill="none" d="${pathOf([a, b], false)}"/>` +
          `<circle cx="${n(x(p.fKm))}" cy="${n(y(p.gKm))}" r="0.9" stroke="none"/>`,
      );
    }
    plot.push(
      `<g data-chord="${station}" data-type="positive" stroke="${COLOUR.positive}" fill="${COLOUR.positive}">${parts.join('')}</g>`,
    );
  }
  for (const ring of solution.rings)
    for (const c of ring.crossings)
      plot.push(
        `<rect data-crossing="${esc(c.station)}" x="${n(x(c.fKm) - 1.2)}" y="${n(y(c.gKm) - 1.2)}" width="2.4" height="2.4" fill="${COLOUR.crossing}" stroke="none"/>`,
      );
  if (limb !== null) {
    const cx = x(limb.centerFKm);
    const cy = y(limb.centerGKm);
    plot.push(
      `<path data-role="centre" stroke="${COLOUR.centre}" stroke-width="0.7" d="M${n(cx - 3)},${n(cy)}H${n(cx + 3)}M${n(cx)},${n(cy - 3)}V${n(cy + 3)}"/>`,
    );
  }
  body.push(`<g clip-path="url(#plot-area)">${plot.join('')}</g>`);

  // North/east indicator, top right inside the plot: north up, east to the left.
  const cx = left + plotPt - 10;
  const cy = top + 18;
  body.push(
    `<g data-role="compass" stroke="${COLOUR.axis}" stroke-width="0.6" fill="${COLOUR.axis}" font-size="${FONT_PT}">` +
      `<path fill="none" d="M${n(cx)},${n(cy)}V${n(cy - 10)}M${n(cx)},${n(cy)}H${n(cx - 10)}"/>` +
      `<text stroke="none" x="${n(cx)}" y="${n(cy - 11.5)}" text-anchor="middle">N</text>` +
      `<text stroke="none" x="${n(cx - 12)}" y="${n(cy + FONT_PT * 0.35)}" text-anchor="end">E</text></g>`,
  );

  // Scale bar, bottom left inside the plot, a nice length near a quarter of the span.
  const barKm = niceStep(spanKm / 4);
  const bx = left + 6;
  const by = top + plotPt - 6;
  body.push(
    `<g data-role="scale-bar" stroke="${COLOUR.axis}" fill="${COLOUR.axis}" font-size="${TICK_FONT_PT}">` +
      `<path fill="none" stroke-width="0.8" d="M${n(bx)},${n(by - 2)}V${n(by)}H${n(bx + barKm * ptPerKm)}V${n(by - 2)}"/>` +
      `<text stroke="none" x="${n(bx + (barKm * ptPerKm) / 2)}" y="${n(by - 3)}" text-anchor="middle">${n(barKm)} km</text></g>`,
  );

  // Legend below the axes: the entries that this figure actually draws, flowed into rows.
  const entries: Array<{ label: string; swatch: string }> = [];
  const line = (colour: string, dash: string, w: number): string =>
    `<path d="M0,0H12" stroke="${colour}" stroke-width="${w}"${dash === '' ? '' : ` stroke-dasharray="${dash}"`}/>`;
  if (limb !== null) {
    entries.push({ label: 'Limb fit', swatch: line(COLOUR.limb, '', 0.8) });
    entries.push({
      label: 'Limb 1-sigma band',
      swatch: `<rect x="0" y="-2.5" width="12" height="5" fill="${COLOUR.band}" fill-opacity="0.35"/>`,
    });
    entries.push({
      label: 'Limb centre',
      swatch: `<path d="M3,0H9M6,-3V3" stroke="${COLOUR.centre}" stroke-width="0.7"/>`,
    });
  }
  if (solution.chords.some((c) => c.type === 'positive'))
    entries.push({ label: 'Positive chord (1-sigma error bars)', swatch: line(COLOUR.positive, '', 0.7) });
  if (solution.chords.some((c) => c.type === 'negative'))
    entries.push({ label: 'Negative chord', swatch: line(COLOUR.negative, '2.5 1.5', 0.6) });
  for (const ring of solution.rings)
    entries.push({ label: `Ring ${ring.ring}`, swatch: line(COLOUR.ring, '3 1.2', 0.7) });
  if (solution.rings.some((r) => r.crossings.length > 0))
    entries.push({
      label: 'Ring crossing',
      swatch: `<rect x="4.8" y="-1.2" width="2.4" height="2.4" fill="${COLOUR.crossing}"/>`,
    });
  const legendTop = top + plotPt + MARGIN_PT.bottom + 2;
  const rowPt = FONT_PT * 1.5;
  const legend: string[] = [];
  let lx = left;
  let row = 0;
  for (const e of entries) {
    const w = 16 + e.label.length * 0.5 * FONT_PT + 8;
    if (lx + w > widthPt - MARGIN_PT.right && lx > left) {
      lx = left;
      row++;
    }
    const ly = legendTop + row * rowPt;
    legend.push(
      `<g transform="translate(${n(lx)},${n(ly)})">${e.swatch}<text x="16" y="${n(FONT_PT * 0.35)}" font-size="${FONT_PT}" fill="${COLOUR.axis}">${esc(e.label)}</text></g>`,
    );
    lx += w;
  }
  body.push(`<g data-role="legend">${legend.join('')}</g>`);

  const captionTop = legendTop + (entries.length === 0 ? 0 : (row + 1) * rowPt) + 4;
  const captionLines = wrapText(input.caption, widthPt - 2 * 6, CAPTION_FONT_PT);
  const lineStep = CAPTION_FONT_PT * 1.3;
  body.push(
    `<text data-role="caption" x="6" font-size="${CAPTION_FONT_PT}" fill="#000">` +
      captionLines
        .map((l, i) => `<tspan x="6" y="${n(captionTop + i * lineStep + CAPTION_FONT_PT)}">${esc(l)}</tspan>`)
        .join('') +
      '</text>',
  );
  const footerTop = captionTop + captionLines.length * lineStep + 4;
  const footerLines = wrapText(provenanceLine(provenance), widthPt - 12, FOOTER_FONT_PT);
  body.push(
    `<text data-role="provenance" x="6" font-size="${FOOTER_FONT_PT}" fill="#555">` +
      footerLines
        .map(
          (l, i) =>
            `<tspan x="6" y="${n(footerTop + i * FOOTER_FONT_PT * 1.3 + FOOTER_FONT_PT)}">${esc(l)}</tspan>`,
        )
        .join('') +
      '</text>',
  );
  const heightPt = footerTop + footerLines.length * FOOTER_FONT_PT * 1.3 + 4;
  const heightMm = heightPt / PT_PER_MM;

  const meta = provenanceEntries(provenance)
    .map(([k, v]) => ` ${k}="${esc(v)}"`)
    .join('');
  const size =
    input.sizeUnit === 'mm'
      ? `width="${n(input.widthMm)}mm" height="${n(heightMm)}mm"`
      : `width="${n(widthPt)}" height="${n(heightPt)}"`;
  const style = input.embedFont ? `<style>${latoFontFaceCss()}</style>` : '';
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<!-- ${esc(provenanceLine(provenance)).replace(/--/g, '- -')} -->\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" ${size} ` +
    `viewBox="0 0 ${n(widthPt)} ${n(heightPt)}" font-family="${FIGURE_FONT_FAMILY}, sans-serif">` +
    `<title>Sky-plane solution</title><desc>${esc(input.caption)}</desc>` +
    `<metadata><limbus:provenance xmlns:limbus="urn:limbus:provenance"${meta}/></metadata>` +
    `<defs>${style}${clip}</defs>` +
    `<rect width="${n(widthPt)}" height="${n(heightPt)}" fill="#fff"/>` +
    body.join('') +
    '</svg>\n';
  return { svg, widthPt, heightPt };
}
