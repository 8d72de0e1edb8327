// The dynamics context of one body: Roche limits, resonance radii, synchronous orbit and Hill radius,
// with ring radii set against them, each with a first-order 1-sigma (see quantity.ts). docs/file-formats.md
// ("Context input", "Context output") describes the JSON form; this is the plain-object core.
import { AU_KM, SECONDS_PER_DAY, TAU } from '../math.js';
import { GeometryInputError } from '../types.js';
import {
  G_SI,
  GM_SUN_SI,
  KM_PER_M,
  M_PER_KM,
  ROCHE_FLUID_COEFFICIENT,
  ROCHE_RIGID_COEFFICIENT,
  SECONDS_PER_HOUR,
} from './constants.js';
import {
  constant,
  covarianceOf,
  input,
  over,
  power,
  type Quantity,
  scaled,
  sigmaOf,
  times,
} from './quantity.js';
import { contextResonanceRatios, gcd } from './resonances.js';

/** How many resonances each ring lists, nearest first. */
export const NEAREST_RESONANCE_COUNT = 5;

export interface ContextBodyInput {
  massKg?: number;
  massKgSigma?: number;
  densityKgM3?: number;
  densityKgM3Sigma?: number;
  /** Name of a satellite given with both period and semi-major axis, whose orbit gives the mass. */
  massFromSatellite?: string;
  radiusKm: number;
  radiusKmSigma?: number;
  spinPeriodHours: number;
  spinPeriodHoursSigma?: number;
}

export interface ContextSatelliteInput {
  name: string;
  periodDays?: number;
  periodDaysSigma?: number;
  semiMajorAxisKm?: number;
  semiMajorAxisKmSigma?: number;
}

export interface ContextRingInput {
  ring: string;
  radiusKm: number;
  radiusKmSigma?: number;
}

export interface ContextInput {
  body: ContextBodyInput;
  particleDensityKgM3: number;
  particleDensityKgM3Sigma?: number;
  heliocentricDistanceAu: number;
  heliocentricDistanceAuSigma?: number;
  satellites: ContextSatelliteInput[];
  rings: ContextRingInput[];
  /** Spin–orbit resonances to list (particle period = k spin periods); default 2, 3, 4. */
  spinOrbitK?: number[];
  /** Largest |p − q| and largest p or q of the mean-motion resonances; default 2 and 8. */
  resonanceMaxOrder?: number;
  resonanceMaxInteger?: number;
  /** Mean-motion resonances p:q (n_particle/n_satellite, coprime, p ≠ q) listed besides the default ones. */
  resonances?: Array<{ p: number; q: number }>;
}

export interface SpinOrbitEntry {
  k: number;
  radiusKm: number;
}

export interface MeanMotionEntry {
  satellite: string;
  p: number;
  q: number;
  order: number;
  side: 'inner' | 'outer';
  radiusKm: number;
  /** Listed because the input's `resonances` named it. */
  named: boolean;
}

export interface RingRadiusEntry {
  ring: string;
  radiusKm: number;
  inBodyRadii: number;
  inRocheFluid: number;
  inRocheRigid: number;
  inSynchronous: number;
}

export interface ContextFigures {
  massKg: number;
  densityKgM3: number;
  rocheFluidKm: number;
  rocheRigidKm: number;
  rocheFluidBodyRadii: number;
  rocheRigidBodyRadii: number;
  synchronousKm: number;
  hillKm: number;
  spinOrbit: SpinOrbitEntry[];
  meanMotion: MeanMotionEntry[];
  ringRadii: RingRadiusEntry[];
}

/**
 * A resonance near a ring: n_particle : n = p : q with n a satellite's mean motion (`mean-motion`) or the
 * body's spin rate (`spin-orbit`; 1:1 is the synchronous orbit, 1:k a particle period of k spin periods).
 * distanceKm = ring radius − resonance radius (positive when the ring lies outside it), with its 1-sigma from
 * both, and that distance in units of the ring radius's, the resonance radius's and their combined 1-sigma
 * (null where that 1-sigma is 0).
 */
export interface ResonanceNearRing {
  kind: 'mean-motion' | 'spin-orbit';
  satellite: string | null;
  p: number;
  q: number;
  radiusKm: number;
  radiusKmSigma: number;
  distanceKm: number;
  distanceKmSigma: number;
  distanceInRingSigma: number | null;
  distanceInResonanceSigma: number | null;
  distanceInSigma: number | null;
}

export interface RingResonances {
  ring: string;
  radiusKm: number;
  radiusKmSigma: number;
  /** The NEAREST_RESONANCE_COUNT nearest resonances, by |distanceKm|. */
  nearest: ResonanceNearRing[];
}

export interface ContextResult extends ContextFigures {
  uncertainty: ContextFigures;
  ringResonances: RingResonances[];
  massFrom: 'massKg' | 'densityKgM3' | 'satellite';
  propagation: 'first-order';
}

function requirePositive(path: string, value: number | undefined): number {
  if (value === undefined || !Number.isFinite(value) || value <= 0) {
    throw new GeometryInputError(path, 'must be a positive finite number');
  }
  return value;
}

function requireSigma(path: string, value: number | undefined): number {
  if (value === undefined) return 0;
  if (!Number.isFinite(value) || value < 0) throw new GeometryInputError(path, 'must be a finite number ≥ 0');
  return value;
}

/** Collects the independent inputs with their relative 1-sigma, keyed by JSON path. */
class Inputs {
  readonly relativeSigmas: Record<string, number> = {};

  take(path: string, value: number | undefined, sigma: number | undefined): Quantity {
    const v = requirePositive(path, value);
    this.relativeSigmas[path] = requireSigma(`${path}Sigma`, sigma) / v;
    return input(path, v);
  }
}

export function computeDynamicsContext(ctx: ContextInput): ContextResult {
  const inputs = new Inputs();
  const body = ctx.body;
  const radiusKm = inputs.take('body.radiusKm', body.radiusKm, body.radiusKmSigma);
  const spinSeconds = scaled(
    inputs.take('body.spinPeriodHours', body.spinPeriodHours, body.spinPeriodHoursSigma),
    SECONDS_PER_HOUR,
  );
  const particleDensity = inputs.take(
    'particleDensityKgM3',
    ctx.particleDensityKgM3,
    ctx.particleDensityKgM3Sigma,
  );
  const helioKm = scaled(
    inputs.take('heliocentricDistanceAu', ctx.heliocentricDistanceAu, ctx.heliocentricDistanceAuSigma),
    AU_KM,
  );
  const volumeM3 = scaled(power(radiusKm, 3), (4 / 3) * Math.PI * M_PER_KM ** 3);

  const given = [body.massKg, body.densityKgM3, body.massFromSatellite].filter((v) => v !== undefined);
  if (given.length !== 1) {
    throw new GeometryInputError('body', 'give exactly one of massKg, densityKgM3, massFromSatellite');
  }

  const satellitePeriod = (index: number): Quantity | undefined => {
    const s = ctx.satellites[index];
    if (s?.periodDays === undefined) return undefined;
    return scaled(
      inputs.take(`satellites[${index}].periodDays`, s.periodDays, s.periodDaysSigma),
      SECONDS_PER_DAY,
    );
  };
  const satelliteAxis = (index: number): Quantity | undefined => {
    const s = ctx.satellites[index];
    if (s?.semiMajorAxisKm === undefined) return undefined;
    return inputs.take(`satellites[${index}].semiMajorAxisKm`, s.semiMajorAxisKm, s.semiMajorAxisKmSigma);
  };

  const names = new Set<string>();
  ctx.satellites.forEach((s, i) => {
    if (names.has(s.name)) throw new GeometryInputError(`satellites[${i}].name`, `"${s.name}" appears twice`);
    names.add(s.name);
    if (s.periodDays === undefined && s.semiMajorAxisKm === undefined) {
      throw new GeometryInputError(`satellites[${i}]`, 'give periodDays or semiMajorAxisKm');
    }
  });

  let massKg: Quantity;
  let massFrom: ContextResult['massFrom'];
  if (body.massKg !== undefined) {
    massKg = inputs.take('body.massKg', body.massKg, body.massKgSigma);
    massFrom = 'massKg';
  } else if (body.densityKgM3 !== undefined) {
    massKg = times(inputs.take('body.densityKgM3', body.densityKgM3, body.densityKgM3Sigma), volumeM3);
    massFrom = 'densityKgM3';
  } else {
    const index = ctx.satellites.findIndex((s) => s.name === body.massFromSatellite);
    const s = ctx.satellites[index];
    if (s === undefined) {
      throw new GeometryInputError(
        'body.massFromSatellite',
        `no satellite named "${body.massFromSatellite}"`,
      );
    }
    const periodS = satellitePeriod(index);
    const axisKm = satelliteAxis(index);
    if (periodS === undefined || axisKm === undefined) {
      throw new GeometryInputError(
        `satellites[${index}]`,
        'a satellite that gives the mass needs both periodDays and semiMajorAxisKm',
      );
    }
    // M = 4π² a³ / (G P²), Kepler's third law with the satellite's mass neglected.
    massKg = scaled(times(power(axisKm, 3), power(periodS, -2)), (TAU * TAU * M_PER_KM ** 3) / G_SI);
    massFrom = 'satellite';
  }
  const gm = scaled(massKg, G_SI);
  const density = over(massKg, volumeM3);

  // d = k R (ρ_M/ρ_m)^(1/3)
  const rocheUnit = times(radiusKm, power(over(density, particleDensity), 1 / 3));
  const rocheFluid = scaled(rocheUnit, ROCHE_FLUID_COEFFICIENT);
  const rocheRigid = scaled(rocheUnit, ROCHE_RIGID_COEFFICIENT);

  // a = (GM P² / 4π²)^(1/3), in km
  const keplerAxisKm = (periodS: Quantity): Quantity =>
    scaled(power(times(gm, power(periodS, 2)), 1 / 3), Math.cbrt(1 / (TAU * TAU)) * KM_PER_M);
  const synchronous = keplerAxisKm(spinSeconds);
  const spinOrbitK = ctx.spinOrbitK ?? [2, 3, 4];
  spinOrbitK.forEach((k, i) => {
    if (!Number.isInteger(k) || k < 1)
      throw new GeometryInputError(`spinOrbitK[${i}]`, 'must be an integer ≥ 1');
  });
  const spinOrbit = spinOrbitK.map((k) => ({ k, radius: keplerAxisKm(scaled(spinSeconds, k)) }));

  const hill = times(helioKm, power(scaled(gm, 1 / (3 * GM_SUN_SI)), 1 / 3));

  const named = ctx.resonances ?? [];
  named.forEach((r, i) => {
    if (!Number.isInteger(r.p) || !Number.isInteger(r.q) || r.p < 1 || r.q < 1)
      throw new GeometryInputError(`resonances[${i}]`, 'p and q must be integers ≥ 1');
    if (r.p === r.q)
      throw new GeometryInputError(
        `resonances[${i}]`,
        "p and q must differ (1:1 is the satellite's own orbit)",
      );
    if (gcd(r.p, r.q) !== 1) {
      const k = gcd(r.p, r.q);
      throw new GeometryInputError(
        `resonances[${i}]`,
        `write ${r.p}:${r.q} in lowest terms, ${r.p / k}:${r.q / k}`,
      );
    }
  });
  const ratios = contextResonanceRatios(ctx.resonanceMaxOrder ?? 2, ctx.resonanceMaxInteger ?? 8, named);
  const meanMotion = ctx.satellites.flatMap((s, i) => {
    const axis = satelliteAxis(i) ?? keplerAxisKm(satellitePeriod(i) ?? constant(Number.NaN));
    return ratios.map((r) => ({
      ...r,
      satellite: s.name,
      radius: scaled(axis, Math.cbrt((r.q / r.p) ** 2)),
    }));
  });

  const rings = ctx.rings.map((r, i) => {
    const radius = inputs.take(`rings[${i}].radiusKm`, r.radiusKm, r.radiusKmSigma);
    return {
      ring: r.ring,
      radius,
      inBodyRadii: over(radius, radiusKm),
      inRocheFluid: over(radius, rocheFluid),
      inRocheRigid: over(radius, rocheRigid),
      inSynchronous: over(radius, synchronous),
    };
  });

  const figures = (pick: (q: Quantity) => number): ContextFigures => ({
    massKg: pick(massKg),
    densityKgM3: pick(density),
    rocheFluidKm: pick(rocheFluid),
    rocheRigidKm: pick(rocheRigid),
    rocheFluidBodyRadii: pick(over(rocheFluid, radiusKm)),
    rocheRigidBodyRadii: pick(over(rocheRigid, radiusKm)),
    synchronousKm: pick(synchronous),
    hillKm: pick(hill),
    spinOrbit: spinOrbit.map((s) => ({ k: s.k, radiusKm: pick(s.radius) })),
    meanMotion: meanMotion.map((m) => ({
      satellite: m.satellite,
      p: m.p,
      q: m.q,
      order: m.order,
      side: m.side,
      radiusKm: pick(m.radius),
      named: m.named,
    })),
    ringRadii: rings.map((r) => ({
      ring: r.ring,
      radiusKm: pick(r.radius),
      inBodyRadii: pick(r.inBodyRadii),
      inRocheFluid: pick(r.inRocheFluid),
      inRocheRigid: pick(r.inRocheRigid),
      inSynchronous: pick(r.inSynchronous),
    })),
  });

  const sigma = (q: Quantity): number => sigmaOf(q, inputs.relativeSigmas);
  const candidates = [
    ...meanMotion.map((m) => ({
      kind: 'mean-motion' as const,
      satellite: m.satellite,
      p: m.p,
      q: m.q,
      radius: m.radius,
    })),
    { kind: 'spin-orbit' as const, satellite: null, p: 1, q: 1, radius: synchronous },
    ...spinOrbit.map((o) => ({
      kind: 'spin-orbit' as const,
      satellite: null,
      p: 1,
      q: o.k,
      radius: o.radius,
    })),
  ];
  const inSigmas = (distance: number, s: number): number | null => (s > 0 ? distance / s : null);
  const ringResonances = rings.map((r): RingResonances => {
    const ringSigma = sigma(r.radius);
    const nearest = candidates
      .map((c): ResonanceNearRing => {
        const resonanceSigma = sigma(c.radius);
        const distanceKm = r.radius.value - c.radius.value;
        // d = r − a: σ² = σr² + σa² − 2 cov(r, a), the covariance through any input they share.
        const variance =
          ringSigma ** 2 + resonanceSigma ** 2 - 2 * covarianceOf(r.radius, c.radius, inputs.relativeSigmas);
        const distanceKmSigma = Math.sqrt(Math.max(variance, 0));
        return {
          kind: c.kind,
          satellite: c.satellite,
          p: c.p,
          q: c.q,
          radiusKm: c.radius.value,
          radiusKmSigma: resonanceSigma,
          distanceKm,
          distanceKmSigma,
          distanceInRingSigma: inSigmas(distanceKm, ringSigma),
          distanceInResonanceSigma: inSigmas(distanceKm, resonanceSigma),
          distanceInSigma: inSigmas(distanceKm, distanceKmSigma),
        };
      })
      .sort((x, y) => Math.abs(x.distanceKm) - Math.abs(y.distanceKm))
      .slice(0, NEAREST_RESONANCE_COUNT);
    return { ring: r.ring, radiusKm: r.radius.value, radiusKmSigma: ringSigma, nearest };
  });

  return {
    ...figures((q) => q.value),
    uncertainty: figures(sigma),
    ringResonances,
    massFrom,
    propagation: 'first-order',
  };
}
