// The χ² map of one solved fit: which parameters a map can take, which χ² it maps (the limb's, one ring's
// or the joint fit's), the grid and its contours. docs/method.md, "χ² maps".

import { DEG } from '../math.js';
import { projectEvent, type ProjectedEvent } from '../project.js';
import {
  GeometryInputError,
  LIMB_PARAMETERS,
  type EventInput,
  type RingSolution,
  type Solution,
} from '../types.js';
import {
  CHI2_MAP_LEVELS,
  type ContourSegment,
  contourSegments,
  profileGridCells,
  type ProfileSource,
} from './chi2-map.js';
import { type EllipseFitProblem, SHAPE_PARAMETER_COUNT, ellipseRefiner } from './ellipse-fit.js';
import { jointLeastSquares, type JointLimbRingInput } from './joint-limb-ring.js';
import { limbProblem, type LimbFitInput } from './limb-fit.js';
import { ringProblem } from './ring-fit.js';

export const CHI2_MAP_DEFAULT_STEPS = 25;
export const CHI2_MAP_MIN_STEPS = 5;
export const CHI2_MAP_MAX_STEPS = 61;
/** Default half-width of an axis, in the parameter's 1-sigma. */
export const CHI2_MAP_DEFAULT_HALF_WIDTH_SIGMA = 4;

export type Chi2MapUnit = 'km' | 'deg' | 's' | '';

/** A parameter a map can take, in the solution's units. */
export interface Chi2MapParameter {
  parameter: string;
  unit: Chi2MapUnit;
  best: number;
  sigma: number;
  /** Admissible values (null: unbounded); a range outside them has no ellipse. */
  min: number | null;
  max: number | null;
}

export interface Chi2MapRange {
  from: number;
  to: number;
}

export interface Chi2MapRequest {
  x: string;
  y: string;
  ranges?: { x?: Chi2MapRange; y?: Chi2MapRange };
  steps?: number;
}

export interface Chi2MapAxis extends Chi2MapParameter {
  values: number[];
}

export interface Chi2Map {
  /** Whose χ²: the limb points' (sequential fit), one ring's dips' (ring named) or the joint fit's, all of them. */
  chi2Of: 'limb' | 'ring' | 'joint';
  ring: string | null;
  x: Chi2MapAxis;
  y: Chi2MapAxis;
  /** The parameters re-optimised at every grid point. */
  profiled: string[];
  /** χ² at (x.values[i], y.values[j]) as chi2[j][i]; null where no fit clear of the negative chords exists. */
  chi2: Array<Array<number | null>>;
  /** The stored fit's χ², re-minimised from its own parameters. */
  bestChi2: number;
  /** Δχ² is measured from this: the lower of bestChi2 and the grid's least χ². */
  minChi2: number;
  dof: number;
  levels: Array<{ sigma: 1 | 2 | 3; confidence: number; deltaChi2: number; segments: ContourSegment[] }>;
  cautions: string[];
}

interface Resolved {
  chi2Of: Chi2Map['chi2Of'];
  ring: RingSolution | null;
  parameters: Array<Chi2MapParameter & { index: number; toInternal: (v: number) => number }>;
}

const ANGLE_HALF_TURN_DEG = 90;
const DEG_TO_RAD = (v: number): number => v * DEG;
const SAME = (v: number): number => v;

function limbParameters(solution: Solution, fixed: Partial<Record<string, number>>) {
  const limb = solution.limb;
  if (!limb) return [];
  const shape = LIMB_PARAMETERS.map((name, index) => ({
    parameter: name,
    unit: (name === 'oblateness' ? '' : name === 'positionAngleDeg' ? 'deg' : 'km') as Chi2MapUnit,
    best: limb[name],
    sigma: limb.uncertainty[name],
    min: name === 'equatorialRadiusKm' ? 1e-6 * limb.equatorialRadiusKm : name === 'oblateness' ? 0 : null,
    max: name === 'oblateness' ? 0.999 : null,
    index,
    toInternal: name === 'positionAngleDeg' ? DEG_TO_RAD : SAME,
  })).filter((p) => fixed[p.parameter] === undefined);
  const offsets = limb.timeOffsets.map((o, i) => ({
    parameter: `timeOffsetSeconds ${o.station}`,
    unit: 's' as Chi2MapUnit,
    best: o.seconds,
    sigma: o.sigma,
    min: null,
    max: null,
    index: SHAPE_PARAMETER_COUNT + i,
    toInternal: SAME,
  }));
  return [...shape, ...offsets];
}

/** R, |B| and P of a ring at the given indices (|B| internal in radians, or as ε = 1 − sin|B|). */
function ringParameters(ring: RingSolution, start: number, openingAsOblateness: boolean) {
  const u = ring.uncertainty;
  return [
    {
      parameter: `ring ${ring.ring} radiusKm`,
      unit: 'km' as Chi2MapUnit,
      best: ring.radiusKm,
      sigma: u.radiusKm,
      min: 1e-6 * ring.radiusKm,
      max: null,
      index: start,
      toInternal: SAME,
    },
    {
      parameter: `ring ${ring.ring} openingAngleDeg`,
      unit: 'deg' as Chi2MapUnit,
      best: ring.openingAngleDeg,
      sigma: u.openingAngleDeg,
      min: 0.01,
      max: 90,
      index: start + 1,
      toInternal: openingAsOblateness ? (v: number) => 1 - Math.sin(v * DEG) : DEG_TO_RAD,
    },
    {
      parameter: `ring ${ring.ring} positionAngleDeg`,
      unit: 'deg' as Chi2MapUnit,
      best: ring.positionAngleDeg,
      sigma: u.positionAngleDeg,
      min: null,
      max: null,
      index: start + 2,
      toInternal: DEG_TO_RAD,
    },
  ];
}

function isJoint(solution: Solution): boolean {
  return solution.limb !== null && solution.rings.length > 0 && solution.rings[0]?.centerFrom === 'joint';
}

/** Every parameter a map of this fit can take, in the order a client lists them. */
export function chi2MapParameters(solution: Solution, event: Pick<EventInput, 'fit'>): Chi2MapParameter[] {
  const strip = ({ parameter, unit, best, sigma, min, max }: Chi2MapParameter): Chi2MapParameter => ({
    parameter,
    unit,
    best,
    sigma,
    min,
    max,
  });
  const limb = limbParameters(solution, event.fit.limb.fixed);
  const rings = solution.rings.flatMap((r) => {
    const own = ringParameters(r, 0, true);
    if (isJoint(solution) || r.centerFrom === 'limb' || (r.centerFrom === undefined && solution.limb))
      return own;
    const u = r.uncertainty;
    return [
      ...own,
      ...(['centerFKm', 'centerGKm'] as const).map((c) => ({
        parameter: `ring ${r.ring} ${c}`,
        unit: 'km' as Chi2MapUnit,
        best: r[c],
        sigma: u[c] ?? 0,
        min: null,
        max: null,
        index: 0,
        toInternal: SAME,
      })),
    ];
  });
  return [...limb, ...rings].map(strip);
}

/** Which χ² a map of x and y takes, with the two parameters' indices in that problem's vector. */
function resolve(solution: Solution, event: Pick<EventInput, 'fit'>, request: Chi2MapRequest): Resolved {
  const known = chi2MapParameters(solution, event).map((p) => p.parameter);
  for (const axis of ['x', 'y'] as const)
    if (!known.includes(request[axis]))
      throw new GeometryInputError(
        axis,
        `"${request[axis]}" is not a fitted parameter of this fit; choose one of ${known.join(', ')}`,
      );
  if (request.x === request.y) throw new GeometryInputError('y', 'choose two different parameters');
  const limb = limbParameters(solution, event.fit.limb.fixed);
  if (isJoint(solution)) {
    const width = SHAPE_PARAMETER_COUNT + (solution.limb?.timeOffsets.length ?? 0);
    const rings = solution.rings.flatMap((r, k) => ringParameters(r, width + 3 * k, false));
    return { chi2Of: 'joint', ring: null, parameters: [...limb, ...rings] };
  }
  const limbNames = new Set(limb.map((p) => p.parameter));
  if (limbNames.has(request.x) && limbNames.has(request.y))
    return { chi2Of: 'limb', ring: null, parameters: limb };
  const ring = solution.rings.find(
    (r) => request.x.startsWith(`ring ${r.ring} `) && request.y.startsWith(`ring ${r.ring} `),
  );
  if (!ring)
    throw new GeometryInputError(
      'y',
      'the limb and each ring are fitted one after the other in this fit, so x and y must both be limb parameters or both parameters of one ring (a joint fit maps any two)',
    );
  const centre = (['centerFKm', 'centerGKm'] as const).map((c, index) => ({
    parameter: `ring ${ring.ring} ${c}`,
    unit: 'km' as Chi2MapUnit,
    best: ring[c],
    sigma: ring.uncertainty[c] ?? 0,
    min: null,
    max: null,
    index,
    toInternal: SAME,
  }));
  return { chi2Of: 'ring', ring, parameters: [...ringParameters(ring, 2, true), ...centre] };
}

function axisOf(
  p: Chi2MapParameter,
  range: Chi2MapRange | undefined,
  steps: number,
  path: string,
): Chi2MapAxis {
  let from: number;
  let to: number;
  if (range) {
    if (!(Number.isFinite(range.from) && Number.isFinite(range.to) && range.from < range.to))
      throw new GeometryInputError(path, 'give finite from < to');
    if ((p.min !== null && range.from < p.min) || (p.max !== null && range.to > p.max))
      throw new GeometryInputError(
        path,
        `${p.parameter} must stay ${p.min !== null && p.max !== null ? `within [${p.min}, ${p.max}]` : p.min !== null ? `at or above ${p.min}` : `at or below ${p.max}`}`,
      );
    ({ from, to } = range);
  } else {
    if (!(p.sigma > 0))
      throw new GeometryInputError(path, `${p.parameter} has no 1-sigma to set a default range: give one`);
    // One period of a position angle is 180°: wider would map the same ellipses twice.
    const half = Math.min(
      CHI2_MAP_DEFAULT_HALF_WIDTH_SIGMA * p.sigma,
      p.unit === 'deg' && p.parameter.endsWith('positionAngleDeg') ? ANGLE_HALF_TURN_DEG : Infinity,
    );
    from = Math.max(p.best - half, p.min ?? -Infinity);
    to = Math.min(p.best + half, p.max ?? Infinity);
  }
  const values = Array.from({ length: steps }, (_, k) => from + ((to - from) * k) / (steps - 1));
  return { ...p, values };
}

/** Checks a request against a fit and gives its axes; throws GeometryInputError naming the field. */
export function planChi2Map(
  solution: Solution,
  event: Pick<EventInput, 'fit'>,
  request: Chi2MapRequest,
): { x: Chi2MapAxis; y: Chi2MapAxis; chi2Of: Chi2Map['chi2Of']; ring: string | null } {
  const steps = request.steps ?? CHI2_MAP_DEFAULT_STEPS;
  if (!Number.isInteger(steps) || steps < CHI2_MAP_MIN_STEPS || steps > CHI2_MAP_MAX_STEPS)
    throw new GeometryInputError(
      'steps',
      `must be a whole number from ${CHI2_MAP_MIN_STEPS} to ${CHI2_MAP_MAX_STEPS}`,
    );
  const resolved = resolve(solution, event, request);
  const find = (name: string) => resolved.parameters.find((p) => p.parameter === name);
  const px = find(request.x);
  const py = find(request.y);
  if (!px || !py) throw new GeometryInputError('x', 'not a parameter of this map');
  return {
    chi2Of: resolved.chi2Of,
    ring: resolved.ring?.ring ?? null,
    x: axisOf(px, request.ranges?.x, steps, 'ranges.x'),
    y: axisOf(py, request.ranges?.y, steps, 'ranges.y'),
  };
}

/** The limb fit's input exactly as solveEvent builds it from the first projection. */
function limbInputOf(event: EventInput, projected: ProjectedEvent): LimbFitInput {
  return {
    points: projected.limbPoints,
    negatives: projected.negatives,
    fixed: event.fit.limb.fixed,
    modelErrorKm: event.fit.limb.modelErrorKm,
    fitTimeOffsets: event.fit.limb.fitTimeOffsets,
    seed: event.fit.seed ?? 1,
  };
}

function ellipseSource(problem: EllipseFitProblem, scaleKm: number): ProfileSource {
  return {
    minimise: (held, start) => {
      const fixed = [...problem.fixed];
      fixed.length = SHAPE_PARAMETER_COUNT + problem.offsetCount;
      for (const [k, v] of held) fixed[k] = v;
      const refiner = ellipseRefiner({ ...problem, fixed }, scaleKm);
      const { x, chi2, clear } = refiner.refine(start);
      return { full: refiner.toFull(x), chi2, clear };
    },
  };
}

function jointSource(input: JointLimbRingInput): ProfileSource {
  return {
    minimise: (held, start) => {
      const lsq = jointLeastSquares(input, held);
      const { x, chi2, clear } = lsq.refine(Float64Array.from(lsq.layout.free, (j) => start[j] as number));
      return { full: lsq.toFull(x), chi2, clear };
    },
  };
}

/**
 * The map of a solved fit: the event file it was solved from (for the points) and its stored solution (for
 * the best fit and the 1-sigma that set the default ranges). onProgress receives finished and total cells.
 */
export function chi2MapOfFit(
  event: EventInput,
  solution: Solution,
  request: Chi2MapRequest,
  onProgress?: (done: number, total: number) => void,
): Chi2Map {
  const steps = chi2MapSteps(event, solution, request);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    onProgress?.(step.value.done, step.value.total);
  }
}

/** chi2MapOfFit one grid cell at a time, for a caller that must not block for the whole map (the worker). */
export function* chi2MapSteps(
  event: EventInput,
  solution: Solution,
  request: Chi2MapRequest,
): Generator<{ done: number; total: number }, Chi2Map> {
  const plan = planChi2Map(solution, event, request);
  const first = projectEvent(event);
  const limb = solution.limb;
  let source: ProfileSource;
  let bestFull: Float64Array;
  let dof: number;
  let names: string[];
  const limbShape = (): number[] =>
    limb
      ? [
          limb.centerFKm,
          limb.centerGKm,
          limb.equatorialRadiusKm,
          limb.oblateness,
          limb.positionAngleDeg * DEG,
          ...limb.timeOffsets.map((o) => o.seconds),
        ]
      : [];
  const limbNames = [
    ...LIMB_PARAMETERS,
    ...(limb?.timeOffsets ?? []).map((o) => `timeOffsetSeconds ${o.station}`),
  ];
  const fixedNames = new Set(Object.keys(event.fit.limb.fixed));
  if (plan.chi2Of === 'limb' || plan.chi2Of === 'joint') {
    if (!limb) throw new GeometryInputError('x', 'this fit has no limb');
    const limbInput = limbInputOf(event, first);
    if (plan.chi2Of === 'limb') {
      source = ellipseSource(limbProblem(limbInput), limb.equatorialRadiusKm);
      bestFull = Float64Array.from(limbShape());
      dof = limb.dof;
      names = limbNames;
    } else {
      const input: JointLimbRingInput = {
        limb: limbInput,
        rings: [...first.ringPoints].map(([ring, points]) => ({ ring, points })),
        start: {
          limb: {
            ellipse: limb,
            timeOffsets: limb.timeOffsets,
          },
          rings: solution.rings,
        },
      };
      source = jointSource(input);
      bestFull = Float64Array.from([
        ...limbShape(),
        ...solution.rings.flatMap((r) => [r.radiusKm, r.openingAngleDeg * DEG, r.positionAngleDeg * DEG]),
      ]);
      dof = limb.dof + solution.rings.reduce((s, r) => s + r.dof, 0);
      names = [
        ...limbNames,
        ...solution.rings.flatMap((r) =>
          ['radiusKm', 'openingAngleDeg', 'positionAngleDeg'].map((p) => `ring ${r.ring} ${p}`),
        ),
      ];
    }
  } else {
    const ring = solution.rings.find((r) => r.ring === plan.ring);
    if (!ring) throw new GeometryInputError('x', `no ring "${plan.ring}" in this fit`);
    // The rings were fitted on the projection with the fitted clock offsets applied (docs/method.md, "Sky plane").
    const projected =
      limb && limb.timeOffsets.length > 0
        ? projectEvent(event, {
            timeOffsetsSeconds: Object.fromEntries(limb.timeOffsets.map((o) => [o.station, o.seconds])),
          })
        : first;
    const centreHeld = ring.centerFrom === 'limb' || (ring.centerFrom === undefined && limb !== null);
    const problem = ringProblem({
      ring: ring.ring,
      points: projected.ringPoints.get(ring.ring) ?? [],
      center: centreHeld ? { fKm: ring.centerFKm, gKm: ring.centerGKm } : null,
      seed: 1,
    });
    source = ellipseSource(problem, ring.radiusKm);
    bestFull = Float64Array.from([
      ring.centerFKm,
      ring.centerGKm,
      ring.radiusKm,
      1 - Math.sin(ring.openingAngleDeg * DEG),
      ring.positionAngleDeg * DEG,
    ]);
    dof = ring.dof;
    names = [
      ...(centreHeld ? [] : [`ring ${ring.ring} centerFKm`, `ring ${ring.ring} centerGKm`]),
      `ring ${ring.ring} radiusKm`,
      `ring ${ring.ring} openingAngleDeg`,
      `ring ${ring.ring} positionAngleDeg`,
    ];
  }
  const resolved = resolve(solution, event, request);
  const index = (name: string): { index: number; toInternal: (v: number) => number } => {
    const p = resolved.parameters.find((q) => q.parameter === name);
    if (!p) throw new GeometryInputError('x', `"${name}" is not in this map`);
    return p;
  };
  const ix = index(plan.x.parameter);
  const iy = index(plan.y.parameter);
  const best = source.minimise(new Map(), bestFull);
  const grid = yield* profileGridCells(
    source,
    best.full,
    ix.index,
    iy.index,
    plan.x.values.map(ix.toInternal),
    plan.y.values.map(iy.toInternal),
  );
  let gridMin = Infinity;
  let at: [number, number] = [0, 0];
  grid.chi2.forEach((row, j) =>
    row.forEach((c, i) => {
      if (c !== null && c < gridMin) {
        gridMin = c;
        at = [i, j];
      }
    }),
  );
  const minChi2 = Math.min(best.chi2, gridMin);
  const delta = grid.chi2.map((row) => row.map((c) => (c === null ? null : c - minChi2)));
  const levels = CHI2_MAP_LEVELS.map((l) => ({
    ...l,
    segments: contourSegments(delta, plan.x.values, plan.y.values, l.deltaChi2),
  }));
  const profiled = names.filter(
    (n) => n !== plan.x.parameter && n !== plan.y.parameter && !fixedNames.has(n),
  );
  return {
    chi2Of: plan.chi2Of,
    ring: plan.ring,
    x: plan.x,
    y: plan.y,
    profiled,
    chi2: grid.chi2,
    bestChi2: best.chi2,
    minChi2,
    dof,
    levels,
    cautions: chi2MapCautions(plan, grid.chi2, delta, best.chi2, gridMin, at, dof),
  };
}

function chi2MapCautions(
  plan: ReturnType<typeof planChi2Map>,
  chi2: Array<Array<number | null>>,
  delta: Array<Array<number | null>>,
  bestChi2: number,
  gridMin: number,
  at: [number, number],
  dof: number,
): string[] {
  const cautions: string[] = [];
  const fmt = (v: number) => (Math.abs(v) >= 1000 ? v.toFixed(0) : v.toPrecision(4));
  if (gridMin < bestChi2 - 1e-6 * Math.max(1, bestChi2))
    cautions.push(
      `A lower χ² (${fmt(gridMin)}) than the fit's (${fmt(bestChi2)}) was found at ${plan.x.parameter} = ${fmt(plan.x.values[at[0]] as number)}, ${plan.y.parameter} = ${fmt(plan.y.values[at[1]] as number)}: the fit stopped in a side minimum; Δχ² is measured from the lower, and the fit should be run again from there.`,
    );
  if (chi2.some((row) => row.some((c) => c === null)))
    cautions.push(
      'Empty cells have no fit clear of the negative chords (zero likelihood there), or no minimum was found.',
    );
  const one = CHI2_MAP_LEVELS[0]?.deltaChi2 ?? 2.3;
  const last = delta.length - 1;
  const edge = delta.some((row, j) =>
    row.some((d, i) => d !== null && d < one && (j === 0 || j === last || i === 0 || i === row.length - 1)),
  );
  if (edge) cautions.push('The 1σ region reaches the edge of the map: widen the ranges to see all of it.');
  if (dof > 0 && bestChi2 / dof > 3)
    cautions.push(
      `χ²/dof = ${(bestChi2 / dof).toFixed(2)}: the points scatter more than their sigmas allow, so the contours (not rescaled) are too tight.`,
    );
  if (dof <= 0)
    cautions.push('No degrees of freedom are left: the contours rest on the timing sigmas alone.');
  cautions.push(
    'Contours of Δχ² = 2.30, 6.18 and 11.8 hold 68.3, 95.4 and 99.7 % of the probability for two parameters only where χ² is close to quadratic; a curved or cut-off valley makes them approximate.',
  );
  return cautions;
}
