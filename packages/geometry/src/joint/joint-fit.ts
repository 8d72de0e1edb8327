// One ring pole (RA, Dec) and one ring radius fitted to the crossings of one ring in several events at
// once. Each event sees the same circular ring, in the plane normal to the pole, through its own sky
// plane: there it is an ellipse of semi-major axis R, semi-minor axis R·|sin B| and semi-minor axis at
// position angle P, where B and P are the pole's aspect in that sky plane (./pole.ts). The residuals
// and weights are those of the single-event ring fit (./ring-residual.ts: the apparent radial residual
// over σt·max(|v·∇ρ|, 0.1|v|)), so χ² here is the sum of the single-event χ² values.
//
// One event alone cannot tell the pole p from its mirror image in the sky plane (B → −B, same P): both
// project to the same ellipse. Events seen from different directions can. The fit is therefore run in
// each of the two pole families (the sign of B, in the first event's sky plane, of the pole end whose
// position angle there lies in [0°, 180°)), each family with its own grid of starts, and the two best
// fits are compared.

import { Matrix, SingularValueDecomposition } from 'ml-matrix';

import { jacobian, levenbergMarquardt, type LeastSquaresProblem } from '../fit/levenberg-marquardt.js';
import { DEG, PI, RAD, wrap } from '../math.js';
import { GeometryInputError, type SkyPointKm, type VelocityKmPerS } from '../types.js';
import { normalisedRingResidual, type ApparentRing } from './ring-residual.js';
import {
  poleAspect,
  poleFromAspect,
  raDecFromUnit,
  unitFromRaDec,
  type SkyTriad,
  type Vec3,
} from './pole.js';

export interface JointCrossing {
  station: string;
  fKm: number;
  gKm: number;
  sigmaSeconds: number;
  velocity: VelocityKmPerS;
}

export interface JointEvent {
  title: string;
  triad: SkyTriad;
  /** The limb centre in this event's sky plane, or null to fit the ring centre freely. */
  center: SkyPointKm | null;
  crossings: JointCrossing[];
  /** JSON path or file name that input errors about this event should name. */
  errorPath: string;
}

export interface JointPoleFit {
  pole: { raDeg: number; decDeg: number };
  /** 1-sigma, multiplied by sigmaScale; RA in degrees of RA (not multiplied by cos Dec). */
  uncertainty: { raDeg: number; decDeg: number };
  /** Correlation of the pole's RA and Dec (unchanged by the scaling). */
  raDecCorrelation: number;
  radiusKm: number;
  radiusSigmaKm: number;
  chi2: number;
  dof: number;
  /** χ²/dof, null without degrees of freedom. */
  reducedChi2: number | null;
  /** √(χ²/dof) when that exceeds 1, else 1: the factor the linearised 1-sigma were multiplied by. */
  sigmaScale: number;
  /** The other family's best χ² minus this one's (a tie of one event may leave it a hair below 0). */
  familyDeltaChi2: number;
  /** What a reader must know about these numbers, in words (scaling, the family comparison). */
  notes: string[];
  events: Array<{ title: string; openingAngleDeg: number; positionAngleDeg: number; center: SkyPointKm }>;
  ambiguityResolved: boolean;
  /** Best fit in the other pole family, for saying which pole the data leave standing. */
  alternative: { pole: { raDeg: number; decDeg: number }; radiusKm: number; chi2: number };
}

/** The other family is ruled out when its best χ² is larger by more than this (3σ for one parameter). */
export const AMBIGUITY_DELTA_CHI2 = 9;

/** Relative χ² difference below which the two families count as equally good. */
const TIE_CHI2 = 1e-9;
/** Opening angles and position angles (degrees, in the first event's sky plane) of the grid of starts. */
const START_OPENING_DEG = [8, 25, 45, 65, 82];
const START_POSITION_DEG = [10, 40, 70, 100, 130, 160];

interface Layout {
  /** Index of each event's centre (f, g) in the parameter vector, or −1 for a fixed centre. */
  centerIndex: number[];
  size: number;
}

function layoutOf(events: readonly JointEvent[]): Layout {
  let next = 3;
  const centerIndex = events.map((e) => (e.center === null ? ((next += 2), next - 2) : -1));
  return { centerIndex, size: next };
}

function centerOf(events: readonly JointEvent[], layout: Layout, x: Float64Array, k: number): SkyPointKm {
  const ix = layout.centerIndex[k] as number;
  return (events[k] as JointEvent).center ?? { fKm: x[ix] as number, gKm: x[ix + 1] as number };
}

/** Normalised residuals of every crossing for pole p, radius R and the centres held in x. */
function residualsFor(
  events: readonly JointEvent[],
  layout: Layout,
  pole: Vec3,
  radiusKm: number,
  x: Float64Array,
  out: Float64Array,
): void {
  let i = 0;
  events.forEach((event, k) => {
    const { openingRad, positionRad } = poleAspect(pole, event.triad);
    const center = centerOf(events, layout, x, k);
    const ring: ApparentRing = {
      centerFKm: center.fKm,
      centerGKm: center.gKm,
      semiMajorKm: radiusKm,
      semiMinorKm: radiusKm * Math.abs(Math.sin(openingRad)),
      cosP: Math.cos(positionRad),
      sinP: Math.sin(positionRad),
    };
    for (const c of event.crossings)
      out[i++] = normalisedRingResidual(c.fKm, c.gKm, c.sigmaSeconds, c.velocity, ring);
  });
}

/**
 * The pole of one family from two unbounded parameters: B = ±(π/2)·sin²(β/2) and P = π·sin²(φ/2) in the
 * first event's sky plane, so that every β, φ stays inside the family and the minimiser needs no bounds.
 */
function familyPole(family: 1 | -1, beta: number, phi: number, first: SkyTriad): Vec3 {
  const opening = family * (PI / 2) * Math.sin(beta / 2) ** 2;
  const position = PI * Math.sin(phi / 2) ** 2;
  return poleFromAspect(opening, position, first);
}

function familyParameter(angleRad: number, span: number): number {
  return 2 * Math.asin(Math.sqrt(angleRad / span));
}

function countPoints(events: readonly JointEvent[]): number {
  return events.reduce((n, e) => n + e.crossings.length, 0);
}

/** Ring-plane radius of each crossing for a pole and fixed centres; their median starts R. */
function startRadiusKm(events: readonly JointEvent[], pole: Vec3, centers: SkyPointKm[]): number {
  const radii: number[] = [];
  events.forEach((event, k) => {
    const { openingRad, positionRad } = poleAspect(pole, event.triad);
    const sinB = Math.max(Math.abs(Math.sin(openingRad)), 1e-3);
    const c = centers[k] as SkyPointKm;
    for (const p of event.crossings) {
      const df = p.fKm - c.fKm;
      const dg = p.gKm - c.gKm;
      const across = df * Math.cos(positionRad) - dg * Math.sin(positionRad);
      const along = df * Math.sin(positionRad) + dg * Math.cos(positionRad);
      radii.push(Math.hypot(across, along / sinB));
    }
  });
  radii.sort((a, b) => a - b);
  return radii[Math.floor(radii.length / 2)] as number;
}

interface FamilyFit {
  pole: Vec3;
  radiusKm: number;
  chi2: number;
  /** The full parameter vector: [β, φ, R, centres…]. */
  x: Float64Array;
}

function fitFamily(events: readonly JointEvent[], layout: Layout, family: 1 | -1): FamilyFit {
  const first = (events[0] as JointEvent).triad;
  const n = countPoints(events);
  const problem: LeastSquaresProblem = {
    residuals(x) {
      const out = new Float64Array(n);
      residualsFor(
        events,
        layout,
        familyPole(family, x[0] as number, x[1] as number, first),
        x[2] as number,
        x,
        out,
      );
      return out;
    },
    stepSizes: new Float64Array(layout.size).fill(1e-4),
    admissible: (x) => ((x[2] as number) > 0 ? x : null),
  };
  const startCenters = events.map(
    (e) =>
      e.center ?? {
        fKm: e.crossings.reduce((s, c) => s + c.fKm, 0) / e.crossings.length,
        gKm: e.crossings.reduce((s, c) => s + c.gKm, 0) / e.crossings.length,
      },
  );
  let best: FamilyFit | null = null;
  for (const openingDeg of START_OPENING_DEG) {
    for (const positionDeg of START_POSITION_DEG) {
      const start = new Float64Array(layout.size);
      start[0] = familyParameter(openingDeg * DEG, PI / 2);
      start[1] = familyParameter(positionDeg * DEG, PI);
      const pole = familyPole(family, start[0], start[1], first);
      start[2] = startRadiusKm(events, pole, startCenters);
      layout.centerIndex.forEach((ix, k) => {
        if (ix < 0) return;
        start[ix] = (startCenters[k] as SkyPointKm).fKm;
        start[ix + 1] = (startCenters[k] as SkyPointKm).gKm;
      });
      const result = levenbergMarquardt(problem, start);
      if (!Number.isFinite(result.chi2) || (best !== null && result.chi2 >= best.chi2)) continue;
      best = {
        pole: familyPole(family, result.x[0] as number, result.x[1] as number, first),
        radiusKm: result.x[2] as number,
        chi2: result.chi2,
        x: result.x,
      };
    }
  }
  if (best === null)
    throw new GeometryInputError('ringEvents', 'the joint pole fit found no finite χ² from any start');
  return best;
}

/**
 * Linearised 1σ of (RA, Dec, R) at the best fit: (JᵀJ)⁻¹ of the normalised residuals with respect to RA
 * and Dec of the pole (radians), R and the free centres, not scaled by χ²/dof (as the single-event fits).
 */
function linearisedSigma(
  events: readonly JointEvent[],
  layout: Layout,
  fit: FamilyFit,
): { raRad: number; decRad: number; radiusKm: number; raDecCorrelation: number } {
  const n = countPoints(events);
  const { raRad, decRad } = raDecFromUnit(fit.pole);
  const x0 = new Float64Array(fit.x);
  x0[0] = raRad;
  x0[1] = decRad;
  const steps = new Float64Array(layout.size).fill(1e-4);
  steps[0] = 1e-7;
  steps[1] = 1e-7;
  const problem: LeastSquaresProblem = {
    residuals(x) {
      const out = new Float64Array(n);
      residualsFor(events, layout, unitFromRaDec(x[0] as number, x[1] as number), x[2] as number, x, out);
      return out;
    },
    stepSizes: steps,
    admissible: (x) => x,
  };
  const j = jacobian(problem, x0);
  const normal = j.transpose().mmul(j);
  const svd = new SingularValueDecomposition(normal);
  const values = svd.diagonal;
  const largest = Math.max(...values);
  if (!(values.every((v) => v > largest * 1e-12) && largest > 0))
    throw new GeometryInputError(
      'ringEvents',
      'the ring crossings do not constrain the pole and radius (the normal matrix is singular)',
    );
  const covariance: Matrix = svd.inverse();
  const sigmaRa = Math.sqrt(covariance.get(0, 0));
  const sigmaDec = Math.sqrt(covariance.get(1, 1));
  return {
    raRad: sigmaRa,
    decRad: sigmaDec,
    radiusKm: Math.sqrt(covariance.get(2, 2)),
    raDecCorrelation: Math.max(-1, Math.min(1, covariance.get(0, 1) / (sigmaRa * sigmaDec))),
  };
}

function toRaDecDeg(pole: Vec3): { raDeg: number; decDeg: number } {
  const { raRad, decRad } = raDecFromUnit(pole);
  return { raDeg: raRad * RAD, decDeg: decRad * RAD };
}

/** The pole end whose position angle in the first event's sky plane lies in [0, π). */
function reportedEnd(pole: Vec3, first: SkyTriad): Vec3 {
  const { positionRad } = poleAspect(pole, first);
  return positionRad >= 0 && positionRad < PI ? pole : [-pole[0], -pole[1], -pole[2]];
}

function checkEvents(events: readonly JointEvent[], layout: Layout): void {
  if (events.length === 0) throw new GeometryInputError('events', 'at least one event is needed');
  for (const e of events) {
    if (e.crossings.length === 0) throw new GeometryInputError(e.errorPath, 'no crossings of this ring');
    for (const c of e.crossings) {
      if (![c.fKm, c.gKm, c.velocity.f, c.velocity.g, c.sigmaSeconds].every(Number.isFinite))
        throw new GeometryInputError(e.errorPath, `station ${c.station}: a crossing is not a finite number`);
      if (!(c.sigmaSeconds > 0))
        throw new GeometryInputError(e.errorPath, `station ${c.station}: timing sigma must be > 0 s`);
      if (Math.hypot(c.velocity.f, c.velocity.g) === 0)
        throw new GeometryInputError(e.errorPath, `station ${c.station}: the sky-plane velocity is zero`);
    }
  }
  const n = countPoints(events);
  if (n < layout.size)
    throw new GeometryInputError(
      'ringEvents',
      `fewer points than free parameters: ${n} ring crossings for ${layout.size} parameters (pole RA and Dec, radius` +
        (layout.size > 3 ? ', and a free centre (f, g) for each event without a positive chord)' : ')'),
    );
}

export function fitJointPole(events: readonly JointEvent[]): JointPoleFit {
  const layout = layoutOf(events);
  checkEvents(events, layout);
  const first = (events[0] as JointEvent).triad;
  const plus = fitFamily(events, layout, 1);
  const minus = fitFamily(events, layout, -1);
  // A single event gives both families the same χ² up to rounding; the B > 0 family then wins, as
  // poles[0] of the single-event solution does, so that the answer does not hang on the last bit.
  const tie = Math.abs(plus.chi2 - minus.chi2) <= TIE_CHI2 * (1 + Math.min(plus.chi2, minus.chi2));
  const [best, other] = tie || plus.chi2 < minus.chi2 ? [plus, minus] : [minus, plus];
  const sigma = linearisedSigma(events, layout, best);
  const pole = reportedEnd(best.pole, first);
  const dof = countPoints(events) - layout.size;
  const reducedChi2 = dof > 0 ? best.chi2 / dof : null;
  // Residuals scattering more than their timing sigmas allow: the usual remedy is to take the scatter as
  // the truth and multiply the linearised 1-sigma by √(χ²/dof) (Bevington & Robinson, Data Reduction and
  // Error Analysis, 3rd ed., §8.1; Press et al., Numerical Recipes, 3rd ed., §15.1), and to measure the
  // family difference in the same inflated units.
  const sigmaScale = reducedChi2 !== null && reducedChi2 > 1 ? Math.sqrt(reducedChi2) : 1;
  const familyDeltaChi2 = other.chi2 - best.chi2;
  const scaledDelta = familyDeltaChi2 / (sigmaScale * sigmaScale);
  const ambiguityResolved = scaledDelta > AMBIGUITY_DELTA_CHI2;
  return {
    pole: toRaDecDeg(pole),
    uncertainty: {
      raDeg: sigma.raRad * RAD * sigmaScale,
      decDeg: sigma.decRad * RAD * sigmaScale,
    },
    raDecCorrelation: sigma.raDecCorrelation,
    radiusKm: best.radiusKm,
    radiusSigmaKm: sigma.radiusKm * sigmaScale,
    chi2: best.chi2,
    dof,
    reducedChi2,
    sigmaScale,
    familyDeltaChi2,
    notes: jointPoleNotes(best.chi2, dof, reducedChi2, sigmaScale, familyDeltaChi2, ambiguityResolved),
    events: events.map((e, k) => {
      const { openingRad, positionRad } = poleAspect(pole, e.triad);
      return {
        title: e.title,
        openingAngleDeg: openingRad * RAD,
        positionAngleDeg: wrap(positionRad * RAD, 360),
        center: centerOf(events, layout, best.x, k),
      };
    }),
    ambiguityResolved,
    alternative: {
      pole: toRaDecDeg(reportedEnd(other.pole, first)),
      radiusKm: other.radiusKm,
      chi2: other.chi2,
    },
  };
}

/**
 * A χ² difference as text: signed (+ when the other family is worse, "−" when better), one decimal below
 * 1000 and whole numbers above, and "0.0" rather than "−0.0" for a difference that rounds to zero.
 */
export function formatDeltaChi2(delta: number): string {
  const decimals = Math.abs(delta) < 1000 ? 1 : 0;
  const text = Math.abs(delta).toFixed(decimals);
  if (Number(text) === 0) return (0).toFixed(decimals);
  return `${delta > 0 ? '+' : '−'}${text}`;
}

function jointPoleNotes(
  chi2: number,
  dof: number,
  reducedChi2: number | null,
  sigmaScale: number,
  delta: number,
  resolved: boolean,
): string[] {
  const notes: string[] = [];
  const fit = `χ² = ${chi2.toFixed(1)} for ${dof} degrees of freedom`;
  if (reducedChi2 === null)
    notes.push(`${fit}: no degrees of freedom are left, the 1-sigma rest on the timing sigmas alone.`);
  else if (sigmaScale > 1)
    notes.push(
      `${fit} (χ²/dof = ${reducedChi2.toFixed(2)}): the dips scatter more than their timing sigmas allow, ` +
        `so the 1-sigma are multiplied by √(χ²/dof) = ${sigmaScale.toFixed(2)} and the family difference is ` +
        `divided by χ²/dof before it is compared with ${AMBIGUITY_DELTA_CHI2}.`,
    );
  else notes.push(`${fit} (χ²/dof = ${reducedChi2.toFixed(2)}): the 1-sigma are not rescaled.`);
  const scaled =
    sigmaScale > 1 ? ` (${formatDeltaChi2(delta / (sigmaScale * sigmaScale))} after scaling)` : '';
  notes.push(
    resolved
      ? `The other pole family's best χ² differs by ${formatDeltaChi2(delta)}${scaled}, more than ` +
          `${AMBIGUITY_DELTA_CHI2}: it is ruled out.`
      : `The other pole family's best χ² differs by ${formatDeltaChi2(delta)}${scaled}, not more than ` +
          `${AMBIGUITY_DELTA_CHI2}: both poles remain possible.`,
  );
  return notes;
}
