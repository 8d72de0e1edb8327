import { inflateSync, crc32 } from 'node:zlib';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { exampleEvent, exampleProvenance, exampleSolution } from '../../e2e/exports/example-fixture';
import { captionDraft } from './caption';
import { renderFitFigureSvg } from './figure-svg';
import { pixelWidth, renderPdf, renderPng } from './raster';

interface PngChunk {
  type: string;
  data: Buffer;
  crcOk: boolean;
}

/** Reads the chunk list of a PNG file (W3C PNG spec, 2nd ed., sections 5.2–5.3). */
function pngChunks(png: Buffer): PngChunk[] {
  expect(png.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  const chunks: PngChunk[] = [];
  for (let at = 8; at < png.length;) {
    const length = png.readUInt32BE(at);
    const type = png.toString('latin1', at + 4, at + 8);
    const data = png.subarray(at + 8, at + 8 + length);
    const crc = png.readUInt32BE(at + 8 + length);
    chunks.push({ type, data, crcOk: crc32(png.subarray(at + 4, at + 8 + length)) >>> 0 === crc });
    at += 12 + length;
  }
  return chunks;
}

function plainFigure(widthMm: number, sizeUnit: 'mm' | 'pt') {
  const solution = exampleSolution();
  return renderFitFigureSvg({
    solution,
    caption: captionDraft('the example event', solution, exampleEvent().fit),
    provenance: exampleProvenance,
    widthMm,
    embedFont: false,
    sizeUnit,
  });
}

describe('pixelWidth', () => {
  it('pixelWidth() is the width in inches times the dots per inch', () => {
    // 88 mm = 3.4646 in; 180 mm = 7.0866 in.
    expect(pixelWidth(88, 300)).toBe(1039);
    expect(pixelWidth(88, 600)).toBe(2079);
    expect(pixelWidth(180, 300)).toBe(2126);
    expect(pixelWidth(180, 600)).toBe(4252);
  });
});

describe('renderPng', () => {
  it.each([
    [88, 300],
    [180, 600],
  ])(
    'renderPng() decodes at the asked size for %i mm at %i dpi, with the print resolution and provenance',
    (widthMm, dpi) => {
      const fig = plainFigure(widthMm, 'mm');
      const png = renderPng(fig.svg, widthMm, dpi, exampleProvenance);
      const chunks = pngChunks(png);
      expect(chunks.every((c) => c.crcOk)).toBe(true);
      const ihdr = chunks[0];
      if (ihdr?.type !== 'IHDR') throw new Error('first chunk is not IHDR');
      const width = ihdr.data.readUInt32BE(0);
      const height = ihdr.data.readUInt32BE(4);
      expect(width).toBe(pixelWidth(widthMm, dpi));
      expect(Math.abs(height - (width * fig.heightPt) / fig.widthPt)).toBeLessThanOrEqual(1);
      // 8-bit RGBA, as resvg writes: each row is one filter byte and four bytes per pixel.
      expect([ihdr.data.readUInt8(8), ihdr.data.readUInt8(9)]).toEqual([8, 6]);
      const pixels = inflateSync(Buffer.concat(chunks.filter((c) => c.type === 'IDAT').map((c) => c.data)));
      expect(pixels.length).toBe(height * (1 + 4 * width));
      const phys = chunks.find((c) => c.type === 'pHYs');
      expect(phys?.data.readUInt32BE(0)).toBe(Math.round(dpi / 0.0254));
      const texts = Object.fromEntries(
        chunks
          .filter((c) => c.type === 'tEXt')
          .map((c) => {
            const s = c.data.toString('latin1');
            return [s.slice(0, s.indexOf('\0')), s.slice(s.indexOf('\0') + 1)];
          }),
      );
      expect(texts).toMatchObject({
        'Limbus fitId': exampleProvenance.fitId,
        'Limbus inputSha256': exampleProvenance.inputSha256,
        'Limbus engineVersion': '0.1.0',
        'Limbus seed': '1',
        'Limbus date': exampleProvenance.date,
        'Limbus approvalState': 'approved',
      });
    },
  );

  it('renderPng() draws dark pixels: the figure is not blank', () => {
    const fig = plainFigure(88, 'mm');
    const png = renderPng(fig.svg, 88, 300, exampleProvenance);
    const chunks = pngChunks(png);
    const width = chunks[0]?.data.readUInt32BE(0) ?? 0;
    const raw = inflateSync(Buffer.concat(chunks.filter((c) => c.type === 'IDAT').map((c) => c.data)));
    // Filtered bytes are not pixel values, but a blank white image filters to almost all zeros and 255s.
    let other = 0;
    for (let i = 0; i < raw.length; i++)
      if (i % (1 + 4 * width) !== 0 && raw[i] !== 0 && raw[i] !== 255) other++;
    expect(other).toBeGreaterThan(1000);
  });
});

describe('renderPdf', () => {
  it('renderPdf() writes a PDF that parses, one page of the figure size, provenance in the info dictionary', async () => {
    const fig = plainFigure(88, 'pt');
    const bytes = await renderPdf(fig.svg, fig.widthPt, fig.heightPt, exampleProvenance);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const doc = await PDFDocument.load(bytes, { updateMetadata: false });
    expect(doc.getPageCount()).toBe(1);
    const { width, height } = doc.getPage(0).getSize();
    expect(Math.abs(width - fig.widthPt)).toBeLessThan(0.01);
    expect(Math.abs(height - fig.heightPt)).toBeLessThan(0.01);
    expect(doc.getSubject()).toContain(exampleProvenance.fitId);
    expect(doc.getKeywords()).toContain(`inputSha256=${exampleProvenance.inputSha256}`);
    expect(doc.getKeywords()).toContain('approvalState=approved');
    expect(doc.getCreationDate()?.toISOString()).toBe(exampleProvenance.date);
    // Lato is embedded as a TrueType font program, not replaced by a standard PDF font.
    expect(bytes.includes('/FontFile2')).toBe(true);
    expect(bytes.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+Lato/);
  });

  it('renderPdf() gives the same bytes twice for the same fit', async () => {
    const fig = plainFigure(88, 'pt');
    const a = await renderPdf(fig.svg, fig.widthPt, fig.heightPt, exampleProvenance);
    const b = await renderPdf(fig.svg, fig.widthPt, fig.heightPt, exampleProvenance);
    expect(a.equals(b)).toBe(true);
  });
});
