import { inflateSync } from 'node:zlib';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { exampleMap } from '../../e2e/planning/map-fixture';
import type { FigureMeta } from '../exports/raster';
import { pixelWidth, renderPdf, renderPng } from '../exports/raster';
import { renderPathMapSvg } from './map-svg';

const META: FigureMeta = {
  title: 'Shadow path map',
  line: 'Limbus prediction of event e1 · input SHA-256 abc · engine 0.1.0',
  entries: [
    ['eventId', 'e1'],
    ['inputSha256', 'abc'],
  ],
  date: '2030-05-01T10:00:20.000Z',
};

function draw(sizeUnit: 'mm' | 'pt', embedFont = false) {
  return renderPathMapSvg({
    map: exampleMap(),
    stepSeconds: 10,
    widthMm: 120,
    embedFont,
    sizeUnit,
    meta: META,
  });
}

/** Every element of a parsed document (fast-xml-parser's preserveOrder form), depth first. */
function elements(node: unknown, out: Array<{ name: string; attrs: Record<string, string> }> = []) {
  if (Array.isArray(node)) for (const child of node) elements(child, out);
  else if (node !== null && typeof node === 'object')
    for (const [key, value] of Object.entries(node)) {
      if (key === ':@' || key === '#text') continue;
      const attrs = ((node as Record<string, unknown>)[':@'] ?? {}) as Record<string, string>;
      out.push({ name: key, attrs });
      elements(value, out);
    }
  return out;
}

describe('renderPathMapSvg', () => {
  it('renderPathMapSvg() writes a well-formed SVG named "Shadow path map …" with each line and station marked', () => {
    const { svg, widthPt, heightPt } = draw('mm', true);
    expect(XMLValidator.validate(svg)).toBe(true);
    const all = elements(
      new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', preserveOrder: true }).parse(svg),
    );
    const root = all.find((e) => e.name === 'svg');
    expect(root?.attrs.role).toBe('img');
    expect(root?.attrs['aria-label']).toBe('Shadow path map: Example <occultation> & test');
    // 120 mm is 340.16 pt (72 pt per inch, 25.4 mm per inch).
    expect(Math.abs(widthPt - 340.16)).toBeLessThan(0.01);
    expect(root?.attrs.viewBox).toBe(
      `0 0 ${Math.round(widthPt * 100) / 100} ${Math.round(heightPt * 100) / 100}`,
    );
    const lines = all
      .filter((e) => e.attrs['data-path-line'] !== undefined)
      .map((e) => e.attrs['data-path-line']);
    expect(new Set(lines)).toEqual(new Set(['central', 'left', 'right']));
    expect(all.some((e) => e.attrs['data-ring'] === 'R1')).toBe(true);
    const stations = all.filter((e) => e.attrs['data-station'] !== undefined);
    expect(
      stations.map((e) => [e.attrs['data-station'], e.attrs['data-outlook'], e.attrs['data-status']]),
    ).toEqual([
      ['s-inside', 'inside', 'observing'],
      ['s-ring', 'ring-only', 'planned'],
      ['s-out', 'outside', 'proposed'],
    ]);
    for (const role of ['land', 'borders', 'graticule', 'night', 'legend', 'caption', 'provenance'])
      expect(all.some((e) => e.attrs['data-role'] === role)).toBe(true);
    expect(svg).toContain('@font-face');
  });

  it('renderPng() draws the map at the asked width with its provenance fields', () => {
    const { svg, widthPt, heightPt } = draw('mm');
    const png = renderPng(svg, 120, 300, META);
    const width = png.readUInt32BE(16);
    const height = png.readUInt32BE(20);
    expect(width).toBe(pixelWidth(120, 300));
    expect(Math.abs(height - (width * heightPt) / widthPt)).toBeLessThanOrEqual(1);
    const text = png.toString('latin1');
    expect(text).toContain('Limbus eventId\0e1');
    expect(text).toContain('Description\0Limbus prediction of event e1');
    // Not blank: filtered rows of a white page are almost all 0 and 255 (filter bytes are not pixels).
    const idat: Buffer[] = [];
    for (let at = 8; at < png.length; at += 12 + png.readUInt32BE(at))
      if (png.toString('latin1', at + 4, at + 8) === 'IDAT')
        idat.push(png.subarray(at + 8, at + 8 + png.readUInt32BE(at)));
    const raw = inflateSync(Buffer.concat(idat));
    let other = 0;
    for (let i = 0; i < raw.length; i++)
      if (i % (1 + 4 * width) !== 0 && raw[i] !== 0 && raw[i] !== 255) other++;
    expect(other).toBeGreaterThan(1000);
  });

  it("renderPdf() writes one page of the map with the map's title and date, the same bytes twice", async () => {
    const { svg, widthPt, heightPt } = draw('pt');
    const a = await renderPdf(svg, widthPt, heightPt, META);
    const b = await renderPdf(svg, widthPt, heightPt, META);
    expect(a.equals(b)).toBe(true);
    const doc = await PDFDocument.load(a, { updateMetadata: false });
    expect(doc.getPageCount()).toBe(1);
    expect(doc.getTitle()).toBe('Shadow path map');
    expect(doc.getKeywords()).toBe('eventId=e1; inputSha256=abc');
    expect(doc.getCreationDate()?.toISOString()).toBe(META.date);
  });
});
