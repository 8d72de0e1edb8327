import { describe, expect, it } from 'vitest';
import { chi2MapOfFit, chi2MapParameters, planChi2Map } from '../../src/fit/chi2-map-of-fit.js';
import { CHI2_MAP_LEVELS } from '../../src/fit/chi2-map.js';
import { DEG } from '../../src/math.js';
import { solveEvent } from '../../src/solve.js';
import { GeometryInputError, type EventInput, type RingCenterFrom } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { CENTRAL, HASH, RING, TRUE_CENTER, limbEvent, ringDips } from '../solve/events.js';
import { LIMB_STATIONS, scenario } from '../solve/fixtures.js';

/** The invented limb event of the solve tests with a ring concentric with it (test/solve/events.ts). */
function ringEvent(centerFrom: RingCenterFrom): EventInput {
  const { event } = limbEvent();
  const ringEvents = ringDips(scenario(LIMB_STATIONS, CENTRAL), {
    ...RING,
    fKm: TRUE_CENTER.fKm,
    gKm: TRUE_CENTER.gKm,
  });
  return { ...event, ringEvents, fit: { ...event.fit, ring: { centerFrom } } };
}

function refusal(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    if (error instanceof GeometryInputError) return `${error.path}: ${error.detail}`;
    throw error;
  }
  return 'accepted';
}

/** Half the extent along x (or y) of a contour's segments. */
function halfExtent(segments: number[][], axis: 0 | 1): number {
  const v = segments.flatMap((s) => [s[axis] as number, s[axis + 2] as number]);
  return (Math.max(...v) - Math.min(...v)) / 2;
}

describe('chi2MapOfFit()', () => {
  it('chi2MapOfFit() of a joint fit: its 1σ contour spans √2.30 times the linearised 1σ of either axis', () => {
    // The joint fit's 1σ are √diag((JᵀJ)⁻¹) (Numerical Recipes 3rd ed., §15.5.1); near a quadratic minimum
    // the profile's Δχ² = 2.30 contour projects onto each axis as ±√2.30 σ (ibid. §15.6.5, Fig. 15.6.4). The
    // dips and chords are exact and their σt small, so χ² is quadratic across ±4σ to a per cent.
    const event = ringEvent('joint');
    const solution = solveEvent(event, { inputSha256: HASH });
    const map = chi2MapOfFit(event, solution, { x: 'centerFKm', y: 'ring alpha radiusKm', steps: 21 });
    expect(map.chi2Of).toBe('joint');
    expect(map.profiled).toEqual([
      'centerGKm',
      'equatorialRadiusKm',
      'oblateness',
      'positionAngleDeg',
      'ring alpha openingAngleDeg',
      'ring alpha positionAngleDeg',
    ]);
    const limb = solution.limb!;
    const ring = solution.rings[0]!;
    // Re-minimised from the stored fit, whose χ² is the limb's plus the ring's.
    expect(map.bestChi2).toBeLessThanOrEqual(limb.chi2 + ring.chi2 + 1e-9);
    expectClose(map.bestChi2, limb.chi2 + ring.chi2, 1e-6);
    expect(map.dof).toBe(limb.dof + ring.dof);
    const one = map.levels[0]!;
    expect(one.deltaChi2).toBe(CHI2_MAP_LEVELS[0]!.deltaChi2);
    const cell = (8 * limb.uncertainty.centerFKm) / 20;
    expectClose(halfExtent(one.segments, 0), Math.sqrt(2.2958) * limb.uncertainty.centerFKm, cell / 2);
    expectClose(halfExtent(one.segments, 1) / (Math.sqrt(2.2958) * ring.uncertainty.radiusKm), 1, 0.05);
    // Every cell of the grid is the profile: none is below the minimum, and the axes run ±4σ.
    for (const c of map.chi2.flat()) expect(c).toBeGreaterThanOrEqual(map.minChi2);
    expectClose(map.x.values[0]!, limb.centerFKm - 4 * limb.uncertainty.centerFKm, 1e-9);
    expectClose(map.x.values[20]!, limb.centerFKm + 4 * limb.uncertainty.centerFKm, 1e-9);
  });

  it('chi2MapOfFit() maps one ring of a sequential fit about its limb centre, R, B and P its only parameters', () => {
    const event = ringEvent('limb');
    const solution = solveEvent(event, { inputSha256: HASH });
    const map = chi2MapOfFit(event, solution, {
      x: 'ring alpha radiusKm',
      y: 'ring alpha openingAngleDeg',
      steps: 9,
    });
    expect(map.chi2Of).toBe('ring');
    expect(map.ring).toBe('alpha');
    expect(map.profiled).toEqual(['ring alpha positionAngleDeg']);
    expect(map.dof).toBe(solution.rings[0]!.dof);
    expectClose(map.bestChi2, solution.rings[0]!.chi2, 1e-6 + 1e-6 * solution.rings[0]!.chi2);
  });

  it('chi2MapOfFit() leaves empty the cells where the limb must cross a negative chord', () => {
    // Centre and pole angle fixed, the map over (a, ε) has nothing left to move: a cell is allowed exactly
    // when the ellipse stays off the negative path, i.e. when its support function along the path's normal,
    // h = √(a²(n·u)² + b²(n·w)²), b = a(1 − ε), is below the path's distance from the centre (the support
    // function of an ellipse; common practice, no source).
    const { event } = limbEvent();
    const fixed = { centerFKm: TRUE_CENTER.fKm, centerGKm: TRUE_CENTER.gKm, positionAngleDeg: 0 };
    const fixedEvent: EventInput = { ...event, fit: { ...event.fit, limb: { ...event.fit.limb, fixed } } };
    const solution = solveEvent(fixedEvent, { inputSha256: HASH });
    const path = solution.chords.find((c) => c.type === 'negative')!.path;
    const p0 = path[0]!;
    const p1 = path[path.length - 1]!;
    const length = Math.hypot(p1.fKm - p0.fKm, p1.gKm - p0.gKm);
    const n = { f: -(p1.gKm - p0.gKm) / length, g: (p1.fKm - p0.fKm) / length };
    const distance = Math.abs((p0.fKm - TRUE_CENTER.fKm) * n.f + (p0.gKm - TRUE_CENTER.gKm) * n.g);
    const map = chi2MapOfFit(fixedEvent, solution, {
      x: 'equatorialRadiusKm',
      y: 'oblateness',
      ranges: { x: { from: 300, to: distance * 1.6 }, y: { from: 0, to: 0.5 } },
      steps: 9,
    });
    // P = 0: the semi-major axis along (cos 0, −sin 0) = +f, the semi-minor along +g.
    let empty = 0;
    map.y.values.forEach((eps, j) =>
      map.x.values.forEach((a, i) => {
        const h = Math.hypot(a * n.f, a * (1 - eps) * n.g);
        if (h < distance - 0.5) expect(map.chi2[j]![i]).not.toBeNull();
        if (h > distance + 0.5) {
          expect(map.chi2[j]![i]).toBeNull();
          empty++;
        }
      }),
    );
    expect(empty).toBeGreaterThan(5);
    expect(map.cautions.some((c) => c.startsWith('Empty cells'))).toBe(true);
    expect(map.profiled).toEqual([]);
  });

  it('chi2MapParameters() lists the fitted parameters: none held fixed, ring centres only where fitted', () => {
    const { event } = limbEvent();
    const fixedEvent: EventInput = {
      ...event,
      fit: { ...event.fit, limb: { ...event.fit.limb, fixed: { oblateness: 0 } } },
    };
    const solution = solveEvent(fixedEvent, { inputSha256: HASH });
    expect(chi2MapParameters(solution, fixedEvent).map((p) => p.parameter)).toEqual([
      'centerFKm',
      'centerGKm',
      'equatorialRadiusKm',
      'positionAngleDeg',
    ]);
    const free = ringEvent('free');
    const names = chi2MapParameters(solveEvent(free, { inputSha256: HASH }), free).map((p) => p.parameter);
    expect(names.slice(-5)).toEqual([
      'ring alpha radiusKm',
      'ring alpha openingAngleDeg',
      'ring alpha positionAngleDeg',
      'ring alpha centerFKm',
      'ring alpha centerGKm',
    ]);
  });

  it('planChi2Map() refuses, naming the field, what a map of this fit cannot take', () => {
    const event = ringEvent('limb');
    const solution = solveEvent(event, { inputSha256: HASH });
    const plan = (request: Parameters<typeof planChi2Map>[2]) =>
      refusal(() => planChi2Map(solution, event, request));
    expect(plan({ x: 'radius', y: 'centerGKm' })).toMatch(
      /^x: "radius" is not a fitted parameter of this fit; choose one of centerFKm, /,
    );
    expect(plan({ x: 'centerGKm', y: 'centerGKm' })).toBe('y: choose two different parameters');
    expect(plan({ x: 'centerGKm', y: 'ring alpha radiusKm' })).toMatch(
      /^y: the limb and each ring are fitted one after the other/,
    );
    expect(plan({ x: 'centerFKm', y: 'oblateness', ranges: { y: { from: 0, to: 1.2 } } })).toBe(
      'ranges.y: oblateness must stay within [0, 0.999]',
    );
    expect(plan({ x: 'centerFKm', y: 'centerGKm', ranges: { x: { from: 3, to: 3 } } })).toBe(
      'ranges.x: give finite from < to',
    );
    expect(plan({ x: 'centerFKm', y: 'centerGKm', steps: 3 })).toBe(
      'steps: must be a whole number from 5 to 61',
    );
    // A position angle's default range is one period at most, and an opening angle stays within (0°, 90°].
    const wide = planChi2Map(solution, event, {
      x: 'ring alpha positionAngleDeg',
      y: 'ring alpha openingAngleDeg',
      ranges: { x: { from: 10, to: 60 } },
    });
    const limbP = planChi2Map(solution, event, { x: 'positionAngleDeg', y: 'centerFKm' });
    expect(limbP.x.values[24]! - limbP.x.values[0]!).toBeLessThanOrEqual(180);
    expect(wide.x.values[0]).toBe(10);
    expect(wide.y.values[24]).toBeLessThanOrEqual(90);
    expect(Math.sin(wide.y.values[0]! * DEG)).toBeGreaterThan(0);
  });
});
