// Times of disappearance and reappearance, and secondary dips, from one station's light curve.
// Model: a square well (baseline outside, bottom inside) whose edges carry the tabulated edge profile
// (Fresnel diffraction over the band and the star's disc), each sample averaged over its exposure.
// The two levels enter linearly and are solved exactly for every trial pair of times, so the search is
// two-dimensional; each time's 1-sigma is the mean half-width of its χ²min + 1 profile, profiling over
// the other time and the levels (Press et al., Numerical Recipes, 3rd ed., §15.6.5, Δχ² = 1 for one
// parameter of interest). A curve that starts or ends inside the event holds one edge: the other is put
// beyond the curve's reach and only the edge the curve holds is timed. Each edge sweeps across the
// station at its own speed (the limb-normal component of the shadow's velocity there).

import { GeometryInputError } from '../types.js';
import { strongestResidualBox, strongestStep } from './box-search.js';
import { Matrix } from 'ml-matrix';

import { normalMatrixCovariance } from '../fit/covariance.js';
import { dipProducts, type DipProducts, type DipResolution, type OpeningAngle } from './dip-products.js';
import type { EdgeProfile } from './edge-profile.js';
import { minimizeAlternating, parabolicMinimum, profileHalfWidth, scanThenRefine } from './minimize.js';
import { WellModel, weightedSeries, type EdgeSpeeds, type WeightedSeries } from './well-model.js';

/** Detection threshold of the main event and of secondary dips, in standard errors of the box mean. */
export const DEFAULT_DETECTION_SIGMA = 6;
/** Longest secondary dip searched for. */
export const MAX_DIP_SECONDS = 30;
const MAX_DIPS = 20;
const MAX_REFITS = 4;
/** Relative change of the residual noise scale below which the refits stop. */
const NOISE_SETTLED = 0.002;
const TIME_TOLERANCE_SECONDS = 1e-7;

export interface TimingInput {
  /** Middle of each exposure, seconds from any origin, strictly increasing. */
  timesSeconds: ArrayLike<number>;
  flux: ArrayLike<number>;
  /** Per-point 1-sigma; when given the weights are 1/fluxErr² with no rescaling. */
  fluxErr?: ArrayLike<number>;
  /** Sky-plane speed of the shadow across the station: the dips' edges, and both main edges by default. */
  speedKmPerS: number;
  /**
   * The limb-normal speed of each main edge (what spreads it); both default to speedKmPerS. For a chord at
   * 0.9 R across a round limb the normal speed is √(1 − 0.9²) ≈ 0.44 of the full speed.
   */
  edgeSpeedsKmPerS?: EdgeSpeeds;
  /** The ring's opening angle B, when known: each dip then also gets its normal optical depth τ·|sin B|. */
  ringOpeningAngle?: OpeningAngle;
  exposureSeconds: number;
  profile: EdgeProfile;
  bottom: 'free' | 'zero';
  detectionSigma?: number;
  /** Dips marked by hand (seconds on the same axis as timesSeconds); fitted and reported whatever their significance. */
  markedDips?: Array<{ startSeconds: number; endSeconds: number }>;
}

export interface TimedEdge {
  timeSeconds: number;
  sigmaSeconds: number;
}

export interface DipResult extends DipProducts {
  start: TimedEdge;
  end: TimedEdge;
  /** √(χ²(no dip) − χ²(dip)). */
  significance: number;
  marked: boolean;
}

export interface TimingResult {
  /** Null when no event was found, or when the curve starts inside the event (it holds no disappearance). */
  disappearance: TimedEdge | null;
  /** Null when no event was found, or when the curve ends inside the event. */
  reappearance: TimedEdge | null;
  /** The speeds the main edges were modelled with. */
  edgeSpeedsKmPerS: EdgeSpeeds;
  baselineFlux: number;
  bottomFlux: number | null;
  /** χ² of the full model (main well and dips); dof subtracts 3 per dip (two times and an opacity). */
  chi2: number;
  dof: number;
  fresnelScaleKm: number;
  starDiameterKm: number;
  /** Flux 1-sigma taken from the residuals when no fluxErr was given; null otherwise. */
  noiseSigmaFlux: number | null;
  /** Significance of the strongest well found, whether or not it passed the threshold. */
  eventSignificance: number;
  dips: DipResult[];
  /** The fitted model at each sample's time (main well and dips). */
  modelFlux: Float64Array;
}

function validate(input: TimingInput): void {
  const { timesSeconds: t, flux, fluxErr } = input;
  const n = t.length;
  if (flux.length !== n) throw new GeometryInputError('flux', `has ${flux.length} values for ${n} times`);
  if (fluxErr !== undefined && fluxErr.length !== n) {
    throw new GeometryInputError('fluxErr', `has ${fluxErr.length} values for ${n} times`);
  }
  const parameters = input.bottom === 'free' ? 4 : 3;
  if (n <= parameters) {
    throw new GeometryInputError('timesSeconds', `fewer points (${n}) than free parameters plus one`);
  }
  for (let i = 0; i < n; i++) {
    const ti = t[i] ?? NaN;
    if (!Number.isFinite(ti)) throw new GeometryInputError(`timesSeconds[${i}]`, 'not a finite number');
    if (i > 0 && !(ti > (t[i - 1] ?? NaN))) {
      throw new GeometryInputError(`timesSeconds[${i}]`, 'times must increase');
    }
    if (!Number.isFinite(flux[i] ?? NaN)) throw new GeometryInputError(`flux[${i}]`, 'not a finite number');
    if (fluxErr !== undefined) {
      const e = fluxErr[i] ?? NaN;
      if (!(Number.isFinite(e) && e > 0))
        throw new GeometryInputError(`fluxErr[${i}]`, 'must be a positive number');
    }
  }
  if (!(input.speedKmPerS > 0)) throw new GeometryInputError('speedKmPerS', 'must be a positive number');
  const b = input.ringOpeningAngle;
  if (b !== undefined) {
    if (!(Math.abs(b.valueDeg) <= 90))
      throw new GeometryInputError('ringOpeningAngle.valueDeg', 'must be within ±90°');
    if (!(b.sigmaDeg >= 0))
      throw new GeometryInputError('ringOpeningAngle.sigmaDeg', 'must be zero or positive');
  }
  const edges = input.edgeSpeedsKmPerS;
  if (edges !== undefined) {
    if (!(edges.disappearanceKmPerS > 0 && Number.isFinite(edges.disappearanceKmPerS)))
      throw new GeometryInputError('edgeSpeedsKmPerS.disappearanceKmPerS', 'must be a positive number');
    if (!(edges.reappearanceKmPerS > 0 && Number.isFinite(edges.reappearanceKmPerS)))
      throw new GeometryInputError('edgeSpeedsKmPerS.reappearanceKmPerS', 'must be a positive number');
  }
  if (!(input.exposureSeconds >= 0))
    throw new GeometryInputError('exposureSeconds', 'must be zero or positive');
}

/**
 * A residual scatter of exactly zero (a noiseless or quantised curve fitted perfectly) would give infinite
 * weights; keep it at a rounding-level fraction of the flux scale instead.
 */
function noiseFloor(sigma: number, flux: ArrayLike<number>): number {
  let scale = 0;
  for (let i = 0; i < flux.length; i++) scale = Math.max(scale, Math.abs(flux[i] ?? 0));
  return Math.max(sigma, 1e-12 * (scale || 1));
}

function medianSpacing(t: ArrayLike<number>): number {
  const d: number[] = [];
  for (let i = 1; i < t.length; i++) d.push((t[i] ?? 0) - (t[i - 1] ?? 0));
  d.sort((a, b) => a - b);
  return d[Math.floor(d.length / 2)] ?? 1;
}

/** Robust white-noise 1-sigma from successive differences (MAD·1.4826/√2), immune to steps and slow trends. */
function differenceScatter(y: ArrayLike<number>): number {
  const d: number[] = [];
  for (let i = 1; i < y.length; i++) d.push((y[i] ?? 0) - (y[i - 1] ?? 0));
  d.sort((a, b) => a - b);
  const med = d[Math.floor(d.length / 2)] ?? 0;
  const dev = d.map((x) => Math.abs(x - med)).sort((a, b) => a - b);
  const robust = (1.4826 * (dev[Math.floor(dev.length / 2)] ?? 0)) / Math.SQRT2;
  if (robust > 0) return robust;
  // Mostly identical successive values (quantised or noiseless data): the RMS difference, then a floor.
  const rms = Math.sqrt(d.reduce((sum, x) => sum + x * x, 0) / Math.max(1, d.length)) / Math.SQRT2;
  return noiseFloor(rms, y);
}

interface Levels {
  chi2: number;
  baseline: number;
  bottom: number;
}

/** Exact weighted least squares of flux = bottom + (baseline − bottom)·I for given sums. */
function solveLevels(s: ReturnType<WellModel['sums']>, wyy: number, bottom: 'free' | 'zero'): Levels {
  if (bottom === 'zero') {
    if (s.swII <= 0) return { chi2: wyy, baseline: 0, bottom: 0 };
    const a = s.swyI / s.swII;
    return { chi2: wyy - a * s.swyI, baseline: a, bottom: 0 };
  }
  const sII = s.swII;
  const sIJ = s.swI - s.swII;
  const sJJ = s.sw - 2 * s.swI + s.swII;
  const syI = s.swyI;
  const syJ = s.swy - s.swyI;
  const det = sII * sJJ - sIJ * sIJ;
  if (!(det > 1e-12 * sII * sJJ)) {
    // No sample sees the well: one level fits everything.
    const mean = s.swy / s.sw;
    return { chi2: wyy - mean * s.swy, baseline: mean, bottom: mean };
  }
  const a = (syI * sJJ - syJ * sIJ) / det;
  const b = (sII * syJ - sIJ * syI) / det;
  return { chi2: wyy - a * syI - b * syJ, baseline: a, bottom: b };
}

interface EdgePairFit {
  t1: number;
  t2: number;
  chi2: number;
  sigma1: number;
  sigma2: number;
}

/** Minimum of χ²(t1, t2) and the Δχ² = 1 half-widths of each time's profile. */
function fitEdgePair(
  chi2: (t1: number, t2: number) => number,
  t1Start: number,
  t2Start: number,
  spanSeconds: number,
  bounds: { lo: number; hi: number },
  firstStepSeconds: number,
  lookFurtherSeconds: number,
  startIsMinimum = false,
): EdgePairFit {
  const best = startIsMinimum
    ? { x: t1Start, y: t2Start, fxy: chi2(t1Start, t2Start) }
    : minimizeAlternating(chi2, t1Start, t2Start, {
        span: spanSeconds,
        tolerance: TIME_TOLERANCE_SECONDS,
        bounds,
      });
  // The inner minimisation may find a slightly lower χ² than the outer one did; the lowest seen is the minimum.
  let chi2Min = best.fxy;
  // The other time barely moves as one is profiled (it is coupled only through the levels, or through
  // the dip's depth), so a warm-started parabolic step on a small stencil re-minimises it.
  let warm2 = best.y;
  let warm1 = best.x;
  const profile1 = (t1: number): number => {
    const m = parabolicMinimum((t2) => chi2(t1, t2), warm2, firstStepSeconds, bounds);
    warm2 = m.x;
    chi2Min = Math.min(chi2Min, m.fx);
    return m.fx;
  };
  const profile2 = (t2: number): number => {
    const m = parabolicMinimum((t1) => chi2(t1, t2), warm1, firstStepSeconds, bounds);
    warm1 = m.x;
    chi2Min = Math.min(chi2Min, m.fx);
    return m.fx;
  };
  profile1(best.x);
  profile2(best.y);
  const tol = Math.max(TIME_TOLERANCE_SECONDS, firstStepSeconds * 1e-3);
  const halfWidths = (g: (t: number) => number, screen: (t: number) => number, t: number): number => {
    warm1 = best.x;
    warm2 = best.y;
    const up = profileHalfWidth(
      g,
      t,
      chi2Min,
      1,
      firstStepSeconds,
      bounds.hi,
      tol,
      lookFurtherSeconds,
      screen,
    );
    const down = profileHalfWidth(
      g,
      t,
      chi2Min,
      -1,
      firstStepSeconds,
      bounds.lo,
      tol,
      lookFurtherSeconds,
      screen,
    );
    return (up + down) / 2;
  };
  return {
    t1: best.x,
    t2: best.y,
    chi2: chi2Min,
    sigma1: halfWidths(profile1, (t1) => chi2(t1, best.y), best.x),
    sigma2: halfWidths(profile2, (t2) => chi2(best.x, t2), best.y),
  };
}

/**
 * Minimum of a one-time χ² (an edge whose partner lies outside the curve) and the mean half-width of its
 * Δχ² = 1 interval; the levels are solved exactly inside χ², so this is already the profile.
 */
function fitOneEdge(
  chi2: (t: number) => number,
  tStart: number,
  spanSeconds: number,
  bounds: { lo: number; hi: number },
  firstStepSeconds: number,
  lookFurtherSeconds: number,
): { t: number; chi2: number; sigma: number } {
  let t = Math.min(bounds.hi, Math.max(bounds.lo, tStart));
  let best = chi2(t);
  let span = spanSeconds;
  for (let round = 0; round < 40; round++) {
    const m = scanThenRefine(
      chi2,
      Math.max(bounds.lo, t - span),
      Math.min(bounds.hi, t + span),
      20,
      TIME_TOLERANCE_SECONDS,
    );
    const moved = Math.abs(m.x - t);
    if (m.fx <= best) {
      t = m.x;
      best = m.fx;
    }
    if (moved <= TIME_TOLERANCE_SECONDS) break;
    span = Math.max(4 * moved, 20 * TIME_TOLERANCE_SECONDS, span / 4);
  }
  const tol = Math.max(TIME_TOLERANCE_SECONDS, firstStepSeconds * 1e-3);
  const half = (direction: 1 | -1): number =>
    profileHalfWidth(
      chi2,
      t,
      best,
      direction,
      firstStepSeconds,
      direction > 0 ? bounds.hi : bounds.lo,
      tol,
      lookFurtherSeconds,
    );
  return { t, chi2: best, sigma: (half(1) + half(-1)) / 2 };
}

/** Which edge of the event lies outside the light curve (the curve starts or ends inside the event). */
export type EdgeOutside = 'disappearance' | 'reappearance' | null;

/** The main well's fit, as the dip search needs it. */
export interface MainEventFit {
  input: TimingInput;
  model: WellModel;
  /** The dips' model: both edges at the full sky-plane speed. */
  dipModel: WellModel;
  weights: Float64Array;
  series: WeightedSeries;
  levels: Levels;
  /** With an edge outside the curve, its time is a stand-in beyond the curve's reach and its sigma NaN. */
  edges: EdgePairFit;
  outside: EdgeOutside;
  cadenceSeconds: number;
  smoothSeconds: number;
  /** The dips' smoothing (full speed). */
  dipSmoothSeconds: number;
  threshold: number;
  noiseSigmaFlux: number | null;
  eventSignificance: number;
  /** Main-well model at each sample. */
  modelFlux: Float64Array;
}

interface Start {
  t1: number;
  t2: number;
  outside: EdgeOutside;
  /** Null when fluxErr gives the weights. */
  noiseSigmaFlux: number | null;
}

/** The edge speeds a timing models: the given ones, or the full speed for both. */
export function edgeSpeedsOf(input: Pick<TimingInput, 'speedKmPerS' | 'edgeSpeedsKmPerS'>): EdgeSpeeds {
  return (
    input.edgeSpeedsKmPerS ?? {
      disappearanceKmPerS: input.speedKmPerS,
      reappearanceKmPerS: input.speedKmPerS,
    }
  );
}

/**
 * Detects the main well and fits its two times (or the one the curve holds) and two levels; null when no
 * well passes the detection threshold. `restart` (internal) refits from a known solution with a known
 * noise scale.
 */
export function fitMainEvent(input: TimingInput, restart?: Start): MainEventFit | null {
  validate(input);
  const { timesSeconds: t, flux, profile } = input;
  const n = t.length;
  const threshold = input.detectionSigma ?? DEFAULT_DETECTION_SIGMA;
  const cadenceSeconds = medianSpacing(t);
  const speeds = edgeSpeedsOf(input);
  const slowest = Math.min(speeds.disappearanceKmPerS, speeds.reappearanceKmPerS);
  const model = new WellModel(t, profile, speeds, input.exposureSeconds);
  const full = { disappearanceKmPerS: input.speedKmPerS, reappearanceKmPerS: input.speedKmPerS };
  const dipModel = new WellModel(t, profile, full, input.exposureSeconds);
  const spread = profile.fresnelScaleKm + profile.starDiameterKm / 2;
  const smoothSeconds = spread / slowest + input.exposureSeconds / 2;
  const dipSmoothSeconds = spread / input.speedKmPerS + input.exposureSeconds / 2;
  const bounds = { lo: t[0] ?? 0, hi: t[n - 1] ?? 0 };
  const span = 2 * Math.max(cadenceSeconds, smoothSeconds);
  const firstStep = Math.max(cadenceSeconds / 20, 1e-5);
  // An edge outside the curve stands beyond the reach of every sample's exposure: no sample sees it.
  const beyond = model.zoneSeconds + cadenceSeconds;
  const virtual = { disappearance: bounds.lo - beyond, reappearance: bounds.hi + beyond };

  let t1Start: number;
  let t2Start: number;
  let outside: EdgeOutside;
  let eventSignificance = Infinity;
  const weights = new Float64Array(n);
  if (restart === undefined) {
    // Detection weights: the given errors, or one robust scatter for all points.
    const scatter = differenceScatter(flux);
    for (let i = 0; i < n; i++) {
      const e = input.fluxErr?.[i] ?? scatter;
      weights[i] = e > 0 ? 1 / (e * e) : 1;
    }
    const step = strongestStep(flux, weights);
    eventSignificance = step?.significance ?? 0;
    if (step === null || !(step.significance >= threshold)) return null;
    // A curve that starts (ends) inside the event holds only the reappearance (disappearance).
    outside = step.lo === 0 ? 'disappearance' : step.hi === n ? 'reappearance' : null;
    t1Start =
      outside === 'disappearance' ? virtual.disappearance : ((t[step.lo - 1] ?? 0) + (t[step.lo] ?? 0)) / 2;
    t2Start =
      outside === 'reappearance' ? virtual.reappearance : ((t[step.hi - 1] ?? 0) + (t[step.hi] ?? 0)) / 2;
  } else {
    t1Start = restart.t1;
    t2Start = restart.t2;
    outside = restart.outside;
  }
  const parameters = (input.bottom === 'free' ? 4 : 3) - (outside === null ? 0 : 1);

  for (let i = 0; i < n; i++) {
    const e = input.fluxErr?.[i] ?? restart?.noiseSigmaFlux ?? undefined;
    weights[i] = e === undefined ? 1 : 1 / (e * e);
  }
  let series = weightedSeries(flux, weights);
  // A well whose reappearance precedes its disappearance is no well at all: one level for everything.
  const chi2Of = (s: WeightedSeries) => (t1: number, t2: number) =>
    t2 > t1
      ? solveLevels(model.sums(t1, t2, s, 0, n), s.wyyTotal, input.bottom).chi2
      : s.wyyTotal - ((s.wy[n] ?? 0) * (s.wy[n] ?? 0)) / (s.w[n] ?? 1);
  /** The fit of the edges the curve holds, from a start. */
  const fitEdges = (s: WeightedSeries, t1: number, t2: number, startIsMinimum: boolean): EdgePairFit => {
    const chi2 = chi2Of(s);
    if (outside === 'disappearance') {
      const one = fitOneEdge((x) => chi2(virtual.disappearance, x), t2, span, bounds, firstStep, span / 2);
      return { t1: virtual.disappearance, t2: one.t, chi2: one.chi2, sigma1: NaN, sigma2: one.sigma };
    }
    if (outside === 'reappearance') {
      const one = fitOneEdge((x) => chi2(x, virtual.reappearance), t1, span, bounds, firstStep, span / 2);
      return { t1: one.t, t2: virtual.reappearance, chi2: one.chi2, sigma1: one.sigma, sigma2: NaN };
    }
    return fitEdgePair(chi2, t1, t2, span, bounds, firstStep, span / 2, startIsMinimum);
  };

  let noiseSigmaFlux: number | null = restart?.noiseSigmaFlux ?? null;
  let startIsMinimum = false;
  if (input.fluxErr === undefined && restart === undefined) {
    // Unit weights first; the residual scatter of that fit is the noise scale (no errors were given).
    let firstChi2: number;
    if (outside === null) {
      const first = minimizeAlternating(chi2Of(series), t1Start, t2Start, {
        span,
        tolerance: TIME_TOLERANCE_SECONDS,
        bounds,
      });
      [t1Start, t2Start, firstChi2] = [first.x, first.y, first.fxy];
      // Uniform weights rescaled by one factor leave the minimum where the first pass found it.
      startIsMinimum = true;
    } else {
      const first = fitEdges(series, t1Start, t2Start, false);
      [t1Start, t2Start, firstChi2] = [first.t1, first.t2, first.chi2];
    }
    const sigma = noiseFloor(Math.sqrt(Math.max(0, firstChi2) / (n - parameters)), flux);
    noiseSigmaFlux = sigma;
    weights.fill(1 / (sigma * sigma));
    series = weightedSeries(flux, weights);
  }
  const edges = fitEdges(series, t1Start, t2Start, startIsMinimum);
  const levels = solveLevels(model.sums(edges.t1, edges.t2, series, 0, n), series.wyyTotal, input.bottom);
  const modelFlux = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const I = model.intensityAt(t[i] ?? 0, edges.t1, edges.t2);
    modelFlux[i] = levels.bottom + (levels.baseline - levels.bottom) * I;
  }
  return {
    input,
    model,
    dipModel,
    weights,
    series,
    levels,
    edges,
    outside,
    cadenceSeconds,
    smoothSeconds,
    dipSmoothSeconds,
    threshold,
    noiseSigmaFlux,
    eventSignificance,
    modelFlux,
  };
}

export function fitTiming(input: TimingInput): TimingResult {
  let main = fitMainEvent(input);
  if (main === null) return noEventResult(input);
  let dips = searchDips(main);
  const n = input.timesSeconds.length;
  const parameters = (input.bottom === 'free' ? 4 : 3) - (main.outside === null ? 0 : 1);
  // The dips pulled the baseline level down and (without fluxErr) inflated the residual scatter: fit the
  // main well again to the light with the dips' deficit restored, with the noise of the full model's
  // residuals, then the dips again on top of it, until the noise scale settles.
  for (let pass = 0; pass < MAX_REFITS && dips.length > 0; pass++) {
    const full = fullModel(main, dips);
    const corrected = new Float64Array(n);
    let rss = 0;
    for (let i = 0; i < n; i++) {
      const y = input.flux[i] ?? 0;
      corrected[i] = y + (main.modelFlux[i] ?? 0) - (full[i] ?? 0);
      rss += (y - (full[i] ?? 0)) ** 2;
    }
    const noiseSigmaFlux =
      input.fluxErr === undefined
        ? noiseFloor(Math.sqrt(rss / Math.max(1, n - parameters - 3 * dips.length)), input.flux)
        : null;
    const previousNoise = main.noiseSigmaFlux;
    const refit = fitMainEvent(
      { ...input, flux: corrected },
      { t1: main.edges.t1, t2: main.edges.t2, outside: main.outside, noiseSigmaFlux },
    );
    if (refit === null) break;
    refit.input = input;
    refit.eventSignificance = main.eventSignificance;
    main = refit;
    dips = searchDips(main, dips);
    // With fluxErr the weights never change, so one refit of the levels is enough.
    if (noiseSigmaFlux === null) break;
    if (previousNoise !== null && Math.abs(noiseSigmaFlux / previousNoise - 1) < NOISE_SETTLED) break;
  }
  const { levels, edges, outside } = main;
  const modelFlux = fullModel(main, dips);
  let chi2 = 0;
  for (let i = 0; i < n; i++)
    chi2 += (main.weights[i] ?? 0) * ((input.flux[i] ?? 0) - (modelFlux[i] ?? 0)) ** 2;
  return {
    disappearance: outside === 'disappearance' ? null : { timeSeconds: edges.t1, sigmaSeconds: edges.sigma1 },
    reappearance: outside === 'reappearance' ? null : { timeSeconds: edges.t2, sigmaSeconds: edges.sigma2 },
    edgeSpeedsKmPerS: edgeSpeedsOf(input),
    baselineFlux: levels.baseline,
    bottomFlux: levels.bottom,
    chi2,
    dof: n - parameters - 3 * dips.length,
    fresnelScaleKm: input.profile.fresnelScaleKm,
    starDiameterKm: input.profile.starDiameterKm,
    noiseSigmaFlux: main.noiseSigmaFlux,
    eventSignificance: main.eventSignificance,
    dips,
    modelFlux,
  };
}

function fullModel(main: MainEventFit, dips: DipResult[]): Float64Array {
  const t = main.input.timesSeconds;
  const out = Float64Array.from(main.modelFlux);
  const starFlux = main.levels.baseline - main.levels.bottom;
  for (const dip of dips) {
    for (let i = 0; i < out.length; i++) {
      const J = 1 - main.dipModel.intensityAt(t[i] ?? 0, dip.start.timeSeconds, dip.end.timeSeconds);
      out[i] = (out[i] ?? 0) - dip.apparentOpacity * starFlux * J;
    }
  }
  return out;
}

function noEventResult(input: TimingInput): TimingResult {
  const { flux } = input;
  const n = flux.length;
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const e = input.fluxErr?.[i];
    weights[i] = e === undefined ? 1 : 1 / (e * e);
  }
  const scatter = differenceScatter(flux);
  const detectionWeights = weights.map((w, i) =>
    input.fluxErr?.[i] === undefined ? 1 / (scatter * scatter) : w,
  );
  const eventSignificance = strongestStep(flux, detectionWeights)?.significance ?? 0;
  let sw = 0;
  let swy = 0;
  for (let i = 0; i < n; i++) {
    sw += weights[i] ?? 0;
    swy += (weights[i] ?? 0) * (flux[i] ?? 0);
  }
  const mean = swy / sw;
  let chi2 = 0;
  for (let i = 0; i < n; i++) chi2 += (weights[i] ?? 0) * ((flux[i] ?? 0) - mean) ** 2;
  let noiseSigmaFlux: number | null = null;
  if (input.fluxErr === undefined) {
    noiseSigmaFlux = Math.sqrt(chi2 / (n - 1));
    chi2 = n - 1;
  }
  return {
    disappearance: null,
    reappearance: null,
    edgeSpeedsKmPerS: edgeSpeedsOf(input),
    baselineFlux: mean,
    bottomFlux: null,
    chi2,
    dof: n - 1,
    fresnelScaleKm: input.profile.fresnelScaleKm,
    starDiameterKm: input.profile.starDiameterKm,
    noiseSigmaFlux,
    eventSignificance,
    dips: [],
    modelFlux: new Float64Array(n).fill(mean),
  };
}

/**
 * Secondary dips outside the main event: boxes of one sample to MAX_DIP_SECONDS in the main fit's
 * residuals passing the detection threshold, strongest first, plus every dip marked by hand; each is
 * then fitted as a scaled well. `previous` (internal) refits known dips instead of searching again.
 */
export function searchDips(main: MainEventFit, previous?: DipResult[]): DipResult[] {
  const { input, dipModel, modelFlux, weights, levels, edges, cadenceSeconds: cadence, smoothSeconds } = main;
  const { timesSeconds: t, flux } = input;
  const n = t.length;
  const starFlux = levels.baseline - levels.bottom;
  if (!(starFlux > 0)) return [];
  const residuals = new Float64Array(n);
  for (let i = 0; i < n; i++) residuals[i] = (flux[i] ?? 0) - (modelFlux[i] ?? 0);
  const series = weightedSeries(residuals, weights);

  const windows: Array<{ start: number; end: number; marked: boolean }> = [];
  if (previous !== undefined) {
    for (const d of previous)
      windows.push({ start: d.start.timeSeconds, end: d.end.timeSeconds, marked: d.marked });
  } else {
    // Inside the main event (and across its smoothed edges) there is no starlight for a dip to remove.
    const blocked = new Uint8Array(n);
    const guard = 2 * smoothSeconds + cadence;
    for (let i = 0; i < n; i++) {
      const ti = t[i] ?? 0;
      if (ti > edges.t1 - guard && ti < edges.t2 + guard) blocked[i] = 1;
    }
    for (const mark of input.markedDips ?? []) {
      windows.push({ start: mark.startSeconds, end: mark.endSeconds, marked: true });
      for (let i = 0; i < n; i++) {
        const ti = t[i] ?? 0;
        if (ti >= mark.startSeconds - cadence && ti <= mark.endSeconds + cadence) blocked[i] = 1;
      }
    }
    const maxWidth = Math.max(1, Math.ceil(MAX_DIP_SECONDS / cadence));
    for (let k = 0; k < MAX_DIPS; k++) {
      const box = strongestResidualBox(residuals, weights, blocked, maxWidth);
      if (box === null || !(box.significance >= main.threshold)) break;
      const start = box.lo > 0 ? ((t[box.lo - 1] ?? 0) + (t[box.lo] ?? 0)) / 2 : (t[0] ?? 0);
      const end = box.hi < n ? ((t[box.hi - 1] ?? 0) + (t[box.hi] ?? 0)) / 2 : (t[n - 1] ?? 0);
      windows.push({ start, end, marked: false });
      const margin = box.hi - box.lo;
      for (let i = Math.max(0, box.lo - margin); i < Math.min(n, box.hi + margin); i++) blocked[i] = 1;
    }
  }

  const dips: DipResult[] = [];
  for (const w of windows) {
    const resolution = {
      fresnelScaleKm: input.profile.fresnelScaleKm,
      starDiameterKm: input.profile.starDiameterKm,
      exposureKm: input.speedKmPerS * input.exposureSeconds,
    };
    const dip = fitDip(
      dipModel,
      series,
      w,
      starFlux,
      cadence,
      main.dipSmoothSeconds,
      resolution,
      input.ringOpeningAngle,
    );
    if (dip !== null) dips.push({ ...dip, marked: w.marked });
  }
  return dips.sort((a, b) => a.start.timeSeconds - b.start.timeSeconds);
}

/**
 * One dip as the same smoothed well scaled by its opacity, on top of the main fit's residuals:
 * r = −c·(1 − I(t; start, end)), c = opacity·(baseline − bottom) with 0 ≤ opacity ≤ 1. χ² is measured
 * from the no-dip fit, so its minimum is −(significance²). The times' 1-sigma are the Δχ² = 1 profile
 * half-widths; the products' come from the linearised covariance of (start, end, opacity).
 */
function fitDip(
  model: WellModel,
  residuals: WeightedSeries,
  { start, end }: { start: number; end: number },
  starFlux: number,
  cadence: number,
  smoothSeconds: number,
  resolution: DipResolution,
  openingAngle: OpeningAngle | undefined,
): Omit<DipResult, 'marked'> | null {
  const t = model.timesSeconds;
  const n = t.length;
  const reach = Math.max(end - start, 2 * smoothSeconds + 2 * cadence, model.zoneSeconds);
  const lo = model.lowerBound(start - reach);
  const hi = model.lowerBound(end + reach);
  if (hi - lo < 3) return null;
  const depthOf = (t1: number, t2: number): { c: number; chi2: number } => {
    if (!(t2 > t1)) return { c: 0, chi2: 0 };
    const s = model.sums(t1, t2, residuals, lo, hi);
    const sJJ = s.sw - 2 * s.swI + s.swII;
    const srJ = s.swy - s.swyI;
    if (!(sJJ > 0)) return { c: 0, chi2: 0 };
    const c = Math.min(starFlux, Math.max(0, -srJ / sJJ));
    return { c, chi2: 2 * c * srJ + c * c * sJJ };
  };
  const chi2 = (t1: number, t2: number): number => depthOf(t1, t2).chi2;
  const bounds = { lo: t[lo] ?? 0, hi: t[Math.min(n, hi) - 1] ?? 0 };
  const span = Math.max(cadence, smoothSeconds, (end - start) / 4);
  const fit = fitEdgePair(chi2, start, end, span, bounds, Math.max(cadence / 20, 1e-5), span / 2);
  const { c } = depthOf(fit.t1, fit.t2);
  const opacity = c / starFlux;
  const speedKmPerS = model.speeds.disappearanceKmPerS;
  const cov = dipCovariance(model, residuals, lo, hi, fit.t1, fit.t2, opacity, starFlux);
  return {
    start: { timeSeconds: fit.t1, sigmaSeconds: fit.sigma1 },
    end: { timeSeconds: fit.t2, sigmaSeconds: fit.sigma2 },
    ...dipProducts(
      { startSeconds: fit.t1, endSeconds: fit.t2, opacity },
      cov,
      speedKmPerS,
      resolution,
      openingAngle,
    ),
    significance: Math.sqrt(Math.max(0, -fit.chi2)),
  };
}

/**
 * (JᵀWJ)⁻¹ of the dip model m_i = −opacity·S·(1 − I_i(start, end)) over samples [lo, hi), J by central
 * differences in the times (a few table nodes wide, where the interpolated profile is piecewise linear)
 * and exactly in the opacity (Numerical Recipes 3rd ed., §15.5.1). Null when the normal matrix is
 * singular (no sample sees an edge move).
 */
function dipCovariance(
  model: WellModel,
  series: WeightedSeries,
  lo: number,
  hi: number,
  t1: number,
  t2: number,
  opacity: number,
  starFlux: number,
): number[][] | null {
  const t = model.timesSeconds;
  const h = Math.max((2 * model.profile.stepKm) / model.speeds.disappearanceKmPerS, 1e-7);
  const jac = new Matrix(hi - lo, 3);
  const c = opacity * starFlux;
  for (let i = lo; i < hi; i++) {
    const ti = t[i] ?? 0;
    const root = Math.sqrt(series.weights[i] ?? 0);
    const I = (a: number, b: number): number => model.intensityAt(ti, a, b);
    jac.set(i - lo, 0, root * c * ((I(t1 + h, t2) - I(t1 - h, t2)) / (2 * h)));
    jac.set(i - lo, 1, root * c * ((I(t1, t2 + h) - I(t1, t2 - h)) / (2 * h)));
    jac.set(i - lo, 2, -root * starFlux * (1 - I(t1, t2)));
  }
  try {
    return normalMatrixCovariance(jac, new Map(), () => new Error('singular')).to2DArray();
  } catch {
    return null;
  }
}
