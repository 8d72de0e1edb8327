// Synthetic light curves for the timing tests, computed independently of the fitter's code path:
// the straight-edge Fresnel–Kirchhoff amplitude U(u) = ((1 − i)/2)·∫_{−∞}^{u} exp(iπτ²/2) dτ is integrated
// directly by composite Simpson's rule on a fine grid (no series, no continued fraction, no profile
// table), then averaged by brute force over band slices, strips of the stellar disc and sub-instants of
// each exposure. Deliberately slow and simple.

const STEP = 1e-3;
/** Direct integration reaches this many Fresnel scales; the fitter's table stops at 40. */
const U_MAX = 60;

let table: { c: Float64Array; s: Float64Array } | null = null;

/** C(u) and S(u) at u = k·STEP for k = 0..U_MAX/STEP, by Simpson's rule on half-steps. */
function fresnelTable(): { c: Float64Array; s: Float64Array } {
  if (table !== null) return table;
  const count = Math.round(U_MAX / STEP) + 1;
  const c = new Float64Array(count);
  const s = new Float64Array(count);
  for (let k = 1; k < count; k++) {
    const a = (k - 1) * STEP;
    const m = a + STEP / 2;
    const b = k * STEP;
    const phase = (x: number): number => (Math.PI / 2) * x * x;
    c[k] = (c[k - 1] ?? 0) + (STEP / 6) * (Math.cos(phase(a)) + 4 * Math.cos(phase(m)) + Math.cos(phase(b)));
    s[k] = (s[k - 1] ?? 0) + (STEP / 6) * (Math.sin(phase(a)) + 4 * Math.sin(phase(m)) + Math.sin(phase(b)));
  }
  table = { c, s };
  return table;
}

/** Directly integrated C(u), S(u); beyond U_MAX their limits ±½. */
export function directFresnel(u: number): { c: number; s: number } {
  const au = Math.abs(u);
  let c: number;
  let s: number;
  if (au >= U_MAX) {
    c = 0.5;
    s = 0.5;
  } else {
    const { c: ct, s: st } = fresnelTable();
    // Cubic Hermite between nodes, with the exact derivatives C' = cos(πu²/2), S' = sin(πu²/2).
    const k = Math.floor(au / STEP);
    const f = au / STEP - k;
    const u0 = k * STEP;
    const u1 = u0 + STEP;
    const h00 = (1 + 2 * f) * (1 - f) ** 2;
    const h10 = f * (1 - f) ** 2;
    const h01 = f * f * (3 - 2 * f);
    const h11 = f * f * (f - 1);
    const p0 = (Math.PI / 2) * u0 * u0;
    const p1 = (Math.PI / 2) * u1 * u1;
    c = h00 * (ct[k] ?? 0) + h10 * STEP * Math.cos(p0) + h01 * (ct[k + 1] ?? 0) + h11 * STEP * Math.cos(p1);
    s = h00 * (st[k] ?? 0) + h10 * STEP * Math.sin(p0) + h01 * (st[k + 1] ?? 0) + h11 * STEP * Math.sin(p1);
  }
  return u < 0 ? { c: -c, s: -s } : { c, s };
}

/** |U|² behind a straight edge, u in Fresnel scales from the edge, positive on the lit side. */
function pointSourceIntensity(u: number): number {
  const { c, s } = directFresnel(u);
  return 0.5 * ((c + 0.5) ** 2 + (s + 0.5) ** 2);
}

export interface SyntheticSetup {
  distanceKm: number;
  wavelengthUm: number;
  bandwidthUm: number;
  starDiameterKm: number;
  speedKmPerS: number;
  exposureSeconds: number;
  bandSlices?: number;
  discStrips?: number;
  exposureSteps?: number;
}

/** One edge's pattern at x km from the edge, averaged over band and disc. */
export function syntheticEdge(setup: SyntheticSetup, xKm: number): number {
  const bandSlices = setup.bandwidthUm > 0 ? (setup.bandSlices ?? 64) : 1;
  const strips = setup.starDiameterKm > 0 ? (setup.discStrips ?? 48) : 1;
  const radiusKm = setup.starDiameterKm / 2;
  let maxScaleKm = 0;
  const scales: number[] = [];
  for (let i = 0; i < bandSlices; i++) {
    const lambdaKm =
      (setup.wavelengthUm - setup.bandwidthUm / 2 + ((i + 0.5) * setup.bandwidthUm) / bandSlices) * 1e-9;
    const scale = Math.sqrt((lambdaKm * setup.distanceKm) / 2);
    scales.push(scale);
    maxScaleKm = Math.max(maxScaleKm, scale);
  }
  if (xKm > U_MAX * maxScaleKm + radiusKm) return 1;
  if (xKm < -U_MAX * maxScaleKm - radiusKm) return 0;
  let total = 0;
  let weightTotal = 0;
  for (let j = 0; j < strips; j++) {
    // Midpoint strips of the disc, each weighted by its chord length.
    const q = strips === 1 ? 0 : -1 + (2 * (j + 0.5)) / strips;
    const weight = strips === 1 ? 1 : Math.sqrt(1 - q * q);
    let band = 0;
    for (const scale of scales) band += pointSourceIntensity((xKm - q * radiusKm) / scale);
    total += (weight * band) / bandSlices;
    weightTotal += weight;
  }
  return total / weightTotal;
}

export interface SyntheticEvent {
  timesSeconds: number[];
  disappearanceSeconds: number;
  reappearanceSeconds: number;
  baselineFlux: number;
  bottomFlux: number;
  dips?: Array<{ startSeconds: number; endSeconds: number; opacity: number }>;
  /** Speeds of the main well's two edges; both setup.speedKmPerS when absent (dips always use it). */
  edgeSpeedsKmPerS?: { disappearance: number; reappearance: number };
}

/** Noiseless flux at each time: the well, then each dip's well scaled by its opacity, exposure-averaged. */
export function syntheticFlux(setup: SyntheticSetup, event: SyntheticEvent): number[] {
  const steps = setup.exposureSeconds > 0 ? (setup.exposureSteps ?? 24) : 1;
  const v = setup.speedKmPerS;
  const light = (t: number, t1: number, t2: number, vD = v, vR = v): number => {
    const gD = syntheticEdge(setup, vD * (t1 - t));
    const gR = syntheticEdge(setup, vR * (t - t2));
    return 1 - (1 - gD) * (1 - gR);
  };
  const vD = event.edgeSpeedsKmPerS?.disappearance ?? v;
  const vR = event.edgeSpeedsKmPerS?.reappearance ?? v;
  return event.timesSeconds.map((tMid) => {
    let sum = 0;
    for (let k = 0; k < steps; k++) {
      const t =
        steps === 1 ? tMid : tMid - setup.exposureSeconds / 2 + ((k + 0.5) * setup.exposureSeconds) / steps;
      const star = event.baselineFlux - event.bottomFlux;
      let f =
        event.bottomFlux + star * light(t, event.disappearanceSeconds, event.reappearanceSeconds, vD, vR);
      for (const dip of event.dips ?? []) {
        f -= dip.opacity * star * (1 - light(t, dip.startSeconds, dip.endSeconds));
      }
      sum += f;
    }
    return sum / steps;
  });
}

/** Deterministic standard normal deviates (mulberry32 + Box–Muller), so every run sees the same noise. */
export function gaussianSource(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let x = state;
    x = Math.imul(x ^ (x >>> 15), x | 1);
    x ^= x + Math.imul(x ^ (x >>> 7), x | 61);
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
  return () => {
    const u1 = Math.max(uniform(), 1e-300);
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}

export function evenTimes(startSeconds: number, cadenceSeconds: number, count: number): number[] {
  return Array.from({ length: count }, (_, i) => startSeconds + i * cadenceSeconds);
}
