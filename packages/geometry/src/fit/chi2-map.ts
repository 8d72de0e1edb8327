// χ² maps: the profile χ² of a fit over a grid of two parameters, every other free parameter re-optimised at
// each grid point by the fit's own Levenberg–Marquardt code, with the contours of Δχ² = 2.30, 6.18 and 11.83
// (the 68.3, 95.4 and 99.7 % regions for two parameters of interest; Press et al., Numerical Recipes, 3rd ed.,
// 2007, §15.6.5 and its table of Δχ² by confidence and degrees of freedom; Avni, ApJ 210 (1976) 642).
// docs/method.md, "χ² maps".

/** One confidence level of a two-parameter map. */
export interface Chi2Level {
  sigma: 1 | 2 | 3;
  /** Probability mass of ±sigma of a normal distribution. */
  confidence: number;
  /** Δχ² that holds `confidence` of a χ² distribution with two degrees of freedom. */
  deltaChi2: number;
}

/**
 * With two degrees of freedom the χ² distribution is exponential, P(χ² ≤ Δ) = 1 − exp(−Δ/2) (Abramowitz &
 * Stegun, Handbook of Mathematical Functions, 26.4.1 with ν = 2, from memory), so the level holding p is
 * Δ = −2 ln(1 − p): 2.2958, 6.1801, 11.829 for the normal 1σ, 2σ, 3σ masses, the table's 2.30, 6.18, 11.8.
 */
export const CHI2_MAP_LEVELS: readonly Chi2Level[] = [
  { sigma: 1, confidence: 0.682689492137086 },
  { sigma: 2, confidence: 0.954499736103642 },
  { sigma: 3, confidence: 0.99730020393674 },
].map((l) => ({ ...l, sigma: l.sigma as 1 | 2 | 3, deltaChi2: -2 * Math.log(1 - l.confidence) }));

/** A line segment of a contour, [x₁, y₁, x₂, y₂] in the axes' units. */
export type ContourSegment = [number, number, number, number];

/**
 * The segments where the grid crosses `level`, by marching squares with linear interpolation along the
 * cell edges (Lorensen & Cline, "Marching cubes", SIGGRAPH 1987, in its two-dimensional form; common
 * practice). A cell with all four edges crossed (a saddle) is resolved by the mean of its corners. Cells
 * with a missing corner (null) draw nothing. values[j][i] is the value at (xs[i], ys[j]).
 */
export function contourSegments(
  values: ReadonlyArray<ReadonlyArray<number | null>>,
  xs: readonly number[],
  ys: readonly number[],
  level: number,
): ContourSegment[] {
  const out: ContourSegment[] = [];
  for (let j = 0; j + 1 < ys.length; j++) {
    for (let i = 0; i + 1 < xs.length; i++) {
      const v00 = values[j]?.[i];
      const v10 = values[j]?.[i + 1];
      const v11 = values[j + 1]?.[i + 1];
      const v01 = values[j + 1]?.[i];
      if (v00 == null || v10 == null || v11 == null || v01 == null) continue;
      const x0 = xs[i] as number;
      const x1 = xs[i + 1] as number;
      const y0 = ys[j] as number;
      const y1 = ys[j + 1] as number;
      const cut = (a: number, b: number): number => (level - a) / (b - a);
      // Edges 0 bottom (00–10), 1 right (10–11), 2 top (01–11), 3 left (00–01); a point where each is crossed.
      const edges: Array<[number, number] | null> = [
        v00 < level !== v10 < level ? [x0 + cut(v00, v10) * (x1 - x0), y0] : null,
        v10 < level !== v11 < level ? [x1, y0 + cut(v10, v11) * (y1 - y0)] : null,
        v01 < level !== v11 < level ? [x0 + cut(v01, v11) * (x1 - x0), y1] : null,
        v00 < level !== v01 < level ? [x0, y0 + cut(v00, v01) * (y1 - y0)] : null,
      ];
      const crossed = [0, 1, 2, 3].filter((e) => edges[e] !== null);
      const segment = (a: number, b: number): void => {
        const p = edges[a] as [number, number];
        const q = edges[b] as [number, number];
        out.push([p[0], p[1], q[0], q[1]]);
      };
      if (crossed.length === 2) segment(crossed[0] as number, crossed[1] as number);
      else if (crossed.length === 4) {
        // Centre on the same side as corner 00: its region joins 00 and 11, so the cuts isolate 10 and 01.
        const centre = (v00 + v10 + v11 + v01) / 4;
        if (centre < level === v00 < level) {
          segment(0, 1);
          segment(2, 3);
        } else {
          segment(3, 0);
          segment(1, 2);
        }
      }
    }
  }
  return out;
}

/** A χ² that can be minimised with some entries of its parameter vector held. */
export interface ProfileSource {
  /**
   * The least χ² with the entries of `held` at their values (internal units), started from `startFull`;
   * `clear` is false when the minimum found breaks a hard constraint (a negative chord crossed).
   */
  minimise(
    held: ReadonlyMap<number, number>,
    startFull: Float64Array,
  ): { full: Float64Array; chi2: number; clear: boolean };
}

export interface ProfileGrid {
  /** χ² at (x[i], y[j]) as chi2[j][i]; null where no minimum clear of the constraints was found. */
  chi2: Array<Array<number | null>>;
}

/**
 * The profile χ² over the grid xs × ys of the entries xIndex, yIndex, one cell per step: the generator
 * yields the cells finished and the total after each, so that a caller can report progress or let other
 * work run between cells, and returns the grid. Cells are visited outward from the one nearest the best
 * fit (breadth first), each started from its lowest finished neighbour's optimum and from the best fit,
 * the lower kept: the continuation follows a valley, the second start keeps a cell from inheriting a
 * neighbour's side minimum.
 */
export function* profileGridCells(
  source: ProfileSource,
  bestFull: Float64Array,
  xIndex: number,
  yIndex: number,
  xs: readonly number[],
  ys: readonly number[],
): Generator<{ done: number; total: number }, ProfileGrid> {
  const nx = xs.length;
  const ny = ys.length;
  const chi2: Array<Array<number | null>> = Array.from({ length: ny }, () =>
    new Array<number | null>(nx).fill(null),
  );
  const optimum: Array<Float64Array | null> = new Array<Float64Array | null>(nx * ny).fill(null);
  const done = new Uint8Array(nx * ny);
  const nearest = (values: readonly number[], v: number): number => {
    let best = 0;
    values.forEach((w, k) => {
      if (Math.abs(w - v) < Math.abs((values[best] as number) - v)) best = k;
    });
    return best;
  };
  const first = nearest(ys, bestFull[yIndex] as number) * nx + nearest(xs, bestFull[xIndex] as number);
  const queue = [first];
  const queued = new Uint8Array(nx * ny);
  queued[first] = 1;
  let finished = 0;
  for (let head = 0; head < queue.length; head++) {
    const cell = queue[head] as number;
    const i = cell % nx;
    const j = Math.floor(cell / nx);
    const neighbours = [
      i > 0 ? cell - 1 : -1,
      i + 1 < nx ? cell + 1 : -1,
      j > 0 ? cell - nx : -1,
      j + 1 < ny ? cell + nx : -1,
    ].filter((c) => c >= 0);
    const held = new Map([
      [xIndex, xs[i] as number],
      [yIndex, ys[j] as number],
    ]);
    const starts: Float64Array[] = [bestFull];
    let lowest = Infinity;
    let from: Float64Array | null = null;
    for (const c of neighbours) {
      const value = chi2[Math.floor(c / nx)]?.[c % nx];
      const x = optimum[c];
      if (done[c] && x && value != null && value < lowest) {
        lowest = value;
        from = x;
      }
    }
    if (from) starts.unshift(from);
    let result: { full: Float64Array; chi2: number; clear: boolean } | null = null;
    for (const start of starts) {
      const s = new Float64Array(start);
      for (const [k, v] of held) s[k] = v;
      const r = source.minimise(held, s);
      if (result === null || (r.clear && !result.clear) || (r.clear === result.clear && r.chi2 < result.chi2))
        result = r;
    }
    if (result && result.clear && Number.isFinite(result.chi2)) {
      (chi2[j] as Array<number | null>)[i] = result.chi2;
      optimum[cell] = result.full;
    }
    done[cell] = 1;
    yield { done: ++finished, total: nx * ny };
    for (const c of neighbours)
      if (!queued[c]) {
        queued[c] = 1;
        queue.push(c);
      }
  }
  return { chi2 };
}

/** profileGridCells run to the end, onCell told after each cell. */
export function profileGrid(
  source: ProfileSource,
  bestFull: Float64Array,
  xIndex: number,
  yIndex: number,
  xs: readonly number[],
  ys: readonly number[],
  onCell?: (done: number, total: number) => void,
): ProfileGrid {
  const cells = profileGridCells(source, bestFull, xIndex, yIndex, xs, ys);
  for (;;) {
    const step = cells.next();
    if (step.done) return step.value;
    onCell?.(step.value.done, step.value.total);
  }
}
