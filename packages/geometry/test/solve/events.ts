// Invented events for the solve tests, built on the independent fixtures of ./fixtures.ts: a circular limb
// crossed by seven stations (one negative), and a ring's dips on the first five stations' tracks.
import { DEG } from '../../src/math.js';
import type { ChordInput, EventInput, RingEventInput } from '../../src/types.js';
import { LIMB_STATIONS, crossings, isoUtc, scenario, type Scenario } from './fixtures.js';

export const CENTRAL = '2028-03-14T02:10:00.000Z';
export const HASH = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';

/** True limb: a circle of 320 km centred 42 km east and 17 km south of the ephemeris position. */
export const TRUE_CENTER = { fKm: 42, gKm: -17 };
export const TRUE_RADIUS_KM = 320;

export function limbEvent(offsets: Record<string, number> = {}): { event: EventInput; distanceKm: number } {
  const sc = scenario(LIMB_STATIONS, CENTRAL);
  const chords: ChordInput[] = LIMB_STATIONS.map((station) => {
    const times = crossings(
      sc,
      station,
      sc.centralMs - 60_000,
      sc.centralMs + 60_000,
      (p) => Math.hypot(p.fKm - TRUE_CENTER.fKm, p.gKm - TRUE_CENTER.gKm) - TRUE_RADIUS_KM,
    );
    // A station's clock that runs late by δ reports every time δ too late: reported = true − offset.
    const shift = (ms: number): string => isoUtc(ms - (offsets[station.id] ?? 0) * 1000);
    if (times.length === 2)
      return {
        station: station.id,
        type: 'positive',
        disappearance: { time: shift(times[0]!), sigmaSeconds: 0.02 },
        reappearance: { time: shift(times[1]!), sigmaSeconds: 0.02 },
        timeOffsetSeconds: 0,
      };
    return {
      station: station.id,
      type: 'negative',
      start: isoUtc(sc.centralMs - 60_000),
      end: isoUtc(sc.centralMs + 60_000),
      timeOffsetSeconds: 0,
    };
  });
  return { event: { ...sc.event, chords }, distanceKm: sc.distanceKm };
}

/** Invented ring: R = 1500 km, width 12 km, B = 28°, pole P = 35°, centred 30 km west and 12 km north. */
export const RING = { fKm: -30, gKm: 12, radiusKm: 1500, widthKm: 12, bDeg: 28, pDeg: 35 };

/** Dips of a ring on the first five stations' independently computed tracks: edge crossings to 1 µs. */
export function ringDips(sc: Scenario, ring: typeof RING): RingEventInput[] {
  const radius = (p: { fKm: number; gKm: number }): number => {
    const df = p.fKm - ring.fKm;
    const dg = p.gKm - ring.gKm;
    const pRad = ring.pDeg * DEG;
    const u = df * Math.cos(pRad) - dg * Math.sin(pRad);
    const w = (df * Math.sin(pRad) + dg * Math.cos(pRad)) / Math.sin(ring.bDeg * DEG);
    return Math.hypot(u, w);
  };
  const ringEvents: RingEventInput[] = [];
  for (const station of LIMB_STATIONS.slice(0, 5)) {
    const from = sc.centralMs - 150_000;
    const to = sc.centralMs + 150_000;
    const outer = crossings(sc, station, from, to, (p) => radius(p) - (ring.radiusKm + ring.widthKm / 2));
    const inner = crossings(sc, station, from, to, (p) => radius(p) - (ring.radiusKm - ring.widthKm / 2));
    if (outer.length !== 2 || inner.length !== 2)
      throw new Error(`${station.id} does not cross the ring twice`);
    // Ingress dip: outer edge then inner edge; egress dip: inner then outer.
    for (const [start, end] of [
      [outer[0]!, inner[0]!],
      [inner[1]!, outer[1]!],
    ] as const) {
      ringEvents.push({
        station: station.id,
        ring: 'alpha',
        start: { time: isoUtc(start), sigmaSeconds: 0.01 },
        end: { time: isoUtc(end), sigmaSeconds: 0.01 },
      });
    }
  }
  return ringEvents;
}
