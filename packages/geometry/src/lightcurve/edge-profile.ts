// The light-curve profile of one straight edge: monochromatic Fresnel diffraction averaged over a flat
// band and over a uniform stellar disc, tabulated once per fit on a fine grid of distance from the edge
// so that the fit itself only interpolates. A cumulative table gives the exposure (box) average exactly
// for the piecewise-linear interpolant.

import { GeometryInputError } from '../types.js';
import { straightEdgeIntensity } from './fresnel.js';

/**
 * The profile is first computed out to this many Fresnel scales (plus the star's radius) from the edge,
 * then trimmed to where it departs from the geometric step by more than STEP_TOLERANCE. Beyond 40 scales a
 * monochromatic point source still has fringes of ~√2/(π·40) ≈ 1 %; band and disc average them away.
 */
const TABLE_HALF_WIDTH_FRESNEL_SCALES = 40;
const GRID_STEPS_PER_FRESNEL_SCALE = 40;
/** Largest departure from the step that the trimmed table leaves out (a fraction of the star's light). */
const STEP_TOLERANCE = 3e-4;
const MAX_GRID_POINTS = 400_000;
const MAX_BAND_SLICES = 400;
/** Cells across the star's diameter when averaging over the disc. */
const DISC_CELLS = 400;

export interface EdgeProfileOptions {
  distanceKm: number;
  /** Central wavelength of the band. */
  wavelengthUm: number;
  /** Full width of the flat band centred on wavelengthUm; 0 for monochromatic light. */
  bandwidthUm: number;
  /** Diameter of the star's disc projected at the body's distance; 0 for a point source. */
  starDiameterKm: number;
}

export interface EdgeProfile {
  /** √(λD/2) at the central wavelength. */
  fresnelScaleKm: number;
  starDiameterKm: number;
  bandSlices: number;
  /** The profile is exactly 0 for x ≤ −halfWidthKm and exactly 1 for x ≥ halfWidthKm. */
  halfWidthKm: number;
  stepKm: number;
  /** Profile at x_j = −halfWidthKm + j·stepKm. */
  values: Float64Array;
  /** ∫ from −halfWidthKm to x_j of the linear interpolant of values. */
  cumulative: Float64Array;
}

export function fresnelScaleKm(wavelengthUm: number, distanceKm: number): number {
  return Math.sqrt((wavelengthUm * 1e-9 * distanceKm) / 2);
}

/**
 * Band-slice count that keeps the sampled band from re-phasing the fringes inside the table: the phase
 * πx²/(λD) changes by 2π between slices at u² = 4N/(Δλ/λ), so N > U²·(Δλ/λ)/4 keeps that beyond U.
 */
function bandSliceCount(wavelengthUm: number, bandwidthUm: number): number {
  if (bandwidthUm === 0) return 1;
  const relative = bandwidthUm / wavelengthUm;
  const needed = Math.ceil((TABLE_HALF_WIDTH_FRESNEL_SCALES ** 2 * relative) / 4) + 1;
  return Math.min(MAX_BAND_SLICES, Math.max(8, needed));
}

export function buildEdgeProfile(options: EdgeProfileOptions): EdgeProfile {
  const { distanceKm, wavelengthUm, bandwidthUm, starDiameterKm } = options;
  if (!(distanceKm > 0)) throw new GeometryInputError('distanceKm', 'must be a positive number');
  if (!(wavelengthUm > 0)) throw new GeometryInputError('wavelengthUm', 'must be a positive number');
  if (!(bandwidthUm >= 0 && bandwidthUm < 2 * wavelengthUm)) {
    throw new GeometryInputError('bandwidthUm', 'must be at least 0 and less than twice the wavelength');
  }
  if (!(starDiameterKm >= 0)) throw new GeometryInputError('starDiameterKm', 'must be zero or positive');

  const bandSlices = bandSliceCount(wavelengthUm, bandwidthUm);
  const scalesKm: number[] = [];
  for (let i = 0; i < bandSlices; i++) {
    const lambdaUm = wavelengthUm - bandwidthUm / 2 + ((i + 0.5) * bandwidthUm) / bandSlices;
    scalesKm.push(fresnelScaleKm(lambdaUm, distanceKm));
  }
  const minScaleKm = Math.min(...scalesKm);
  const maxScaleKm = Math.max(...scalesKm);
  const radiusKm = starDiameterKm / 2;
  const reachKm = TABLE_HALF_WIDTH_FRESNEL_SCALES * maxScaleKm + radiusKm;
  const stepKm = Math.max(minScaleKm / GRID_STEPS_PER_FRESNEL_SCALE, (2 * reachKm) / MAX_GRID_POINTS);
  // Odd, so that x = 0 is a node and the table can be trimmed symmetrically.
  const count = 2 * Math.ceil(reachKm / stepKm) + 1;
  const tableHalfWidthKm = ((count - 1) * stepKm) / 2;

  const band = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    const xKm = -tableHalfWidthKm + j * stepKm;
    let sum = 0;
    for (const scaleKm of scalesKm) sum += straightEdgeIntensity(xKm / scaleKm);
    band[j] = sum / bandSlices;
  }
  const bandTable = {
    halfWidthKm: tableHalfWidthKm,
    stepKm,
    values: band,
    cumulative: cumulate(band, stepKm),
  };
  const full = radiusKm > 0 ? averageOverDisc(bandTable, radiusKm) : band;
  const values = trimToStep(full);
  const halfWidthKm = ((values.length - 1) * stepKm) / 2;
  return {
    fresnelScaleKm: fresnelScaleKm(wavelengthUm, distanceKm),
    starDiameterKm,
    bandSlices,
    halfWidthKm,
    stepKm,
    values,
    cumulative: cumulate(values, stepKm),
  };
}

/**
 * Narrows the table symmetrically to where the profile still departs from the geometric step by more
 * than STEP_TOLERANCE, so the fit evaluates fewer samples near each edge. Band and disc average the lit
 * side's fringes away within a few Fresnel scales; the slowest part is the shadow tail, ≈ 1/(2π²u²).
 */
function trimToStep(values: Float64Array): Float64Array {
  const centre = (values.length - 1) / 2;
  let reach = 1;
  for (let j = 0; j < values.length; j++) {
    const step = j < centre ? 0 : 1;
    if (Math.abs((values[j] ?? 0) - step) > STEP_TOLERANCE) reach = Math.max(reach, Math.abs(j - centre));
  }
  const keep = Math.min(centre, Math.ceil(reach) + 2);
  return values.slice(centre - keep, centre + keep + 1);
}

type Table = Pick<EdgeProfile, 'halfWidthKm' | 'stepKm' | 'values' | 'cumulative'>;

function cumulate(values: Float64Array, stepKm: number): Float64Array {
  const out = new Float64Array(values.length);
  for (let j = 1; j < values.length; j++) {
    out[j] = (out[j - 1] ?? 0) + 0.5 * stepKm * ((values[j - 1] ?? 0) + (values[j] ?? 0));
  }
  return out;
}

/** Fraction of a uniform disc of radius r lying at signed distance below s from a line through its centre. */
function discFractionBelow(sKm: number, radiusKm: number): number {
  if (sKm <= -radiusKm) return 0;
  if (sKm >= radiusKm) return 1;
  const q = sKm / radiusKm;
  return 0.5 + (q * Math.sqrt(1 - q * q) + Math.asin(q)) / Math.PI;
}

// The disc is cut into strips parallel to the edge; each strip's weight is its exact area fraction and its
// light is the band profile averaged across the strip, so coarse strips do not alias the fringes.
function averageOverDisc(band: Table, radiusKm: number): Float64Array {
  const cellKm = Math.max(band.stepKm, (2 * radiusKm) / DISC_CELLS);
  const cells = Math.ceil((2 * radiusKm) / cellKm);
  const offsetsKm: number[] = [];
  const widthsKm: number[] = [];
  const weights: number[] = [];
  for (let k = 0; k < cells; k++) {
    const loKm = -radiusKm + k * cellKm;
    const hiKm = Math.min(radiusKm, loKm + cellKm);
    offsetsKm.push((loKm + hiKm) / 2);
    widthsKm.push(hiKm - loKm);
    weights.push(discFractionBelow(hiKm, radiusKm) - discFractionBelow(loKm, radiusKm));
    if (hiKm >= radiusKm) break;
  }
  const out = new Float64Array(band.values.length);
  for (let j = 0; j < out.length; j++) {
    const xKm = -band.halfWidthKm + j * band.stepKm;
    let sum = 0;
    for (let k = 0; k < offsetsKm.length; k++) {
      sum += (weights[k] ?? 0) * boxMean(band, xKm - (offsetsKm[k] ?? 0), (widthsKm[k] ?? 0) / 2);
    }
    out[j] = sum;
  }
  return out;
}

/** ∫ from −halfWidthKm to x of the profile, extended by the exact step outside the table. */
function integralTo(table: Table, xKm: number): number {
  const { halfWidthKm, stepKm, values, cumulative } = table;
  const last = values.length - 1;
  const offsetKm = xKm + halfWidthKm;
  if (offsetKm <= 0) return 0;
  const endKm = last * stepKm;
  if (offsetKm >= endKm) return (cumulative[last] ?? 0) + (offsetKm - endKm);
  const j = Math.floor(offsetKm / stepKm);
  const tauKm = offsetKm - j * stepKm;
  const v0 = values[j] ?? 0;
  const v1 = values[j + 1] ?? 1;
  return (cumulative[j] ?? 0) + v0 * tauKm + ((v1 - v0) * tauKm * tauKm) / (2 * stepKm);
}

/** The profile at distance x from the edge (positive on the lit side). */
export function profileAt(table: Table, xKm: number): number {
  const { halfWidthKm, stepKm, values } = table;
  const offsetKm = xKm + halfWidthKm;
  if (offsetKm <= 0) return 0;
  const last = values.length - 1;
  if (offsetKm >= last * stepKm) return 1;
  const j = Math.floor(offsetKm / stepKm);
  const f = offsetKm / stepKm - j;
  const v0 = values[j] ?? 0;
  return v0 + f * ((values[j + 1] ?? 1) - v0);
}

/** Mean of the profile over [x − h, x + h]; h = 0 gives the value itself. */
export function boxMean(table: Table, xKm: number, halfKm: number): number {
  if (halfKm <= 0) return profileAt(table, xKm);
  return (integralTo(table, xKm + halfKm) - integralTo(table, xKm - halfKm)) / (2 * halfKm);
}
