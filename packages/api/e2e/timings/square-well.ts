// An independent synthetic light curve: geometric square wells (no diffraction) integrated exactly over
// each exposure, plus seeded Gaussian noise. Written apart from the geometry package on purpose, so the
// timing job is checked against a model it does not share code with.

export interface Well {
  startSeconds: number;
  endSeconds: number;
  /** Fraction of the star's light removed inside the well (1 = opaque). */
  opacity: number;
}

/** Mulberry32 then Box–Muller; deterministic so a failing run can be replayed (common practice, no source). */
function gaussian(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function overlap(a0: number, a1: number, b0: number, b1: number): number {
  return Math.max(0, Math.min(a1, b1) - Math.max(a0, b0));
}

/** CSV text with columns time,flux; sample k is the mean over [t_k − E/2, t_k + E/2]. */
export function squareWellCsv(options: {
  originUnixSeconds: number;
  samples: number;
  cadenceSeconds: number;
  wells: Well[];
  noiseSigma: number;
  seed: number;
}): string {
  const noise = gaussian(options.seed);
  const rows = ['time,flux'];
  const e = options.cadenceSeconds;
  for (let k = 0; k < options.samples; k++) {
    const t = k * e;
    let removed = 0;
    for (const w of options.wells)
      removed += (w.opacity * overlap(t - e / 2, t + e / 2, w.startSeconds, w.endSeconds)) / e;
    const flux = 1 - removed + options.noiseSigma * noise();
    const ms = Math.round(t * 1000);
    const iso = new Date(options.originUnixSeconds * 1000 + ms).toISOString();
    rows.push(`${iso},${flux.toFixed(5)}`);
  }
  return rows.join('\n') + '\n';
}
