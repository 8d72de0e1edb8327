// Lato for the figures, from @fontsource/lato (SIL Open Font License 1.1). The SVG carries the WOFF2 as a
// data URL so a browser or an editor shows Lato without the font installed; the PDF embeds a subset of the
// WOFF through PDFKit; the PNG rasteriser needs sfnt files, made once per process from the WOFF.
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { woffToSfnt } from './woff';

export const FIGURE_FONT_FAMILY = 'Lato';
const WEIGHTS = { regular: 400, bold: 700 } as const;
export type FontWeightName = keyof typeof WEIGHTS;

function fontFile(weight: FontWeightName, ext: 'woff' | 'woff2'): string {
  return require.resolve(`@fontsource/lato/files/lato-latin-${WEIGHTS[weight]}-normal.${ext}`);
}

export function latoWoff(weight: FontWeightName): Buffer {
  return readFileSync(fontFile(weight, 'woff'));
}

let fontFaceCss: string | null = null;

/** @font-face rules with both weights inline, for the SVG's <style>. */
export function latoFontFaceCss(): string {
  if (fontFaceCss === null) {
    fontFaceCss = (Object.keys(WEIGHTS) as FontWeightName[])
      .map((w) => {
        const data = readFileSync(fontFile(w, 'woff2')).toString('base64');
        return `@font-face{font-family:'${FIGURE_FONT_FAMILY}';font-weight:${WEIGHTS[w]};src:url(data:font/woff2;base64,${data}) format('woff2');}`;
      })
      .join('');
  }
  return fontFaceCss;
}

let sfntPaths: string[] | null = null;

/** Paths of Lato regular and bold as TrueType files, written to the temporary directory on first use. */
export function latoSfntPaths(): string[] {
  if (sfntPaths === null) {
    const dir = join(tmpdir(), `limbus-fonts-${process.pid}`);
    mkdirSync(dir, { recursive: true });
    sfntPaths = (Object.keys(WEIGHTS) as FontWeightName[]).map((w) => {
      const path = join(dir, `lato-${WEIGHTS[w]}.ttf`);
      writeFileSync(path, woffToSfnt(latoWoff(w)));
      return path;
    });
  }
  return sfntPaths;
}
