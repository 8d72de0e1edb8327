import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ellipseFrame,
  ellipseOutline,
  ellipseRadiusKm,
  frameResidualGradient,
  normaliseEllipse,
  pathClearance,
  radialResidualKm,
} from '../../src/fit/ellipse.js';
import { DEG } from '../../src/math.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

const ellipseArb = fc.record({
  centerFKm: fc.double({ min: -500, max: 500, noNaN: true }),
  centerGKm: fc.double({ min: -500, max: 500, noNaN: true }),
  equatorialRadiusKm: fc.double({ min: 10, max: 2000, noNaN: true }),
  oblateness: fc.double({ min: 0, max: 0.6, noNaN: true }),
  positionAngleDeg: fc.double({ min: 0, max: 180, maxExcluded: true, noNaN: true }),
});
const angleArb = fc.double({ min: 0, max: 2 * Math.PI, noNaN: true });

// Points written from the parametric form x = a cos t, y = b sin t in the ellipse's own axes, rotated by
// P independently of the fitter's code (common practice, no source).
function pointOn(e: LimbEllipse, t: number): { fKm: number; gKm: number } {
  const a = e.equatorialRadiusKm;
  const b = a * (1 - e.oblateness);
  const p = e.positionAngleDeg * DEG;
  const alongMajor = { f: Math.cos(p), g: -Math.sin(p) };
  const alongMinor = { f: Math.sin(p), g: Math.cos(p) };
  const x = a * Math.cos(t);
  const y = b * Math.sin(t);
  return {
    fKm: e.centerFKm + x * alongMajor.f + y * alongMinor.f,
    gKm: e.centerGKm + x * alongMajor.g + y * alongMinor.g,
  };
}

describe('ellipse model', () => {
  it('radialResidualKm() is zero for a point on the ellipse', () => {
    fc.assert(
      fc.property(ellipseArb, angleArb, (e, t) => {
        expectClose(radialResidualKm(pointOn(e, t), e), 0, 1e-9 * e.equatorialRadiusKm);
      }),
    );
  });

  it('radialResidualKm() equals the distance along the radius for a point scaled out from the centre', () => {
    fc.assert(
      fc.property(ellipseArb, angleArb, fc.double({ min: 0.2, max: 3, noNaN: true }), (e, t, s) => {
        const on = pointOn(e, t);
        const r = Math.hypot(on.fKm - e.centerFKm, on.gKm - e.centerGKm);
        const p = {
          fKm: e.centerFKm + s * (on.fKm - e.centerFKm),
          gKm: e.centerGKm + s * (on.gKm - e.centerGKm),
        };
        expectClose(radialResidualKm(p, e), (s - 1) * r, 1e-9 * e.equatorialRadiusKm);
      }),
    );
  });

  it('radialResidualKm() does not change when P turns by 180°', () => {
    fc.assert(
      fc.property(
        ellipseArb,
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        (e, f, g) => {
          const turned = { ...e, positionAngleDeg: e.positionAngleDeg + 180 };
          const p = { fKm: f, gKm: g };
          expectClose(radialResidualKm(p, turned), radialResidualKm(p, e), 1e-9 * e.equatorialRadiusKm);
        },
      ),
    );
  });

  it('radialResidualKm() ignores P when the oblateness is 0', () => {
    fc.assert(
      fc.property(
        ellipseArb,
        angleArb,
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        fc.double({ min: -3000, max: 3000, noNaN: true }),
        (e, p2, f, g) => {
          const round = { ...e, oblateness: 0 };
          const p = { fKm: f, gKm: g };
          expectClose(
            radialResidualKm(p, { ...round, positionAngleDeg: p2 / DEG }),
            radialResidualKm(p, round),
            1e-9 * e.equatorialRadiusKm,
          );
        },
      ),
    );
  });

  it('ellipseRadiusKm() gives a along the semi-major axis and a(1 − ε) along the pole', () => {
    const e = { centerFKm: 3, centerGKm: -4, equatorialRadiusKm: 500, oblateness: 0.2, positionAngleDeg: 30 };
    expectClose(ellipseRadiusKm(e, 30 * DEG), 400, 1e-9);
    expectClose(ellipseRadiusKm(e, 210 * DEG), 400, 1e-9);
    expectClose(ellipseRadiusKm(e, 120 * DEG), 500, 1e-9);
  });

  it('ellipseOutline() points lie on the ellipse at the radius ellipseRadiusKm() gives', () => {
    fc.assert(
      fc.property(ellipseArb, (e) => {
        for (const p of ellipseOutline(e, 16)) {
          const df = p.fKm - e.centerFKm;
          const dg = p.gKm - e.centerGKm;
          expectClose(
            Math.hypot(df, dg),
            ellipseRadiusKm(e, Math.atan2(df, dg)),
            1e-9 * e.equatorialRadiusKm,
          );
        }
      }),
    );
  });

  it('frameResidualGradient() gives ρ and a gradient matching a central difference of radialResidualKm()', () => {
    fc.assert(
      fc.property(ellipseArb, angleArb, fc.double({ min: 0.5, max: 2, noNaN: true }), (e, t, s) => {
        const on = pointOn(e, t);
        const p = {
          fKm: e.centerFKm + s * (on.fKm - e.centerFKm),
          gKm: e.centerGKm + s * (on.gKm - e.centerGKm),
        };
        const grad: [number, number, number] = [0, 0, 0];
        frameResidualGradient(p.fKm, p.gKm, ellipseFrame(e), grad);
        expectClose(grad[0], radialResidualKm(p, e), 1e-9 * e.equatorialRadiusKm);
        const h = 1e-4 * e.equatorialRadiusKm;
        const df =
          (radialResidualKm({ ...p, fKm: p.fKm + h }, e) - radialResidualKm({ ...p, fKm: p.fKm - h }, e)) /
          (2 * h);
        const dg =
          (radialResidualKm({ ...p, gKm: p.gKm + h }, e) - radialResidualKm({ ...p, gKm: p.gKm - h }, e)) /
          (2 * h);
        expectClose(grad[1], df, 1e-5);
        expectClose(grad[2], dg, 1e-5);
      }),
    );
  });

  it('normaliseEllipse() keeps the same curve while bringing ε into [0, 1) and P into [0, 180)', () => {
    const e = {
      centerFKm: 0,
      centerGKm: 0,
      equatorialRadiusKm: 400,
      oblateness: -0.25,
      positionAngleDeg: 170,
    };
    const n = normaliseEllipse(e);
    expectClose(n.equatorialRadiusKm, 500, 1e-9);
    expectClose(n.oblateness, 0.2, 1e-12);
    expectClose(n.positionAngleDeg, 80, 1e-9);
    for (const p of ellipseOutline(e, 12)) expectClose(radialResidualKm(p, n), 0, 1e-9);
  });

  it('pathClearance() is below 1 exactly when a straight path cuts the ellipse', () => {
    // Circle of radius 100: a horizontal line at height h cuts it when |h| < 100 (common practice, no source).
    const e = { centerFKm: 0, centerGKm: 0, equatorialRadiusKm: 100, oblateness: 0, positionAngleDeg: 0 };
    const fr = ellipseFrame(e);
    const line = (h: number) => [
      { fKm: -300, gKm: h },
      { fKm: 300, gKm: h },
    ];
    expectClose(pathClearance(line(99), fr), 0.99, 1e-12);
    expectClose(pathClearance(line(101), fr), 1.01, 1e-12);
    // A segment that stops short of the circle stays clear even though its line would cut it.
    expect(
      pathClearance(
        [
          { fKm: -300, gKm: 0 },
          { fKm: -150, gKm: 0 },
        ],
        fr,
      ),
    ).toBeGreaterThan(1);
  });
});
