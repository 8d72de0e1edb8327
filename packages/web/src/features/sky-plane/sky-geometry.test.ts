import { describe, expect, it } from 'vitest';
import { ellipseRadiusKm } from '@limbus/geometry/ellipse';
import {
  bandEnvelope,
  errorBarKm,
  niceScaleLengthKm,
  outlineKm,
  rayToEllipseKm,
  ringEllipse,
} from './sky-geometry';
import { ringPlaneRadiusKm } from '../../../../geometry/src/fit/ring-fit';
import { expectClose } from '../../../../geometry/test/expect-close';

const DEG = Math.PI / 180;
const circle = (radiusKm: number, centerFKm = 0, centerGKm = 0) => ({
  centerFKm,
  centerGKm,
  equatorialRadiusKm: radiusKm,
  oblateness: 0,
  positionAngleDeg: 0,
});

describe('sky-geometry', () => {
  it('ringEllipse() gives the axis ratio |sin B| of a circle seen at opening angle B', () => {
    // From memory: orthographic projection of a circle inclined by i to the sky plane has axis ratio cos i;
    // the opening angle is B = 90° − i, so b/a = sin B.
    const ring = ringEllipse({
      centerFKm: 1,
      centerGKm: 2,
      radiusKm: 300,
      openingAngleDeg: 30,
      positionAngleDeg: 40,
    });
    expectClose(ring.equatorialRadiusKm * (1 - ring.oblateness), 150, 1e-9);
    expect(ring.positionAngleDeg).toBe(40);
    expectClose(ringEllipse({ ...ring, radiusKm: 300, openingAngleDeg: -30 }).oblateness, 0.5, 1e-12);
    expectClose(ringEllipse({ ...ring, radiusKm: 300, openingAngleDeg: 90 }).oblateness, 0, 1e-12);
  });

  it('ringEllipse() outline lies at the ring radius when deprojected the way the ring fit does', () => {
    // Cross-check of conventions (P of the semi-minor axis, b = R·|sin B|) against ringPlaneRadiusKm in
    // geometry/src/fit/ring-fit.ts, which undoes the foreshortening independently.
    const ring = { centerFKm: -7, centerGKm: 12, radiusKm: 310, openingAngleDeg: 35, positionAngleDeg: 122 };
    for (const p of outlineKm(ringEllipse(ring), 24)) {
      const r = ringPlaneRadiusKm(p, { fKm: -7, gKm: 12 }, ring.openingAngleDeg, ring.positionAngleDeg);
      expectClose(r, 310, 1e-9);
    }
  });

  it('rayToEllipseKm() from the centre equals the polar radius of the geometry package', () => {
    // Cross-check against ellipseRadiusKm (geometry/src/fit/ellipse.ts), a different formula
    // (ab / √(b² sin²ψ + a² cos²ψ)) for the same quantity.
    const e = { centerFKm: 3, centerGKm: -4, equatorialRadiusKm: 120, oblateness: 0.2, positionAngleDeg: 35 };
    for (const paDeg of [0, 17, 35, 90, 125, 200, 305]) {
      const r = rayToEllipseKm({ fKm: 3, gKm: -4 }, paDeg * DEG, e);
      expect(r).not.toBeNull();
      expectClose(r ?? NaN, ellipseRadiusKm(e, paDeg * DEG), 1e-9);
    }
  });

  it('rayToEllipseKm() from an off-centre point in a circle gives r − d ahead and r + d behind', () => {
    // Exact: origin at distance d east of the centre of a circle of radius r.
    expectClose(rayToEllipseKm({ fKm: 4, gKm: 0 }, 90 * DEG, circle(10)) ?? NaN, 6, 1e-12);
    expectClose(rayToEllipseKm({ fKm: 4, gKm: 0 }, 270 * DEG, circle(10)) ?? NaN, 14, 1e-12);
    expect(rayToEllipseKm({ fKm: 40, gKm: 0 }, 0, circle(10))).toBeNull();
  });

  it('bandEnvelope() runs along the nearest and farthest sample edge', () => {
    const band = bandEnvelope({ fKm: 0, gKm: 0 }, [circle(10), circle(12), circle(11)], 8);
    expect(band?.innerKm).toHaveLength(8);
    for (const p of band?.innerKm ?? []) expectClose(Math.hypot(p.fKm, p.gKm), 10, 1e-9);
    for (const p of band?.outerKm ?? []) expectClose(Math.hypot(p.fKm, p.gKm), 12, 1e-9);
    expect(bandEnvelope({ fKm: 0, gKm: 0 }, [circle(1, 50, 50)], 8)).toBeNull();
  });

  it('errorBarKm() puts sigma on both sides along the chord direction', () => {
    const [a, b] = errorBarKm({ fKm: 10, gKm: 5 }, { fKm: 0.6, gKm: 0.8 }, 2);
    expect(a).toEqual({ fKm: 10 - 1.2, gKm: 5 - 1.6 });
    expect(b).toEqual({ fKm: 10 + 1.2, gKm: 5 + 1.6 });
  });

  it('niceScaleLengthKm() picks 1, 2 or 5 times a power of ten not above a fifth of the span', () => {
    expect(niceScaleLengthKm(1000)).toBe(200);
    expect(niceScaleLengthKm(37)).toBe(5);
    expect(niceScaleLengthKm(0.9)).toBeCloseTo(0.1, 12);
    expect(niceScaleLengthKm(0)).toBe(1);
  });
});
