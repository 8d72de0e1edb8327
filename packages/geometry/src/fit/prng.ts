// A small seeded generator so that the same input and seed give the same uncertainties everywhere.

/**
 * mulberry32 by Tommy Ettinger (2017, public domain), as published in bryc's "PRNGs" collection
 * (github.com/bryc/code, jshash/PRNGs.md). 32-bit state, period 2³²; ample for a few 10⁵ draws per fit.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates by the Box–Muller transform (Box & Muller 1958), one per call. */
export function gaussian(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    // 1 − u keeps the logarithm's argument in (0, 1].
    const r = Math.sqrt(-2 * Math.log(1 - uniform()));
    const theta = 2 * Math.PI * uniform();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };
}
