import {
  AstroTime,
  Body,
  Equator,
  EquatorFromVector,
  Horizon,
  Observer,
  RotateVector,
  Rotation_EQJ_EQD,
  Vector,
} from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { pathMapExtras } from '../../src/placement/path-map.js';
import { greatCircleKm, suggestSites } from '../../src/placement/site-search.js';
import { briefStations, MIN_WATCH_HALF_SECONDS } from '../../src/placement/station-brief.js';
import { contactTimeSigma } from '../../src/placement/contact-time-sigma.js';
import { predictEvent } from '../../src/predict/predict-event.js';
import type { PredictionSettings } from '../../src/predict/types.js';
import type { StationInput } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { fixedStar, groundDistanceKm, predictScenario, settings } from '../predict/fixtures.js';
import { basisOf } from '../solve/fixtures.js';

const J2000_MS = Date.UTC(2000, 0, 1, 12);
const MAS_PER_RAD = (180 / Math.PI) * 3_600_000;

// An invented slow, distant body crossing the Arabian Sea at night (21:42 UTC is about 02:20 local), its
// shadow moving at about 20 km/s; built without the prediction code (test/predict/fixtures.ts).
const STAR = fixedStar(23.71842, 8.90417);
const STATIONS: StationInput[] = [
  { id: 'north', latDeg: 12.2, lonDeg: 69.9, heightM: 300 },
  { id: 'middle', latDeg: 10.1, lonDeg: 70.5, heightM: 380 },
];
const sc = predictScenario({
  title: 'placement scenario',
  star: STAR,
  centre: { latDeg: 10, lonDeg: 70.5 },
  centralUtc: '2029-09-07T21:42:00Z',
  distanceKm: 6.214e9,
  velocityKmPerS: [-19.5, 4.2, 0],
  stations: STATIONS,
  rowMinutes: [-40, -20, 0, 20, 40],
});
const SETTINGS: PredictionSettings = settings({
  bodyRadiusKm: 365,
  uncertaintyMas: { raCosDec: 6, dec: 9 },
  rings: [{ ring: 'R1', radiusKm: 1100 }],
});
const prediction = predictEvent(sc.event, SETTINGS);

function leftNormal(ms: number): { f: number; g: number } {
  const v = sc.shadowVelocity(ms);
  const speed = Math.hypot(v.f, v.g);
  return { f: -v.g / speed, g: v.f / speed };
}

/** Geometric altitudes from astronomy-engine (its own Earth rotation, precession and Sun): Horizon, no refraction. */
function aeAltitudes(site: { latDeg: number; lonDeg: number }, ms: number): { star: number; sun: number } {
  const time = new AstroTime((ms - J2000_MS) / 86_400_000);
  const observer = new Observer(site.latDeg, site.lonDeg, 0);
  const s = basisOf(STAR.raDeg, STAR.decDeg).s;
  const eq = EquatorFromVector(RotateVector(Rotation_EQJ_EQD(time), new Vector(s[0], s[1], s[2], time)));
  const sun = Equator(Body.Sun, time, observer, true, false);
  return {
    star: Horizon(time, observer, eq.ra, eq.dec).altitude,
    sun: Horizon(time, observer, sun.ra, sun.dec).altitude,
  };
}

describe('placement on a predicted path', () => {
  it('suggestSites() puts each site on its offset line, at night with the star up, nearest the stations', () => {
    const counted = prediction.stations.map((p) => {
      const s = STATIONS.find((x) => x.id === p.station) as StationInput;
      return { crossTrackKm: p.crossTrackKm, latDeg: s.latDeg, lonDeg: s.lonDeg };
    });
    const result = suggestSites(sc.event, SETTINGS, prediction, {
      sites: 3,
      ringsToo: false,
      region: null,
      stations: counted,
      sunAltitudeBelowDeg: -12,
      starAltitudeAboveDeg: 20,
    });
    expect(result.suggestions).toHaveLength(3);
    expect(result.reference.kind).toBe('stations');
    // The path's 1σ across its direction: D·σ projected on n; with σ_f ≠ σ_g it lies between D·6 mas
    // (180.8 km) and D·9 mas (271.1 km) (D = 6.214e9 km, 1 mas = 4.848e-9 rad).
    expect(result.sigmaCrossTrackKm).toBeGreaterThan((6.214e9 * 6) / MAS_PER_RAD);
    expect(result.sigmaCrossTrackKm).toBeLessThan((6.214e9 * 9) / MAS_PER_RAD);
    for (const s of result.suggestions) {
      if (!s.site) throw new Error(`no site at ${s.crossTrackKm} km: ${s.noSiteReason}`);
      const ms = Date.parse(s.site.timeUtc);
      // On the line at its time: the scenario's independent (f, g) of the ground point is d·n (0.5 km: the
      // millisecond rounding of the time moves a 20 km/s shadow by 0.02 km; the rest is the two chains).
      const fg = sc.fg({ latDeg: s.site.latDeg, lonDeg: s.site.lonDeg, heightM: 0 }, ms);
      const n = leftNormal(ms);
      expectClose(fg.fKm, s.crossTrackKm * n.f, 0.5);
      expectClose(fg.gKm, s.crossTrackKm * n.g, 0.5);
      const ae = aeAltitudes(s.site, ms);
      expectClose(s.site.starAltitudeDeg, ae.star, 0.01);
      expectClose(s.site.sunAltitudeDeg, ae.sun, 0.01);
      expect(s.site.starAltitudeDeg).toBeGreaterThanOrEqual(20);
      expect(s.site.sunAltitudeDeg).toBeLessThan(-12);
      expectClose(s.site.distanceFromReferenceKm, greatCircleKm(result.reference, s.site), 1e-9);
      expect(s.crosses).toBe('body');
    }
  });

  it('suggestSites() keeps to a region, and says why a line that misses it has no site', () => {
    const region = { latMinDeg: 0, latMaxDeg: 30, lonMinDeg: 72, lonMaxDeg: 90 };
    const inside = suggestSites(sc.event, SETTINGS, prediction, {
      sites: 1,
      ringsToo: false,
      region,
      stations: [],
      sunAltitudeBelowDeg: -12,
      starAltitudeAboveDeg: 20,
    });
    expect(inside.reference.kind).toBe('region');
    const site = inside.suggestions[0]?.site;
    if (!site) throw new Error(inside.suggestions[0]?.noSiteReason ?? 'no suggestion');
    expect(site.lonDeg).toBeGreaterThanOrEqual(72);
    expect(site.latDeg).toBeLessThanOrEqual(30);
    // With no stations the one site goes to the middle of the body (by hand: a span open at both ends
    // with k = 1 puts it at w/2 from the edge, the centre line).
    expectClose(inside.suggestions[0]?.crossTrackKm ?? Number.NaN, 0, 1e-9);
    const far = suggestSites(sc.event, SETTINGS, prediction, {
      sites: 1,
      ringsToo: false,
      region: { latMinDeg: -60, latMaxDeg: -50, lonMinDeg: -100, lonMaxDeg: -90 },
      stations: [],
      sunAltitudeBelowDeg: -12,
      starAltitudeAboveDeg: 20,
    });
    expect(far.suggestions[0]?.site).toBeNull();
    expect(far.suggestions[0]?.noSiteReason).toBe('the line at this offset does not pass through the region');
  });

  it('suggestSites() with ringsToo spreads sites over ± the ring and marks those beyond the body', () => {
    const result = suggestSites(sc.event, SETTINGS, prediction, {
      sites: 4,
      ringsToo: true,
      region: null,
      stations: [],
      sunAltitudeBelowDeg: -12,
      starAltitudeAboveDeg: 20,
    });
    expect(result.span).toEqual({ fromKm: -1100, toKm: 1100 });
    // By hand: 2200 km, k = 4, h = 275 km: sites at −825, −275, 275, 825; the outer two only cross the ring.
    expect(result.suggestions.map((s) => Math.round(s.crossTrackKm))).toEqual([-825, -275, 275, 825]);
    expect(result.suggestions.map((s) => s.crosses)).toEqual(['rings', 'body', 'body', 'rings']);
  });

  it("greatCircleKm() gives a quarter meridian as π/2 · 6371.0088 km and agrees with the fixtures' haversine", () => {
    // IUGG mean radius R1 = 6371.0088 km (Moritz 1980); a quarter of a great circle is πR/2 = 10007.557 km.
    expectClose(greatCircleKm({ latDeg: 0, lonDeg: 10 }, { latDeg: 90, lonDeg: 10 }), 10_007.557, 0.001);
    const a = { latDeg: 12.2, lonDeg: 69.9 };
    const b = { latDeg: -33.9, lonDeg: 151.2 };
    expectClose(greatCircleKm(a, b), (groundDistanceKm(a, b) * 6371.0088) / 6371, 1e-6);
  });

  it("briefStations() takes the station velocity of the prediction and its contacts' σ, and a watch window covering 3σ", () => {
    const briefs = briefStations(sc.event, SETTINGS, prediction);
    expect(briefs.map((b) => b.station)).toEqual(['north', 'middle']);
    for (const brief of briefs) {
      const predicted = prediction.stations.find((p) => p.station === brief.station);
      const site = STATIONS.find((s) => s.id === brief.station);
      if (!predicted || !site) throw new Error('missing station');
      // Velocity: the scenario's independent (f, g) differenced over ±0.5 s at t*.
      const ms = Date.parse(predicted.closestTimeUtc);
      const a = sc.fg(site, ms - 500);
      const b = sc.fg(site, ms + 500);
      expectClose(brief.velocityKmPerS.f, b.fKm - a.fKm, 0.01);
      expectClose(brief.velocityKmPerS.g, b.gKm - a.gKm, 0.01);
      // σ on the sky plane: D·σ with D the body's distance (6.214e9 km at the centre instant; it changes
      // by < 1e-5 over the window since the scenario's body moves across the line of sight).
      expectClose(brief.sigmaFKm, (6.214e9 * 6) / MAS_PER_RAD, 0.01);
      expectClose(brief.sigmaGKm, (6.214e9 * 9) / MAS_PER_RAD, 0.01);
      const reach = 1100 + 3 * predicted.sigmaCrossTrackKm;
      const along = Math.hypot(
        (brief.sigmaFKm * brief.velocityKmPerS.f) / brief.speedKmPerS,
        (brief.sigmaGKm * brief.velocityKmPerS.g) / brief.speedKmPerS,
      );
      const half = Math.max(
        MIN_WATCH_HALF_SECONDS,
        (Math.sqrt(reach ** 2 - predicted.crossTrackKm ** 2) + 3 * along) / brief.speedKmPerS,
      );
      expectClose((Date.parse(brief.watch.toUtc) - Date.parse(brief.watch.fromUtc)) / 1000, 2 * half, 0.002);
      if (predicted.disappearanceUtc === null) {
        expect(brief.disappearanceSigmaSeconds).toBeNull();
        continue;
      }
      const expected = contactTimeSigma({
        crossTrackKm: predicted.crossTrackKm,
        radiusKm: 365,
        velocityKmPerS: brief.velocityKmPerS,
        sigmaFKm: brief.sigmaFKm,
        sigmaGKm: brief.sigmaGKm,
      });
      expectClose(brief.disappearanceSigmaSeconds ?? Number.NaN, expected.firstSeconds, 1e-9);
      expectClose(brief.reappearanceSigmaSeconds ?? Number.NaN, expected.lastSeconds, 1e-9);
    }
  });

  it('briefStations() σ of the disappearance agrees with the prediction moved by ±1 mas (numerical derivative)', () => {
    const middle = {
      ...SETTINGS,
      rings: [],
      from: '2029-09-07T21:30:00Z',
      to: '2029-09-07T21:55:00Z',
      stepSeconds: 600,
    };
    const base = predictEvent(sc.event, middle);
    const brief = briefStations(sc.event, middle, base).find((b) => b.station === 'middle');
    const dOf = (offset: { raCosDec: number; dec: number }) =>
      Date.parse(
        predictEvent(sc.event, { ...middle, offsetMas: offset }).stations.find((s) => s.station === 'middle')
          ?.disappearanceUtc ?? '',
      ) / 1000;
    // ∂t_D/∂(mas) by central differences of the full prediction (times to the ms, so over ±1 mas).
    const dRa = (dOf({ raCosDec: 1, dec: 0 }) - dOf({ raCosDec: -1, dec: 0 })) / 2;
    const dDec = (dOf({ raCosDec: 0, dec: 1 }) - dOf({ raCosDec: 0, dec: -1 })) / 2;
    const numerical = Math.hypot(dRa * 6, dDec * 9);
    expectClose(brief?.disappearanceSigmaSeconds ?? Number.NaN, numerical, 0.02 * numerical + 0.01);
  });

  it('pathMapExtras() draws band edges at R ± kσ, ticks on whole minutes on the central line, and the subsolar point', () => {
    const extras = pathMapExtras(sc.event, SETTINGS, prediction);
    const sigma = extras.sigmaCrossTrackKm;
    expect(extras.bands.map((b) => `${b.line} ${b.sigma} ${b.edge}`)).toEqual([
      'left 1 outer',
      'right 1 outer',
      'left 1 inner',
      'right 1 inner',
      'left 3 outer',
      'right 3 outer',
    ]);
    for (const band of extras.bands) {
      const expectedOffset =
        (band.line === 'left' ? 1 : -1) *
        (band.edge === 'outer' ? 365 + band.sigma * sigma : 365 - band.sigma * sigma);
      expectClose(band.offsetKm, expectedOffset, 1e-9);
      const p = band.points[Math.floor(band.points.length / 2)];
      if (!p) throw new Error(`band ${band.line} ${band.sigma} ${band.edge} is empty`);
      const ms = Date.parse(p.timeUtc);
      const fg = sc.fg({ ...p, heightM: 0 }, ms);
      const n = leftNormal(ms);
      expectClose(fg.fKm, band.offsetKm * n.f, 0.5);
      expectClose(fg.gKm, band.offsetKm * n.g, 0.5);
    }
    // The central line is on the ground for about 10 minutes: a tick each minute.
    expect(extras.ticks.length).toBeGreaterThanOrEqual(5);
    expect(extras.ticks[0]?.minuteSpacing).toBe(1);
    for (const tick of extras.ticks) {
      expect(tick.timeUtc).toMatch(/:00\.000Z$/);
      const fg = sc.fg({ ...tick, heightM: 0 }, Date.parse(tick.timeUtc));
      expectClose(Math.hypot(fg.fKm, fg.gKm), 0, 0.5);
    }
    // 2029-09-07 is 15 days before the September equinox: the Sun is about 5.7° north (almanac; from
    // memory). The equation of time (apparent − mean) is then about +2 min (sundial tables; from memory),
    // so local mean time is 11:58 where the Sun is overhead: λ = (11.967 h − t_UTC)·15°/h.
    const ca = new Date(prediction.closestApproach.timeUtc);
    const hours = ca.getUTCHours() + ca.getUTCMinutes() / 60 + ca.getUTCSeconds() / 3600;
    expectClose(extras.subsolarPoint.latDeg, 5.7, 0.3);
    expectClose(extras.subsolarPoint.lonDeg, (11.967 - hours) * 15, 0.3);
  });
});
