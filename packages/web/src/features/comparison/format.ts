/** Okabe–Ito colours (Okabe and Ito, "Color Universal Design", 2008), one per fit, cycling. */
export const FIT_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000'];

export function fitColour(index: number): string {
  return FIT_COLOURS[index % FIT_COLOURS.length] ?? '#000000';
}

/** RA shifted by whole turns to lie within 180° of a reference, so a chart never splits at 0h. */
export function unwrapRaDeg(raDeg: number, referenceDeg: number): number {
  return raDeg - 360 * Math.round((raDeg - referenceDeg) / 360);
}

/**
 * The 1σ ellipse of a 2 × 2 covariance [[xx, xy], [xy, yy]] (already in drawing units): semi-axes the
 * square roots of its eigenvalues, the first along the angle ½·atan2(2xy, xx − yy) from +x (closed-form
 * eigen-decomposition of a symmetric 2 × 2 matrix; Press et al., Numerical Recipes, 3rd ed., §15.6.5 for
 * the ellipse, from memory). `angleDeg` turns +x towards +y, as SVG's rotate() does.
 */
export function sigmaEllipse(
  xx: number,
  yy: number,
  xy: number,
): { rx: number; ry: number; angleDeg: number } {
  const mean = (xx + yy) / 2;
  const half = Math.hypot((xx - yy) / 2, xy);
  return {
    rx: Math.sqrt(Math.max(0, mean + half)),
    ry: Math.sqrt(Math.max(0, mean - half)),
    angleDeg: (Math.atan2(2 * xy, xx - yy) * 90) / Math.PI,
  };
}
