import { Matrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { fitLimbAndRings } from '../../src/fit/joint-limb-ring.js';
import { type LimbFitInput, type LimbPoint, fitLimb } from '../../src/fit/limb-fit.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { type RingPoint, fitRing } from '../../src/fit/ring-fit.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { limbPoints } from './synthetic-chords.js';

// An invented body and ring about one centre: limb a = 380 km, ε = 0.15, P = 62°; ring R = 1200 km seen
// at B = 40° with its pole at P = 110°. Nine stations cross both (same tracks, same clocks).
const LIMB: LimbEllipse = {
  centerFKm: -8,
  centerGKm: 15,
  equatorialRadiusKm: 380,
  oblateness: 0.15,
  positionAngleDeg: 62,
};
const RING_TRUTH = { radiusKm: 1200, openingAngleDeg: 40, positionAngleDeg: 110 };
// The projected ring as an apparent ellipse: semi-axes R and R·sin B (common practice, no source).
const RING_ELLIPSE: LimbEllipse = {
  centerFKm: LIMB.centerFKm,
  centerGKm: LIMB.centerGKm,
  equatorialRadiusKm: RING_TRUTH.radiusKm,
  oblateness: 1 - Math.sin((RING_TRUTH.openingAngleDeg * Math.PI) / 180),
  positionAngleDeg: RING_TRUTH.positionAngleDeg,
};
const VELOCITY = { f: 14, g: 9 };
const IMPACT_KM = [-320, -240, -150, -70, 10, 90, 170, 250, 320];

interface Data {
  limb: LimbPoint[];
  ring: RingPoint[];
}

function data(o: { noiseSeed?: number; clockShiftSeconds?: Record<string, number> } = {}): Data {
  const noise = o.noiseSeed === undefined ? undefined : gaussian(mulberry32(o.noiseSeed));
  const common = { velocity: VELOCITY, impactKm: IMPACT_KM, clockShiftSeconds: o.clockShiftSeconds };
  return {
    limb: limbPoints({ ...common, truth: LIMB, sigmaSeconds: 0.4, noise }),
    ring: limbPoints({ ...common, truth: RING_ELLIPSE, sigmaSeconds: 0.2, noise }),
  };
}

function limbInput(d: Data, extra: Partial<LimbFitInput> = {}): LimbFitInput {
  return { points: d.limb, negatives: [], fixed: {}, modelErrorKm: 0, fitTimeOffsets: [], seed: 1, ...extra };
}

/** The sequential start (limb, then the ring about the limb's centre) and the joint fit from it. */
function joint(d: Data, extra: Partial<LimbFitInput> = {}) {
  const input = limbInput(d, extra);
  const limb = fitLimb(input);
  const shifted = (p: RingPoint): RingPoint => {
    const o = limb.timeOffsets.find((t) => t.station === p.station);
    if (!o) return p;
    return { ...p, fKm: p.fKm + p.velocity.f * o.seconds, gKm: p.gKm + p.velocity.g * o.seconds };
  };
  const ring = fitRing({
    ring: 'R1',
    points: d.ring.map(shifted),
    center: { fKm: limb.ellipse.centerFKm, gKm: limb.ellipse.centerGKm },
    seed: 1,
  });
  return {
    sequential: { limb, ring },
    joint: fitLimbAndRings({
      limb: input,
      rings: [{ ring: 'R1', points: d.ring }],
      start: { limb, rings: [ring] },
    }),
  };
}

// An independent statement of the contract's residuals: the polar radius of an ellipse about its centre
// r(ψ) = ab/√(b²cos²ψ + a²sin²ψ), ψ from the semi-major axis (common practice, no source), ρ = d − r; the
// gradient of ρ by central differences; σρ² = (σt·max(|v·∇ρ|, 0.1|v|))² + σmodel² (Orear, Am. J. Phys.
// 50 (1982) 912).
function rho(
  fKm: number,
  gKm: number,
  e: { f: number; g: number; a: number; b: number; pDeg: number },
): number {
  const p = (e.pDeg * Math.PI) / 180;
  const df = fKm - e.f;
  const dg = gKm - e.g;
  const u = df * Math.cos(p) - dg * Math.sin(p);
  const w = df * Math.sin(p) + dg * Math.cos(p);
  const psi = Math.atan2(w, u);
  return Math.hypot(u, w) - (e.a * e.b) / Math.hypot(e.b * Math.cos(psi), e.a * Math.sin(psi));
}

function normalised(point: RingPoint, e: Parameters<typeof rho>[2], modelErrorKm: number): number {
  const h = 1e-2;
  const gf = (rho(point.fKm + h, point.gKm, e) - rho(point.fKm - h, point.gKm, e)) / (2 * h);
  const gg = (rho(point.fKm, point.gKm + h, e) - rho(point.fKm, point.gKm - h, e)) / (2 * h);
  const v = point.velocity;
  const along = Math.max(Math.abs(v.f * gf + v.g * gg), 0.1 * Math.hypot(v.f, v.g));
  return rho(point.fKm, point.gKm, e) / Math.hypot(point.sigmaSeconds * along, modelErrorKm);
}

/** Parameters in solution units: f, g, a, ε, P (deg), R, B (deg), P_ring (deg). */
function referenceResiduals(d: Data, x: number[], modelErrorKm: number): number[] {
  const [f, g, a, eps, p, r, b, pr] = x as [number, number, number, number, number, number, number, number];
  const limb = { f, g, a, b: a * (1 - eps), pDeg: p };
  const ring = { f, g, a: r, b: r * Math.sin((b * Math.PI) / 180), pDeg: pr };
  return [
    ...d.limb.map((pt) => normalised(pt, limb, modelErrorKm)),
    ...d.ring.map((pt) => normalised(pt, ring, 0)),
  ];
}

describe('fitLimbAndRings()', () => {
  it('fitLimbAndRings() recovers the limb and the ring exactly from exact points', () => {
    const { joint: j } = joint(data());
    expectClose(j.limb.ellipse.centerFKm, LIMB.centerFKm, 1e-6);
    expectClose(j.limb.ellipse.centerGKm, LIMB.centerGKm, 1e-6);
    expectClose(j.limb.ellipse.equatorialRadiusKm, LIMB.equatorialRadiusKm, 1e-6);
    expectClose(j.limb.ellipse.oblateness, LIMB.oblateness, 1e-9);
    expectClose(j.limb.ellipse.positionAngleDeg, LIMB.positionAngleDeg, 1e-7);
    const ring = j.rings[0]!;
    expectClose(ring.radiusKm, RING_TRUTH.radiusKm, 1e-6);
    expectClose(ring.openingAngleDeg, RING_TRUTH.openingAngleDeg, 1e-7);
    expectClose(ring.positionAngleDeg, RING_TRUTH.positionAngleDeg, 1e-7);
    expect(ring.centerFKm).toBe(j.limb.ellipse.centerFKm);
    expect(j.limb.chi2).toBeLessThan(1e-12);
    expect(ring.chi2).toBeLessThan(1e-12);
    expect(j.limb.dof).toBe(18 - 5);
    expect(ring.dof).toBe(18 - 3);
    expect(ring.uncertainty.centerFKm).toBe(j.limb.uncertainty.centerFKm);
  });

  it('fitLimbAndRings() ends at the minimum of the contract χ² with its (JᵀJ)⁻¹, as a reference computation', () => {
    // The same normal equations set up here from the residuals written above and inverted with
    // ml-matrix: the fit must sit where the Gauss–Newton step vanishes, and report that inverse.
    const d = data({ noiseSeed: 44 });
    const modelErrorKm = 0.5;
    const { joint: j } = joint(d, { modelErrorKm });
    const l = j.limb.ellipse;
    const r = j.rings[0]!;
    const x0 = [
      l.centerFKm,
      l.centerGKm,
      l.equatorialRadiusKm,
      l.oblateness,
      l.positionAngleDeg,
      r.radiusKm,
      r.openingAngleDeg,
      r.positionAngleDeg,
    ];
    const steps = [1e-3, 1e-3, 1e-3, 1e-6, 1e-4, 1e-3, 1e-4, 1e-4];
    const base = referenceResiduals(d, x0, modelErrorKm);
    const jac = new Matrix(base.length, x0.length);
    x0.forEach((_, k) => {
      const up = [...x0];
      const down = [...x0];
      up[k] = x0[k]! + steps[k]!;
      down[k] = x0[k]! - steps[k]!;
      const ru = referenceResiduals(d, up, modelErrorKm);
      const rd = referenceResiduals(d, down, modelErrorKm);
      ru.forEach((v, i) => jac.set(i, k, (v - rd[i]!) / (2 * steps[k]!)));
    });
    const cov = inverse(jac.transpose().mmul(jac));
    const sigma = x0.map((_, k) => Math.sqrt(cov.get(k, k)));
    // Gauss–Newton step from the reported best fit: below 10⁻³ σ in every parameter.
    const step = cov.mmul(jac.transpose()).mmul(Matrix.columnVector(base));
    x0.forEach((_, k) => expect(Math.abs(step.get(k, 0))).toBeLessThan(1e-3 * sigma[k]!));
    // The reported covariance: limb block and ring block (shared centre) against the reference.
    const reported = j.covariance.matrix;
    expect(j.covariance.parameters).toEqual([
      'centerFKm',
      'centerGKm',
      'equatorialRadiusKm',
      'oblateness',
      'positionAngleDeg',
      'ring R1 radiusKm',
      'ring R1 openingAngleDeg',
      'ring R1 positionAngleDeg',
    ]);
    for (let a = 0; a < 8; a++)
      for (let b = 0; b < 8; b++) expectClose(reported[a]![b]!, cov.get(a, b), 2e-3 * sigma[a]! * sigma[b]!);
    expectClose(j.limb.uncertainty.centerFKm, sigma[0]!, 2e-3 * sigma[0]!);
    expectClose(r.uncertainty.radiusKm, sigma[5]!, 2e-3 * sigma[5]!);
    expectClose(r.uncertainty.openingAngleDeg, sigma[6]!, 2e-3 * sigma[6]!);
    // χ² split as the contract says: limb points only, then the ring's dips only.
    const limbChi2 = base.slice(0, 18).reduce((s, v) => s + v * v, 0);
    const ringChi2 = base.slice(18).reduce((s, v) => s + v * v, 0);
    expectClose(j.limb.chi2, limbChi2, 1e-6 * limbChi2);
    expectClose(r.chi2, ringChi2, 1e-6 * ringChi2);
    // The ring block of the solution: centre, R, B, P rows of the whole matrix.
    expectClose(r.covariance.matrix[0]![2]!, cov.get(0, 5), 2e-3 * sigma[0]! * sigma[5]!);
  });

  it('fitLimbAndRings() equals the sequential fit when the ring cannot inform the centre (three dips)', () => {
    // Three dips fix (R, B, P) exactly about any nearby centre, so the ring adds nothing about the centre:
    // the joint limb must be the sequential limb and its linearised sigmas, and the ring the ring fitted
    // about the limb's centre, passing through its three dips (χ² = 0).
    const d = data({ noiseSeed: 9 });
    const three: Data = { limb: d.limb, ring: [d.ring[2]!, d.ring[7]!, d.ring[12]!] };
    const { sequential, joint: j } = joint(three);
    const s = sequential.limb;
    for (const key of [
      'centerFKm',
      'centerGKm',
      'equatorialRadiusKm',
      'oblateness',
      'positionAngleDeg',
    ] as const) {
      expectClose(j.limb.ellipse[key], s.ellipse[key], 1e-3 * s.linearisedSigma[key]);
      expectClose(j.limb.uncertainty[key], s.linearisedSigma[key], 2e-3 * s.linearisedSigma[key]);
    }
    expectClose(j.limb.chi2, s.chi2, 1e-6 * s.chi2);
    const ring = j.rings[0]!;
    expectClose(ring.radiusKm, sequential.ring.radiusKm, 1e-4);
    expectClose(ring.openingAngleDeg, sequential.ring.openingAngleDeg, 1e-6);
    expectClose(ring.positionAngleDeg, sequential.ring.positionAngleDeg, 1e-6);
    expect(ring.chi2).toBeLessThan(1e-10);
    expect(ring.dof).toBe(0);
  });

  it('fitLimbAndRings() moves a station ring dips with its fitted clock offset', () => {
    // Station S3's clock reads 0.6 s late for every time it reports, limb and ring alike: the fitted offset
    // is −0.6 s (corrected = reported + offset) and the ring comes out exact.
    const { joint: j } = joint(data({ clockShiftSeconds: { S3: 0.6 } }), { fitTimeOffsets: ['S3'] });
    expectClose(j.limb.timeOffsets[0]!.seconds, -0.6, 1e-7);
    expect(j.limb.dof).toBe(18 - 5 - 1);
    const ring = j.rings[0]!;
    expectClose(ring.radiusKm, RING_TRUTH.radiusKm, 1e-5);
    expect(ring.chi2).toBeLessThan(1e-10);
    expect(j.limb.covariance.parameters.at(-1)).toBe('timeOffsetSeconds S3');
  });

  it('fitLimbAndRings() refuses a ring with fewer than three dips, naming it', () => {
    const d = data();
    expect(() => joint({ limb: d.limb, ring: d.ring.slice(0, 2) })).toThrow(
      /ring "R1": fewer points \(2\) than free parameters \(3\)/,
    );
  });
});
