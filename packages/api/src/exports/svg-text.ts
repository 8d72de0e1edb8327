// Small helpers shared by the figure and table writers.

// What XML 1.0 forbids (5th ed., section 2.2, production [2] Char: C0 controls but tab, LF and CR, lone
// surrogates, U+FFFE and U+FFFF), and what it discourages and no renderer draws (DEL and C1).
const NOT_PRINTABLE =
  // eslint-disable-next-line no-control-regex
  /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\ufffe\uffff]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/**
 * Text as every exporter writes it: without the characters XML 1.0 forbids or no renderer can draw.
 * Input rules refuse them, but a title stored before those rules (or written around them) must still
 * give a valid SVG, PNG, PDF, CSV or TeX file rather than a broken one or a 500.
 */
export function printableText(text: string): string {
  return text.replace(NOT_PRINTABLE, '');
}

export function escapeXml(text: string): string {
  return printableText(text)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;');
}

/** Coordinates are written with 0.01 pt resolution: finer than any printer, and keeps files small. */
export function svgNumber(x: number): string {
  return (Math.round(x * 100) / 100).toString();
}
