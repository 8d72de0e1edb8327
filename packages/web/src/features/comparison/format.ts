/** Okabe–Ito colours (Okabe and Ito, "Color Universal Design", 2008), one per fit, cycling. */
export const FIT_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

export function fitColour(index: number): string {
  return FIT_COLOURS[index % FIT_COLOURS.length] ?? '#000000';
}

/** RA shifted by whole turns to lie within 180° of a reference, so a chart never splits at 0h. */
export function unwrapRaDeg(raDeg: number, referenceDeg: number): number {
  return raDeg - 360 * Math.round((raDeg - referenceDeg) / 360);
}
