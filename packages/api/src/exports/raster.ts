// PNG and PDF from the figure's SVG, with the well-known renderers: resvg (Rust, through napi) for pixels
// and PDFKit with svg-to-pdfkit for vector PDF. Both get Lato from @fontsource/lato (./fonts.ts).
import { crc32 } from 'node:zlib';
import { Resvg } from '@resvg/resvg-js';
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import { FIGURE_FONT_FAMILY, latoSfntPaths, latoWoff } from './fonts';
import { type Provenance, provenanceEntries, provenanceLine } from './provenance';

export const MM_PER_INCH = 25.4;

/**
 * What a figure file says about itself when it is not a fit's (e.g. the shadow-path map): its title, one
 * line for the description, fields in a fixed order, and the date the PDF carries (fixed for fixed input).
 */
export interface FigureMeta {
  title: string;
  line: string;
  entries: Array<[string, string]>;
  date: string;
}

type FigureSource = Provenance | Provenance[] | FigureMeta;

function isFigureMeta(source: FigureSource): source is FigureMeta {
  return !Array.isArray(source) && 'entries' in source;
}

/** Pixel width of a figure widthMm wide printed at dpi. */
export function pixelWidth(widthMm: number, dpi: number): number {
  return Math.round((widthMm / MM_PER_INCH) * dpi);
}

function pngChunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'latin1');
  const crc = Buffer.alloc(4);
  // PNG spec (W3C, 2nd ed., section 5.3): the CRC covers the chunk type and data, not the length.
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])) >>> 0, 0);
  return Buffer.concat([head, data, crc]);
}

/**
 * Adds pHYs (the print resolution, so a layout program places the figure at its width) and one tEXt
 * chunk per provenance field, right after IHDR (PNG spec, W3C 2nd ed., sections 11.3.5.3 and 11.3.4.3).
 */
export function withPngMetadata(png: Buffer, dpi: number, provenance: FigureSource): Buffer {
  const ihdrEnd = 8 + 8 + 13 + 4;
  const perMetre = Math.round(dpi / 0.0254);
  const phys = Buffer.alloc(9);
  phys.writeUInt32BE(perMetre, 0);
  phys.writeUInt32BE(perMetre, 4);
  phys.writeUInt8(1, 8);
  const all = isFigureMeta(provenance) ? [] : Array.isArray(provenance) ? provenance : [provenance];
  const described = isFigureMeta(provenance)
    ? [['Description', provenance.line], ...provenance.entries.map(([k, v]) => [`Limbus ${k}`, v])]
    : [
        ['Description', all.map(provenanceLine).join(' | ')],
        // tEXt keywords may repeat (PNG spec, 11.3.4.3): a comparison figure lists each fit's fields in turn.
        ...all.flatMap((p) => provenanceEntries(p).map(([k, v]) => [`Limbus ${k}`, v])),
      ];
  const texts = [['Software', 'Limbus'], ...described].map(([k, v]) =>
    pngChunk('tEXt', Buffer.from(`${k}\0${v}`, 'latin1')),
  );
  return Buffer.concat([png.subarray(0, ihdrEnd), pngChunk('pHYs', phys), ...texts, png.subarray(ihdrEnd)]);
}

export function renderPng(svg: string, widthMm: number, dpi: number, provenance: FigureSource): Buffer {
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'width', value: pixelWidth(widthMm, dpi) },
    background: '#ffffff',
    font: { loadSystemFonts: false, fontFiles: latoSfntPaths(), defaultFontFamily: FIGURE_FONT_FAMILY },
  });
  return withPngMetadata(resvg.render().asPng(), dpi, provenance);
}

export function renderPdf(
  svg: string,
  widthPt: number,
  heightPt: number,
  provenance: FigureSource,
): Promise<Buffer> {
  const info = pdfInfoOf(provenance);
  const date = new Date(info.date);
  const doc = new PDFDocument({
    size: [widthPt, heightPt],
    margin: 0,
    autoFirstPage: true,
    info: {
      Title: info.title,
      Author: 'Limbus',
      Subject: info.subject,
      Keywords: info.keywords,
      Creator: 'Limbus',
      // The fit's date, not now: the same fit gives the same file.
      CreationDate: date,
      ModDate: date,
    },
  });
  doc.registerFont(FIGURE_FONT_FAMILY, latoWoff('regular'));
  doc.registerFont(`${FIGURE_FONT_FAMILY}-Bold`, latoWoff('bold'));
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  SVGtoPDF(doc, svg, 0, 0, {
    width: widthPt,
    height: heightPt,
    assumePt: true,
    fontCallback: (_family: string, bold: boolean) =>
      bold ? `${FIGURE_FONT_FAMILY}-Bold` : FIGURE_FONT_FAMILY,
  });
  doc.end();
  return done;
}

/** The PDF's info fields; a fit figure's date is the newest fit's, so the same fits give the same bytes. */
function pdfInfoOf(source: FigureSource): { title: string; subject: string; keywords: string; date: string } {
  if (isFigureMeta(source))
    return {
      title: source.title,
      subject: source.line,
      keywords: source.entries.map(([k, v]) => `${k}=${v}`).join('; '),
      date: source.date,
    };
  const all = Array.isArray(source) ? source : [source];
  return {
    title: 'Sky-plane solution',
    subject: all.map(provenanceLine).join(' | '),
    keywords: all
      .map((p) =>
        provenanceEntries(p)
          .map(([k, v]) => `${k}=${v}`)
          .join('; '),
      )
      .join(' | '),
    date:
      all
        .map((p) => p.date)
        .sort()
        .at(-1) ?? new Date(0).toISOString(),
  };
}
