// The shapes that cross the geometry package's edge: an event as the event file states it (after
// defaults are applied) and a solution as the solution file states it. docs/file-formats.md describes both.
// Units are in the names; angles are degrees here at the edge and radians inside.

export type TimeScale = 'UTC' | 'TT' | 'TDB';

export interface StarInput {
  raDeg: number;
  decDeg: number;
  catalogEpochJyear: number;
  pmRaCosDecMasPerYear: number;
  pmDecMasPerYear: number;
  parallaxMas: number;
  angularDiameterMas?: number;
}

export interface EphemerisRow {
  /** ISO 8601 time in the ephemeris' declared scale, e.g. "2028-03-14T02:10:00". */
  time: string;
  raDeg: number;
  decDeg: number;
  distanceKm: number;
}

export interface StationInput {
  id: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
}

export interface TimedMark {
  /** ISO 8601 UTC, ending in Z. */
  time: string;
  sigmaSeconds: number;
}

/**
 * A chord on which the star disappeared. It gives both edges, or only one of them (a camera started late,
 * a cloud): at least one of `disappearance` and `reappearance` is present (docs/file-formats.md).
 */
export interface PositiveChordInput {
  station: string;
  type: 'positive';
  disappearance?: TimedMark;
  reappearance?: TimedMark;
  timeOffsetSeconds: number;
}

export interface NegativeChordInput {
  station: string;
  type: 'negative';
  start: string;
  end: string;
  timeOffsetSeconds: number;
}

export type ChordInput = PositiveChordInput | NegativeChordInput;

/**
 * The first time a chord states: a positive chord's disappearance, or its reappearance when it gives only
 * that edge; a negative chord's start. ISO 8601 UTC, as the event file gives it.
 */
export function chordFirstTimeUtc(chord: ChordInput): string {
  if (chord.type === 'negative') return chord.start;
  const edge = chord.disappearance ?? chord.reappearance;
  if (edge === undefined)
    throw new GeometryInputError('chords', 'a positive chord needs a disappearance, a reappearance or both');
  return edge.time;
}

/**
 * A dip's apparent opacity measured on its light curve (the fraction of the star's light it removed) with
 * its 1-sigma; `lowerLimit` when the dip was not resolved or was opaque, so that the value only bounds the
 * opacity from below (docs/method.md, "Ring dips").
 */
export interface DipOpacity {
  value: number;
  sigma: number;
  lowerLimit: boolean;
}

export interface RingEventInput {
  station: string;
  ring: string;
  start: TimedMark;
  end: TimedMark;
  /** Absent when the dip was timed without its depth (by eye, or in a file that does not state it). */
  apparentOpacity?: DipOpacity;
}

export const LIMB_PARAMETERS = [
  'centerFKm',
  'centerGKm',
  'equatorialRadiusKm',
  'oblateness',
  'positionAngleDeg',
] as const;
export type LimbParameter = (typeof LIMB_PARAMETERS)[number];

/**
 * Where a ring's centre comes from: the limb fit's centre (concentric), its own dips ("free"), or one
 * least-squares problem with the limb and every ring sharing one centre ("joint"; docs/method.md,
 * "Joint limb and ring fit").
 */
export const RING_CENTER_SOURCES = ['limb', 'free', 'joint'] as const;
export type RingCenterFrom = (typeof RING_CENTER_SOURCES)[number];

export interface FitOptions {
  limb: {
    fixed: Partial<Record<LimbParameter, number>>;
    modelErrorKm: number;
    fitTimeOffsets: string[];
  };
  ring: { centerFrom: RingCenterFrom };
  seed?: number;
}

export interface EventInput {
  format: 'limbus-event/1';
  title: string;
  star: StarInput;
  ephemeris: { timeScale: TimeScale; rows: EphemerisRow[] };
  earthRotation: { dut1Seconds: number };
  stations: StationInput[];
  chords: ChordInput[];
  ringEvents: RingEventInput[];
  fit: FitOptions;
}

export interface SkyPointKm {
  fKm: number;
  gKm: number;
}

export interface VelocityKmPerS {
  f: number;
  g: number;
}

export interface LimbEllipse {
  centerFKm: number;
  centerGKm: number;
  equatorialRadiusKm: number;
  oblateness: number;
  positionAngleDeg: number;
}

export interface SolutionChord {
  station: string;
  type: 'positive' | 'negative';
  points: Array<SkyPointKm & { event: 'disappearance' | 'reappearance'; sigmaKm: number }>;
  path: SkyPointKm[];
  velocityKmPerS: VelocityKmPerS;
}

/**
 * A covariance matrix in the solution's own units (km, degrees, seconds, none), rows and columns in the
 * order of `parameters`. A parameter held fixed has a row and column of zeros. Solutions stored before
 * covariances were added lack it, hence optional where it appears.
 */
export interface ParameterCovariance {
  parameters: string[];
  matrix: number[][];
}

/** How the limb's 1-sigma were obtained (docs/method.md, "Uncertainties" and "Joint limb and ring fit"). */
export type SigmaMethod = 'sampled' | 'linearised';

/**
 * How well the ensemble sampler explored the region whose spread gives the 1-sigma (docs/method.md, "Sampler
 * diagnostics"): the acceptance fraction of the kept steps and, per sampled parameter, the integrated
 * autocorrelation time in steps of the ensemble and the effective sample size walkers × steps / τ.
 * `cautions` says in words when either is poor; it is empty otherwise.
 */
export interface SamplerDiagnostics {
  walkers: number;
  burnInSteps: number;
  /** Kept steps per walker, after any run made longer for want of effective samples. */
  steps: number;
  acceptanceFraction: number;
  parameters: Array<{ parameter: string; autocorrelationSteps: number; effectiveSamples: number }>;
  cautions: string[];
}

export interface LimbSolution extends LimbEllipse {
  equivalentRadiusKm: number;
  uncertainty: LimbEllipse & { equivalentRadiusKm: number };
  chi2: number;
  dof: number;
  radialResidualsKm: Array<{ station: string; event: 'disappearance' | 'reappearance'; residualKm: number }>;
  negativeChordsClear: boolean;
  timeOffsets: Array<{ station: string; seconds: number; sigma: number }>;
  band: LimbEllipse[];
  /**
   * Order: centerFKm, centerGKm, equatorialRadiusKm, oblateness, positionAngleDeg, then
   * `timeOffsetSeconds <station>` for each fitted clock offset. Absent in solutions stored before it.
   */
  covariance?: ParameterCovariance;
  /** Absent in solutions stored before it (they were all sampled). */
  sigmaMethod?: SigmaMethod;
  /** The sampler's diagnostics when the 1-sigma were sampled; absent for linearised ones and older fits. */
  sampler?: SamplerDiagnostics;
}

/**
 * A ring pole and, where the solution has it, its 1-sigma: RA in degrees of RA (not multiplied by
 * cos Dec), Dec in degrees, and the correlation of the two, propagated to first order from the ring's
 * (B, P) covariance.
 */
export interface RingPole {
  raDeg: number;
  decDeg: number;
  uncertainty?: { raDeg: number; decDeg: number; correlation: number };
}

/** A value and its 1-sigma. */
export interface Measured {
  value: number;
  sigma: number;
}

/**
 * What a dip says about the ring where it was crossed, from its apparent opacity p (light curve), its
 * length L = |v|·(end − start) along the station's track, its radial width W_r in the ring plane and the
 * ring's opening angle B (docs/method.md, "Ring dips"): apparent τ = −ln(1 − p), normal τ_N = τ·|sin B|,
 * apparent equivalent width p·L and depth τ·L, normal equivalent width p·W_r·|sin B| and depth τ_N·W_r.
 * The optical depths and depths are null for an opaque dip; with `lowerLimit` (a dip not resolved, or
 * opaque) the opacity stated is itself a lower bound and every value here bounds the truth from below.
 */
export interface RingCrossingDip {
  lowerLimit: boolean;
  apparentOpacity: Measured;
  apparentOpticalDepth: Measured | null;
  normalOpticalDepth: Measured | null;
  equivalentWidthKm: Measured;
  normalEquivalentWidthKm: Measured;
  equivalentDepthKm: Measured | null;
  normalEquivalentDepthKm: Measured | null;
}

export interface RingCrossing extends SkyPointKm {
  station: string;
  /** |r_end − r_start|: the ring-plane radii of the dip's deprojected start and end points. */
  radialWidthKm: number;
  /**
   * 1-sigma of radialWidthKm from the dip's two timing sigmas and the ring's covariance (absent in
   * solutions stored before it was added).
   */
  radialWidthKmSigma?: number;
  /** Present when the ring event states its apparent opacity. */
  dip?: RingCrossingDip;
}

export interface RingSolution {
  ring: string;
  /** Where the centre came from; "joint" without a positive chord is reported as "free". */
  centerFrom?: RingCenterFrom;
  centerFKm: number;
  centerGKm: number;
  radiusKm: number;
  openingAngleDeg: number;
  positionAngleDeg: number;
  /**
   * 1-sigma. centerFKm/centerGKm: the fitted 1-sigma when the centre is free or joint, the limb centre's
   * 1-sigma when it is taken from the limb (absent in solutions stored before they were added).
   */
  uncertainty: {
    radiusKm: number;
    openingAngleDeg: number;
    positionAngleDeg: number;
    centerFKm?: number;
    centerGKm?: number;
  };
  /** Order: centerFKm, centerGKm, radiusKm, openingAngleDeg, positionAngleDeg. */
  covariance?: ParameterCovariance;
  /** The sampler's diagnostics when the ring was fitted on its own (not jointly); absent in older fits. */
  sampler?: SamplerDiagnostics;
  poles: [RingPole, RingPole];
  crossings: RingCrossing[];
  chi2: number;
  dof: number;
}

export interface AstrometrySolution {
  referenceTimeUtc: string;
  raOffsetCosDecMas: number;
  decOffsetMas: number;
  uncertainty: { raOffsetCosDecMas: number; decOffsetMas: number };
}

export interface Solution {
  format: 'limbus-solution/1';
  chords: SolutionChord[];
  limb: LimbSolution | null;
  rings: RingSolution[];
  astrometry: AstrometrySolution | null;
  engine: { version: string; inputSha256: string; seed: number };
}

/** A problem with the input that a person can fix, located by its JSON path (e.g. "chords[2].end"). */
export class GeometryInputError extends Error {
  constructor(
    readonly path: string,
    readonly detail: string,
  ) {
    super(`${path}: ${detail}`);
    this.name = 'GeometryInputError';
  }
}
