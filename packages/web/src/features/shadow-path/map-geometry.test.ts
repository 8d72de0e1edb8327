import type { PathPoint } from '@limbus/schema/planning';
import { geoArea, geoContains } from 'd3';
import { describe, expect, it } from 'vitest';
import { bandPolygons, framingFeature, lineFeature, lineRuns, nightCap, wrapLonDeg } from './map-geometry';
import { expectClose } from '../../../../geometry/test/expect-close';

const DEG = Math.PI / 180;

/** A line along a parallel from 0° longitude, 0.1° per 10 s grid step, from 20:00:00 UTC. */
function parallelLine(count: number, latDeg = 0, skip: number[] = []): PathPoint[] {
  const points: PathPoint[] = [];
  for (let k = 0; k < count; k++)
    if (!skip.includes(k))
      points.push({
        timeUtc: new Date(Date.UTC(2029, 8, 7, 20, 0, 10 * k)).toISOString(),
        latDeg,
        lonDeg: 0.1 * k,
      });
  return points;
}

describe('map-geometry', () => {
  it('nightCap() covers the antisolar point and ends 90° from the subsolar point', () => {
    const sun = { latDeg: 20, lonDeg: 170 };
    const night = nightCap(sun);
    // The terminator of a sphere lit by a distant source is the great circle 90° from the subsolar point
    // (from memory).
    expect(geoContains(night, [wrapLonDeg(170 + 180), -20])).toBe(true);
    expect(geoContains(night, [170, 20])).toBe(false);
    expect(geoContains(night, [170, 20 - 91])).toBe(true);
    expect(geoContains(night, [170, 20 - 89])).toBe(false);
    // Half the sphere (4π sr in all), to the polygon's one-degree precision.
    expectClose(geoArea(night), 2 * Math.PI, 0.001);
    // Below 12° (nautical twilight over): the cap of radius 78°, of area 2π(1 − cos 78°) (spherical cap).
    expectClose(geoArea(nightCap(sun, 12)), 2 * Math.PI * (1 - Math.cos(78 * DEG)), 0.002);
  });

  it('wrapLonDeg() folds longitudes into [−180, 180)', () => {
    expect(wrapLonDeg(180)).toBe(-180);
    expect(wrapLonDeg(-190)).toBe(170);
    expect(wrapLonDeg(350)).toBe(-10);
  });

  it('lineRuns() splits a line where grid points are missing, and lineFeature() drops single points', () => {
    const runs = lineRuns(parallelLine(10, 0, [4, 7, 8]));
    expect(runs.map((r) => r.length)).toEqual([4, 2, 1]);
    expect(lineFeature(parallelLine(10, 0, [4, 7, 8])).geometry.coordinates).toHaveLength(2);
  });

  it('bandPolygons() wraps the band between two edges, not the rest of the sphere', () => {
    const [band, ...more] = bandPolygons(parallelLine(20, 0.8), parallelLine(20, 1.2));
    expect(more).toEqual([]);
    if (band === undefined) throw new Error('no band');
    // Between 0.8° and 1.2° of latitude along 1.9° of longitude: 0.4° × 1.9° × cos 1° of solid angle.
    expectClose(geoArea(band), 0.4 * DEG * 1.9 * DEG * Math.cos(DEG), 0.01 * DEG * DEG);
    expect(geoContains(band, [1, 1])).toBe(true);
    expect(geoContains(band, [1, 0])).toBe(false);
    // Either edge given first draws the same band.
    const [reversed] = bandPolygons(parallelLine(20, 1.2), parallelLine(20, 0.8));
    expectClose(geoArea(reversed ?? band), geoArea(band), 1e-12);
    // A grid time missing from one edge breaks the band in two.
    expect(bandPolygons(parallelLine(20, 0.8), parallelLine(20, 1.2, [10]))).toHaveLength(2);
  });

  it('framingFeature() holds the lines and the stations, or nothing', () => {
    expect(framingFeature([], [])).toBeNull();
    const frame = framingFeature([parallelLine(3)], [{ latDeg: 10, lonDeg: 20 }]);
    expect(frame?.geometry.coordinates).toHaveLength(2);
  });
});
