// Rounding for people: the error to two significant digits and the value to the same decimal place
// (common practice, no source). The server's LaTeX table rounds the same way.
export function decimalsForSigma(sigma: number): number {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return 2;
  return Math.max(0, 1 - Math.floor(Math.log10(sigma)));
}

export function formatValueSigma(value: number, sigma: number): string {
  const d = decimalsForSigma(sigma);
  return sigma > 0 ? `${value.toFixed(d)} ± ${sigma.toFixed(d)}` : value.toFixed(d);
}

/** Okabe–Ito colours (Okabe and Ito, "Color Universal Design", 2008), one per fit, cycling. */
export const FIT_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

export function fitColour(index: number): string {
  return FIT_COLOURS[index % FIT_COLOURS.length] ?? '#000000';
}

/** RA shifted by whole turns to lie within 180° of a reference, so a chart never splits at 0h. */
export function unwrapRaDeg(raDeg: number, referenceDeg: number): number {
  return raDeg - 360 * Math.round((raDeg - referenceDeg) / 360);
}
