// Fresnel integrals C(x) = ∫₀ˣ cos(πt²/2) dt and S(x) = ∫₀ˣ sin(πt²/2) dt, by the method of
// Press, Teukolsky, Vetterling & Flannery, Numerical Recipes, 3rd ed., §6.8 ("frenel"): the power series
// for |x| ≤ 1.5 and, beyond, the continued fraction of the complementary error function evaluated with
// the modified Lentz algorithm. Both converge to full double precision, unlike the rational
// approximations of Abramowitz & Stegun 7.3.32/7.3.33 (|ε| ≤ 2·10⁻³).

const EPS = 1e-16;
const SERIES_LIMIT = 1.5;
const MAX_ITERATIONS = 200;
const TINY = 1e-300;
const BIG = 1e300;

export interface FresnelPair {
  c: number;
  s: number;
}

export function fresnel(x: number): FresnelPair {
  const ax = Math.abs(x);
  let c: number;
  let s: number;
  if (ax < 1e-150) {
    c = ax;
    s = 0;
  } else if (ax <= SERIES_LIMIT) {
    ({ c, s } = series(ax));
  } else {
    ({ c, s } = continuedFraction(ax));
  }
  return x < 0 ? { c: -c, s: -s } : { c, s };
}

// The two series interleave in one loop because their terms are successive powers of (πx²/2):
// C takes the even ones, S the odd ones.
function series(ax: number): FresnelPair {
  const fact = (Math.PI / 2) * ax * ax;
  let sum = 0;
  let sumS = 0;
  let sumC = ax;
  let sign = 1;
  let odd = true;
  let term = ax;
  let n = 3;
  for (let k = 1; k <= MAX_ITERATIONS; k++) {
    term *= fact / k;
    sum += (sign * term) / n;
    const test = Math.abs(sum) * EPS;
    if (odd) {
      sign = -sign;
      sumS = sum;
      sum = sumC;
    } else {
      sumC = sum;
      sum = sumS;
    }
    if (term < test) break;
    odd = !odd;
    n += 2;
  }
  return { c: sumC, s: sumS };
}

// C + iS = ((1 + i)/2)·[1 − exp(iπx²/2)·h], h from the Lentz evaluation of the erfc continued fraction.
function continuedFraction(ax: number): FresnelPair {
  const pix2 = Math.PI * ax * ax;
  let bRe = 1;
  const bIm = -pix2;
  let ccRe = BIG;
  let ccIm = 0;
  // d = h = 1/b
  let den = bRe * bRe + bIm * bIm;
  let dRe = bRe / den;
  let dIm = -bIm / den;
  let hRe = dRe;
  let hIm = dIm;
  let n = -1;
  for (let k = 2; k <= MAX_ITERATIONS; k++) {
    n += 2;
    const a = -n * (n + 1);
    bRe += 4;
    // d = 1/(a·d + b)
    let xRe = a * dRe + bRe;
    let xIm = a * dIm + bIm;
    if (Math.abs(xRe) + Math.abs(xIm) < TINY) xRe = TINY;
    den = xRe * xRe + xIm * xIm;
    dRe = xRe / den;
    dIm = -xIm / den;
    // cc = b + a/cc
    den = ccRe * ccRe + ccIm * ccIm;
    xRe = bRe + (a * ccRe) / den;
    xIm = bIm - (a * ccIm) / den;
    if (Math.abs(xRe) + Math.abs(xIm) < TINY) xRe = TINY;
    ccRe = xRe;
    ccIm = xIm;
    const delRe = ccRe * dRe - ccIm * dIm;
    const delIm = ccRe * dIm + ccIm * dRe;
    const nextRe = hRe * delRe - hIm * delIm;
    hIm = hRe * delIm + hIm * delRe;
    hRe = nextRe;
    if (Math.abs(delRe - 1) + Math.abs(delIm) <= EPS) break;
  }
  // h *= (ax, −ax)
  const h2Re = hRe * ax + hIm * ax;
  const h2Im = hIm * ax - hRe * ax;
  const phase = 0.5 * pix2;
  const eRe = Math.cos(phase);
  const eIm = Math.sin(phase);
  const oneMinusRe = 1 - (eRe * h2Re - eIm * h2Im);
  const oneMinusIm = -(eRe * h2Im + eIm * h2Re);
  return {
    c: 0.5 * (oneMinusRe - oneMinusIm),
    s: 0.5 * (oneMinusRe + oneMinusIm),
  };
}

/**
 * Intensity behind a straight edge for a point source and one wavelength, normalised to 1 far outside.
 * u is the distance from the geometric edge in Fresnel scales √(λD/2), positive on the lit side:
 * I(u) = ½·[(C(u) + ½)² + (S(u) + ½)²] (Born & Wolf, Principles of Optics, §8.7, straight-edge diffraction).
 */
export function straightEdgeIntensity(u: number): number {
  const { c, s } = fresnel(u);
  return 0.5 * ((c + 0.5) * (c + 0.5) + (s + 0.5) * (s + 0.5));
}
