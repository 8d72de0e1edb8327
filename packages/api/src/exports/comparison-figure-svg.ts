// The comparison figure of several fits, for papers: limb and ring ellipses moved to a common centre (km,
// +f east to the left, north up) and the ring's pole candidates on the sky (RA increasing to the left),
// with the joint pole and its 1-sigma region when one is given. Same conventions as ./figure-svg.ts.
import { ellipseOutline, type LimbEllipse, type SkyPointKm } from '@limbus/geometry';
import type { ComparisonFit } from '../comparisons/comparison-view';
import type { ComparisonSelection } from '../comparisons/comparison-schemas';
import type { JointPoleDocument } from '../comparisons/joint-pole';
import { FIGURE_FONT_FAMILY, latoFontFaceCss } from './fonts';
import { niceStep, PT_PER_MM, type SvgFigure, wrapText } from './figure-svg';
import { type Provenance, provenanceEntries, provenanceLine } from './provenance';
import { escapeXml as esc, svgNumber as n } from './svg-text';

/** Okabe–Ito colours, one per fit in table order, as in the client's comparison page. */
const FIT_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];
const AXIS = '#3b4a4f';
const FONT_PT = 7;
const TICK_PT = 6.5;
const CAPTION_PT = 6.5;
const FOOTER_PT = 5;
const PANEL_MARGIN = { top: 14, right: 8, bottom: 26, left: 32 };

export interface ComparisonFigureInput {
  fits: ComparisonFit[];
  ring: string | null;
  joint: JointPoleDocument | null;
  caption: string;
  provenance: Provenance[];
  widthMm: number;
  embedFont: boolean;
  sizeUnit: 'mm' | 'pt';
}

const colour = (i: number): string => FIT_COLOURS[i % FIT_COLOURS.length] ?? '#000000';

/** RA shifted by whole turns to lie within 180° of a reference, so the chart never splits at 0h. */
function unwrap(raDeg: number, refDeg: number): number {
  return raDeg - 360 * Math.round((raDeg - refDeg) / 360);
}

function ticks(lo: number, hi: number, target: number): number[] {
  const step = niceStep((hi - lo) / target);
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9; v += step) out.push(Number(v.toPrecision(10)));
  return out;
}

interface Panel {
  x0: number;
  y0: number;
  size: number;
}

function frame(p: Panel, title: string, xLabel: string, yLabel: string): string {
  return (
    `<rect x="${n(p.x0)}" y="${n(p.y0)}" width="${n(p.size)}" height="${n(p.size)}" fill="none" stroke="${AXIS}" stroke-width="0.5"/>` +
    `<text x="${n(p.x0)}" y="${n(p.y0 - 4)}" font-size="${FONT_PT}" font-weight="700" fill="${AXIS}">${esc(title)}</text>` +
    `<text x="${n(p.x0 + p.size / 2)}" y="${n(p.y0 + p.size + 20)}" text-anchor="middle" font-size="${FONT_PT}" fill="${AXIS}">${esc(xLabel)}</text>` +
    `<text transform="translate(${n(p.x0 - 23)},${n(p.y0 + p.size / 2)}) rotate(-90)" text-anchor="middle" font-size="${FONT_PT}" fill="${AXIS}">${esc(yLabel)}</text>`
  );
}

function axisTicks(
  p: Panel,
  xs: number[],
  x: (v: number) => number,
  ys: number[],
  y: (v: number) => number,
  xText: (v: number) => string,
): string {
  const out: string[] = [];
  for (const v of xs)
    out.push(
      `<line x1="${n(x(v))}" y1="${n(p.y0 + p.size)}" x2="${n(x(v))}" y2="${n(p.y0 + p.size + 3)}" stroke="${AXIS}" stroke-width="0.5"/>` +
        `<text x="${n(x(v))}" y="${n(p.y0 + p.size + 3 + TICK_PT)}" text-anchor="middle" font-size="${TICK_PT}" fill="${AXIS}">${xText(v)}</text>`,
    );
  for (const v of ys)
    out.push(
      `<line x1="${n(p.x0 - 3)}" y1="${n(y(v))}" x2="${n(p.x0)}" y2="${n(y(v))}" stroke="${AXIS}" stroke-width="0.5"/>` +
        `<text x="${n(p.x0 - 4.5)}" y="${n(y(v) + TICK_PT * 0.35)}" text-anchor="end" font-size="${TICK_PT}" fill="${AXIS}">${n(v)}</text>`,
    );
  return out.join('');
}

function overlayPanel(p: Panel, fits: ComparisonFit[]): string {
  const shapes: Array<{ e: LimbEllipse; colour: string; ring: string | null; fitId: string }> = [];
  fits.forEach((fit, i) => {
    if (fit.limb !== null)
      shapes.push({
        fitId: fit.fitId,
        colour: colour(i),
        ring: null,
        e: {
          centerFKm: 0,
          centerGKm: 0,
          equatorialRadiusKm: fit.limb.equatorialRadiusKm.value,
          oblateness: fit.limb.oblateness.value,
          positionAngleDeg: fit.limb.positionAngleDeg.value,
        },
      });
    for (const r of fit.rings)
      // A circle of radius R at opening angle B projects to semi-axes R and R·|sin B|, semi-minor at P.
      shapes.push({
        fitId: fit.fitId,
        colour: colour(i),
        ring: r.ring,
        e: {
          centerFKm: 0,
          centerGKm: 0,
          equatorialRadiusKm: r.radiusKm.value,
          oblateness: 1 - Math.abs(Math.sin((r.openingAngleDeg.value * Math.PI) / 180)),
          positionAngleDeg: r.positionAngleDeg.value,
        },
      });
  });
  const extent = Math.max(1, ...shapes.map((s) => s.e.equatorialRadiusKm)) * 1.1;
  const scale = p.size / (2 * extent);
  const x = (f: number): number => p.x0 + (extent - f) * scale;
  const y = (g: number): number => p.y0 + (extent - g) * scale;
  const path = (pts: SkyPointKm[]): string =>
    pts.map((q, i) => `${i === 0 ? 'M' : 'L'}${n(x(q.fKm))},${n(y(q.gKm))}`).join('') + 'Z';
  const t = ticks(-extent, extent, 4);
  const cx = p.x0 + p.size - 9;
  const cy = p.y0 + 16;
  return (
    `<g data-role="overlay">` +
    frame(p, 'Limbs and rings, centred', 'f − f0 (km)', 'g − g0 (km)') +
    axisTicks(p, t, x, t, y, (v) => n(v)) +
    shapes
      .map(
        (s) =>
          `<path data-fit="${esc(s.fitId)}" data-shape="${s.ring === null ? 'limb' : `ring ${esc(s.ring)}`}" fill="none" stroke="${s.colour}" stroke-width="0.7"${s.ring === null ? '' : ' stroke-dasharray="3 1.2"'} d="${path(ellipseOutline(s.e, 144))}"/>`,
      )
      .join('') +
    `<g data-role="compass" stroke="${AXIS}" stroke-width="0.6" fill="${AXIS}" font-size="${FONT_PT}">` +
    `<path fill="none" d="M${n(cx)},${n(cy)}V${n(cy - 9)}M${n(cx)},${n(cy)}H${n(cx - 9)}"/>` +
    `<text stroke="none" x="${n(cx)}" y="${n(cy - 10.5)}" text-anchor="middle">N</text>` +
    `<text stroke="none" x="${n(cx - 11)}" y="${n(cy + FONT_PT * 0.35)}" text-anchor="end">E</text></g>` +
    '</g>'
  );
}

function polePanel(
  p: Panel,
  fits: ComparisonFit[],
  ring: string | null,
  joint: JointPoleDocument | null,
): string {
  const candidates = fits.flatMap((fit, i) =>
    (fit.rings.find((r) => r.ring === ring)?.poles ?? []).map((pole, k) => ({ fit, i, k, pole })),
  );
  const ref = joint?.pole.raDeg ?? candidates[0]?.pole.raDeg ?? 0;
  const ras = candidates.map((c) => unwrap(c.pole.raDeg, ref));
  const decs = candidates.map((c) => c.pole.decDeg);
  if (joint !== null) {
    ras.push(
      ref - joint.uncertainty.raDeg,
      ref + joint.uncertainty.raDeg,
      unwrap(joint.alternativePole.raDeg, ref),
    );
    decs.push(
      joint.pole.decDeg - joint.uncertainty.decDeg,
      joint.pole.decDeg + joint.uncertainty.decDeg,
      joint.alternativePole.decDeg,
    );
  }
  // One degree scale on both axes (RA degrees, not multiplied by cos Dec), square around the points.
  const span =
    Math.max(4, Math.max(...ras, ref) - Math.min(...ras, ref), Math.max(...decs, 0) - Math.min(...decs, 0)) *
    1.2;
  const raMid = (Math.max(...ras, ref) + Math.min(...ras, ref)) / 2;
  const decMid = (Math.max(...decs, 0) + Math.min(...decs, 0)) / 2;
  const raHi = raMid + span / 2;
  const decHi = decMid + span / 2;
  const x = (ra: number): number => p.x0 + ((raHi - unwrap(ra, ref)) / span) * p.size;
  const y = (dec: number): number => p.y0 + ((decHi - dec) / span) * p.size;
  const tri = (ra: number, dec: number): string =>
    `M${n(x(ra))},${n(y(dec) - 3.5)}L${n(x(ra) + 3)},${n(y(dec) + 2.5)}L${n(x(ra) - 3)},${n(y(dec) + 2.5)}Z`;
  const marks = candidates.map(({ fit, i, k, pole }) =>
    k === 0
      ? `<circle data-pole="${esc(fit.fitId)} 1" cx="${n(x(pole.raDeg))}" cy="${n(y(pole.decDeg))}" r="2" fill="${colour(i)}"/>`
      : `<rect data-pole="${esc(fit.fitId)} 2" x="${n(x(pole.raDeg) - 1.8)}" y="${n(y(pole.decDeg) - 1.8)}" width="3.6" height="3.6" fill="none" stroke="${colour(i)}" stroke-width="0.7"/>`,
  );
  let jointMarks = '';
  if (joint !== null) {
    const rx = Math.abs(x(joint.pole.raDeg + joint.uncertainty.raDeg) - x(joint.pole.raDeg));
    const ry = Math.abs(y(joint.pole.decDeg + joint.uncertainty.decDeg) - y(joint.pole.decDeg));
    jointMarks =
      `<g data-role="joint-pole"><ellipse cx="${n(x(joint.pole.raDeg))}" cy="${n(y(joint.pole.decDeg))}" rx="${n(Math.max(rx, 0.3))}" ry="${n(Math.max(ry, 0.3))}" fill="#000" fill-opacity="0.15" stroke="#000" stroke-width="0.4"/>` +
      `<path d="${tri(joint.pole.raDeg, joint.pole.decDeg)}" fill="#000"/>` +
      `<path data-role="alternative-pole" d="${tri(joint.alternativePole.raDeg, joint.alternativePole.decDeg)}" fill="none" stroke="#000" stroke-width="0.6"${joint.ambiguityResolved ? ' stroke-dasharray="1 1"' : ''}/></g>`;
  }
  const wrap360 = (v: number): string => n(((v % 360) + 360) % 360);
  return (
    `<g data-role="poles">` +
    frame(p, `Pole candidates, ring ${ring ?? '—'}`, 'RA (°), increasing to the left', 'Dec (°)') +
    axisTicks(p, ticks(raHi - span, raHi, 4), x, ticks(decHi - span, decHi, 4), y, wrap360) +
    `<clipPath id="pole-area"><rect x="${n(p.x0)}" y="${n(p.y0)}" width="${n(p.size)}" height="${n(p.size)}"/></clipPath>` +
    `<g clip-path="url(#pole-area)">${jointMarks}${marks.join('')}</g></g>`
  );
}

export function renderComparisonFigureSvg(input: ComparisonFigureInput): SvgFigure {
  const widthPt = input.widthMm * PT_PER_MM;
  const sideBySide = input.widthMm >= 120;
  const inner = widthPt - 2 * (PANEL_MARGIN.left + PANEL_MARGIN.right);
  const size = sideBySide ? inner / 2 : widthPt - PANEL_MARGIN.left - PANEL_MARGIN.right;
  const first: Panel = { x0: PANEL_MARGIN.left, y0: PANEL_MARGIN.top, size };
  const second: Panel = sideBySide
    ? { x0: PANEL_MARGIN.left * 2 + PANEL_MARGIN.right + size, y0: PANEL_MARGIN.top, size }
    : { x0: PANEL_MARGIN.left, y0: PANEL_MARGIN.top * 2 + PANEL_MARGIN.bottom + size, size };
  const body: string[] = [
    overlayPanel(first, input.fits),
    polePanel(second, input.fits, input.ring, input.joint),
  ];

  // Legend: one swatch per fit (event date and title), then the marker meanings.
  let top = second.y0 + size + PANEL_MARGIN.bottom + 2;
  const legend: string[] = [];
  input.fits.forEach((fit, i) => {
    const label = `${fit.eventDateUtc?.slice(0, 10) ?? '—'} ${fit.eventTitle}${fit.reviewState === 'approved' ? '' : ' (not approved)'}`;
    for (const [k, line] of wrapText(label, widthPt - 26, FONT_PT).entries()) {
      legend.push(
        (k === 0
          ? `<rect x="6" y="${n(top - FONT_PT * 0.7)}" width="8" height="${FONT_PT * 0.7}" fill="${colour(i)}"/>`
          : '') + `<text x="18" y="${n(top)}" font-size="${FONT_PT}" fill="${AXIS}">${esc(line)}</text>`,
      );
      top += FONT_PT * 1.35;
    }
  });
  legend.push(
    `<text x="6" y="${n(top)}" font-size="${FONT_PT}" fill="${AXIS}">Solid: limb; dashed: ring. Pole: filled circle solution 1, open square solution 2${input.joint === null ? '' : '; filled triangle joint pole with 1-sigma region, open triangle the other family'}.</text>`,
  );
  top += FONT_PT * 1.35;
  body.push(`<g data-role="legend">${legend.join('')}</g>`);

  const captionLines = wrapText(input.caption, widthPt - 12, CAPTION_PT);
  body.push(
    `<text data-role="caption" font-size="${CAPTION_PT}" fill="#000">` +
      captionLines
        .map((l, i) => `<tspan x="6" y="${n(top + 4 + CAPTION_PT + i * CAPTION_PT * 1.3)}">${esc(l)}</tspan>`)
        .join('') +
      '</text>',
  );
  top += 4 + captionLines.length * CAPTION_PT * 1.3 + 4;
  const footer = input.provenance.flatMap((p) => wrapText(provenanceLine(p), widthPt - 12, FOOTER_PT));
  body.push(
    `<text data-role="provenance" font-size="${FOOTER_PT}" fill="#555">` +
      footer
        .map((l, i) => `<tspan x="6" y="${n(top + FOOTER_PT + i * FOOTER_PT * 1.3)}">${esc(l)}</tspan>`)
        .join('') +
      '</text>',
  );
  const heightPt = top + footer.length * FOOTER_PT * 1.3 + 6;
  const rootSize =
    input.sizeUnit === 'mm'
      ? `width="${n(input.widthMm)}mm" height="${n(heightPt / PT_PER_MM)}mm"`
      : `width="${n(widthPt)}" height="${n(heightPt)}"`;
  const meta = input.provenance
    .map(
      (p) =>
        '<limbus:provenance' +
        provenanceEntries(p)
          .map(([k, v]) => ` ${k}="${esc(v)}"`)
          .join('') +
        '/>',
    )
    .join('');
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    input.provenance.map((p) => `<!-- ${esc(provenanceLine(p)).replace(/--/g, '- -')} -->\n`).join('') +
    `<svg xmlns="http://www.w3.org/2000/svg" ${rootSize} viewBox="0 0 ${n(widthPt)} ${n(heightPt)}" font-family="${FIGURE_FONT_FAMILY}, sans-serif">` +
    `<title>Comparison of fits</title><desc>${esc(input.caption)}</desc>` +
    `<metadata><limbus:fits xmlns:limbus="urn:limbus:provenance">${meta}</limbus:fits></metadata>` +
    `<defs>${input.embedFont ? `<style>${latoFontFaceCss()}</style>` : ''}</defs>` +
    `<rect width="${n(widthPt)}" height="${n(heightPt)}" fill="#fff"/>` +
    body.join('') +
    '</svg>\n';
  return { svg, widthPt, heightPt };
}

/** What the comparison figure shows and from which fits, for the author to rewrite. */
export function comparisonCaptionDraft(
  teamName: string,
  selection: ComparisonSelection,
  fits: ComparisonFit[],
  ring: string | null,
  joint: JointPoleDocument | null,
): string {
  const parts = [
    `Comparison of ${fits.length} fit${fits.length === 1 ? '' : 's'} of ${teamName} (${selection === 'latest-approved' ? 'the latest approved fit of each event' : selection === 'approved' ? 'approved fits only' : 'including fits not approved'}).`,
    'Left: limb ellipses (solid) and ring ellipses (dashed), each moved to a common centre; f towards east, g towards north, north up and east left.',
    ring === null
      ? 'No ring was fitted in these events.'
      : `Right: the two pole solutions of ring ${ring} from each event's own ring fit (ICRS RA and Dec; RA in degrees of RA).`,
  ];
  if (joint !== null)
    parts.push(
      `Joint pole of ring ${joint.ring} from ${joint.events.length} events: RA ${joint.pole.raDeg.toFixed(2)} ± ${joint.uncertainty.raDeg.toFixed(2)}°, ` +
        `Dec ${joint.pole.decDeg.toFixed(2)} ± ${joint.uncertainty.decDeg.toFixed(2)}°, radius ${joint.radiusKm.toFixed(1)} ± ${joint.radiusSigmaKm.toFixed(1)} km; ` +
        (joint.ambiguityResolved
          ? 'the other pole family is ruled out (chi2 larger by more than 9).'
          : 'both pole families remain (chi2 differs by 9 or less).'),
    );
  return parts.join(' ');
}
