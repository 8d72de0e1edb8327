// Small helpers shared by the figure writers.

export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** Coordinates are written with 0.01 pt resolution: finer than any printer, and keeps files small. */
export function svgNumber(x: number): string {
  return (Math.round(x * 100) / 100).toString();
}
