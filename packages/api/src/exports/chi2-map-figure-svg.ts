// The χ² map of a fit as an SVG figure for papers: the grid's cells shaded by Δχ² band, the 1σ, 2σ and 3σ
// contours for two parameters, the stored fit's best point, axes with units, a legend, a caption and the
// provenance. The PNG and PDF exports draw this same SVG (raster.ts); the client's plot draws the same map
// from the same stored grid and segments, with the same look (CHI2_MAP_STYLE in @limbus/schema/chi2-map).
import type { Chi2Map } from '@limbus/geometry';
import { CHI2_MAP_STYLE, chi2BandOf } from '@limbus/schema';
import { niceStep, PT_PER_MM, wrapText } from './figure-svg';
import { FIGURE_FONT_FAMILY, latoFontFaceCss } from './fonts';
import type { FigureMeta } from './raster';
import { escapeXml as esc, svgNumber as n } from './svg-text';

const FONT_PT = 7;
const TICK_FONT_PT = 6.5;
const CAPTION_FONT_PT = 6.5;
const FOOTER_FONT_PT = 5;
const MARGIN_PT = { top: 8, right: 8, bottom: 26, left: 42 };
const AXIS = '#3b4a4f';

export interface Chi2MapFigureInput {
  map: Chi2Map;
  caption: string;
  meta: FigureMeta;
  widthMm: number;
  embedFont: boolean;
  sizeUnit: 'mm' | 'pt';
}

/** "centerFKm (km)", or the name alone for a parameter without a unit. */
export function axisLabel(axis: { parameter: string; unit: string }): string {
  return axis.unit === '' ? axis.parameter : `${axis.parameter} (${axis.unit === 'deg' ? '°' : axis.unit})`;
}

/** Cell edges halfway between grid values, the outer ones half a step beyond the ends. */
function edges(values: readonly number[]): number[] {
  const out: number[] = [];
  for (let k = 0; k <= values.length; k++) {
    const lo = values[Math.max(k - 1, 0)] as number;
    const hi = values[Math.min(k, values.length - 1)] as number;
    if (k === 0) out.push(lo - ((values[1] ?? lo + 1) - lo) / 2);
    else if (k === values.length) out.push(hi + (hi - (values[values.length - 2] ?? hi - 1)) / 2);
    else out.push((lo + hi) / 2);
  }
  return out;
}

function ticks(lo: number, hi: number): number[] {
  const step = niceStep((hi - lo) / 5);
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9 * step; v += step)
    out.push(Math.abs(v) < 1e-12 * step ? 0 : v);
  return out;
}

function tickText(v: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return v.toFixed(decimals);
}

export function renderChi2MapSvg(input: Chi2MapFigureInput): {
  svg: string;
  widthPt: number;
  heightPt: number;
} {
  const { map, meta } = input;
  const widthPt = input.widthMm * PT_PER_MM;
  const plotW = widthPt - MARGIN_PT.left - MARGIN_PT.right;
  const plotH = plotW * 0.8;
  const left = MARGIN_PT.left;
  const top = MARGIN_PT.top;
  const xe = edges(map.x.values);
  const ye = edges(map.y.values);
  const x0 = xe[0] as number;
  const x1 = xe[xe.length - 1] as number;
  const y0 = ye[0] as number;
  const y1 = ye[ye.length - 1] as number;
  const px = (v: number) => left + ((v - x0) / (x1 - x0)) * plotW;
  const py = (v: number) => top + plotH - ((v - y0) / (y1 - y0)) * plotH;
  const body: string[] = [];

  const cells: string[] = [];
  map.chi2.forEach((row, j) =>
    row.forEach((c, i) => {
      const fill =
        c === null
          ? CHI2_MAP_STYLE.emptyFill
          : CHI2_MAP_STYLE.bandFills[chi2BandOf(c - map.minChi2, map.levels)];
      const xa = px(xe[i] as number);
      const xb = px(xe[i + 1] as number);
      const ya = py(ye[j + 1] as number);
      const yb = py(ye[j] as number);
      // A hair wider than the cell, so that anti-aliasing leaves no seams between cells.
      cells.push(
        `<rect x="${n(xa)}" y="${n(ya)}" width="${n(xb - xa + 0.05)}" height="${n(yb - ya + 0.05)}" fill="${fill ?? CHI2_MAP_STYLE.emptyFill}"/>`,
      );
    }),
  );
  body.push(`<g data-role="cells">${cells.join('')}</g>`);

  map.levels.forEach((level, k) => {
    const d = level.segments
      .map(([xa, ya, xb, yb]) => `M${n(px(xa))},${n(py(ya))}L${n(px(xb))},${n(py(yb))}`)
      .join('');
    const dash = CHI2_MAP_STYLE.dashes[k] ?? '';
    body.push(
      `<path data-role="contour" data-sigma="${level.sigma}" d="${d}" fill="none" stroke="${CHI2_MAP_STYLE.contour}" stroke-width="0.8"${dash === '' ? '' : ` stroke-dasharray="${dash}"`}/>`,
    );
  });
  const bx = px(map.x.best);
  const by = py(map.y.best);
  body.push(
    `<path data-role="best" d="M${n(bx - 3)},${n(by)}H${n(bx + 3)}M${n(bx)},${n(by - 3)}V${n(by + 3)}" stroke="${CHI2_MAP_STYLE.best}" stroke-width="1"/>`,
  );

  const axes: string[] = [
    `<rect x="${n(left)}" y="${n(top)}" width="${n(plotW)}" height="${n(plotH)}" fill="none" stroke="${AXIS}" stroke-width="0.5"/>`,
  ];
  const xt = ticks(x0, x1);
  const xStep = niceStep((x1 - x0) / 5);
  for (const v of xt)
    axes.push(
      `<path d="M${n(px(v))},${n(top + plotH)}v3" stroke="${AXIS}" stroke-width="0.5"/>` +
        `<text x="${n(px(v))}" y="${n(top + plotH + 3 + TICK_FONT_PT)}" font-size="${TICK_FONT_PT}" text-anchor="middle" fill="${AXIS}">${esc(tickText(v, xStep))}</text>`,
    );
  const yt = ticks(y0, y1);
  const yStep = niceStep((y1 - y0) / 5);
  for (const v of yt)
    axes.push(
      `<path d="M${n(left)},${n(py(v))}h-3" stroke="${AXIS}" stroke-width="0.5"/>` +
        `<text x="${n(left - 4)}" y="${n(py(v) + TICK_FONT_PT * 0.35)}" font-size="${TICK_FONT_PT}" text-anchor="end" fill="${AXIS}">${esc(tickText(v, yStep))}</text>`,
    );
  axes.push(
    `<text x="${n(left + plotW / 2)}" y="${n(top + plotH + 3 + TICK_FONT_PT + FONT_PT * 1.6)}" font-size="${FONT_PT}" text-anchor="middle" fill="${AXIS}">${esc(axisLabel(map.x))}</text>`,
    `<text transform="translate(${n(9)},${n(top + plotH / 2)}) rotate(-90)" font-size="${FONT_PT}" text-anchor="middle" fill="${AXIS}">${esc(axisLabel(map.y))}</text>`,
  );
  body.push(`<g data-role="axes">${axes.join('')}</g>`);

  const entries = [
    ...map.levels.map((l, k) => {
      const dash = CHI2_MAP_STYLE.dashes[k] ?? '';
      return {
        label: `${l.sigma}σ: Δχ² = ${l.deltaChi2.toFixed(2)}`,
        swatch: `<rect x="0" y="-2.5" width="12" height="5" fill="${CHI2_MAP_STYLE.bandFills[k] ?? ''}"/><path d="M0,0H12" stroke="${CHI2_MAP_STYLE.contour}" stroke-width="0.8"${dash === '' ? '' : ` stroke-dasharray="${dash}"`}/>`,
      };
    }),
    {
      label: 'beyond 3σ',
      swatch: `<rect x="0" y="-2.5" width="12" height="5" fill="${CHI2_MAP_STYLE.bandFills[map.levels.length] ?? ''}" stroke="${AXIS}" stroke-width="0.2"/>`,
    },
    ...(map.chi2.some((r) => r.some((c) => c === null))
      ? [
          {
            label: 'no fit clear of the negative chords',
            swatch: `<rect x="0" y="-2.5" width="12" height="5" fill="${CHI2_MAP_STYLE.emptyFill}"/>`,
          },
        ]
      : []),
    {
      label: 'stored fit',
      swatch: `<path d="M3,0H9M6,-3V3" stroke="${CHI2_MAP_STYLE.best}" stroke-width="1"/>`,
    },
  ];
  const legendTop = top + plotH + MARGIN_PT.bottom + 2;
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
    legend.push(
      `<g transform="translate(${n(lx)},${n(legendTop + row * rowPt)})">${e.swatch}<text x="16" y="${n(FONT_PT * 0.35)}" font-size="${FONT_PT}" fill="${AXIS}">${esc(e.label)}</text></g>`,
    );
    lx += w;
  }
  body.push(`<g data-role="legend">${legend.join('')}</g>`);

  const captionTop = legendTop + (row + 1) * rowPt + 4;
  const captionLines = wrapText(input.caption, widthPt - 12, CAPTION_FONT_PT);
  const lineStep = CAPTION_FONT_PT * 1.3;
  body.push(
    `<text data-role="caption" x="6" font-size="${CAPTION_FONT_PT}" fill="#000">` +
      captionLines
        .map((l, i) => `<tspan x="6" y="${n(captionTop + i * lineStep + CAPTION_FONT_PT)}">${esc(l)}</tspan>`)
        .join('') +
      '</text>',
  );
  const footerTop = captionTop + captionLines.length * lineStep + 4;
  const footerLines = wrapText(meta.line, widthPt - 12, FOOTER_FONT_PT);
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
  const size =
    input.sizeUnit === 'mm'
      ? `width="${n(input.widthMm)}mm" height="${n(heightPt / PT_PER_MM)}mm"`
      : `width="${n(widthPt)}" height="${n(heightPt)}"`;
  const attributes = meta.entries.map(([k, v]) => ` ${k}="${esc(v)}"`).join('');
  const style = input.embedFont ? `<style>${latoFontFaceCss()}</style>` : '';
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<!-- ${esc(meta.line).replace(/--/g, '- -')} -->\n` +
    `<svg xmlns="http://www.w3.org/2000/svg" ${size} role="img" aria-label="${esc(meta.title)}" ` +
    `viewBox="0 0 ${n(widthPt)} ${n(heightPt)}" font-family="${FIGURE_FONT_FAMILY}, sans-serif">` +
    `<title>${esc(meta.title)}</title><desc>${esc(input.caption)}</desc>` +
    `<metadata><limbus:provenance xmlns:limbus="urn:limbus:provenance"${attributes}/></metadata>` +
    `<defs>${style}</defs>` +
    `<rect width="${n(widthPt)}" height="${n(heightPt)}" fill="#fff"/>` +
    body.join('') +
    '</svg>\n';
  return { svg, widthPt, heightPt };
}
