// Placement: more cross-track offsets that close the widest gaps in coverage (coverage-gaps.ts), and for
// each the nearest ground point on its path line where the site can observe: the Sun below a given
// altitude, the star above another, inside a region when one is given. The path line at an offset is the
// prediction's own (predict/path-lines.ts), walked on a finer grid than the prediction's so that the
// nearest point is not a grid step away.
import { DEG, RAD, asin } from '../math.js';
import { dot, type Vec3 } from '../astro/vec3.js';
import { sunDirection } from '../predict/altitudes.js';
import { geodeticUp } from '../predict/ellipsoid.js';
import { pathLines } from '../predict/path-lines.js';
import { PredictionSky } from '../predict/sky-frame.js';
import type { Prediction, PredictionSettings, PathPoint } from '../predict/types.js';
import { predictionWindow } from '../predict/window.js';
import { utcIsoToTtSeconds } from '../time/scales.js';
import type { EventInput } from '../types.js';
import { type CoverageGap, type CrossTrackSpan, suggestOffsets } from './coverage-gaps.js';
import { pathSigmaCrossTrackKm } from './path-sigma.js';
import { starAltAzDeg, substellarPoint } from './pointing.js';

/** Mean radius of the Earth, km (IUGG R1; Moritz, Geodetic Reference System 1980, Bull. Géod. 54, 1980). */
export const EARTH_MEAN_RADIUS_KM = 6371.0088;
/** Spacing of the candidate points along a path line, km at the shadow's speed: far below a site's reach. */
const CANDIDATE_SPACING_KM = 10;
/** Candidate times per line at most, so that a long, slow window stays quick. */
const MAX_CANDIDATE_TIMES = 20_000;

export interface Region {
  latMinDeg: number;
  latMaxDeg: number;
  /** lonMinDeg > lonMaxDeg: the region crosses the ±180° meridian. */
  lonMinDeg: number;
  lonMaxDeg: number;
}

export interface SiteSearchRequest {
  sites: number;
  ringsToo: boolean;
  region: Region | null;
  /** The stations that count (planned and observing): their predicted offsets and places. */
  stations: Array<{ crossTrackKm: number; latDeg: number; lonDeg: number }>;
  sunAltitudeBelowDeg: number;
  starAltitudeAboveDeg: number;
}

export interface FoundSite {
  latDeg: number;
  lonDeg: number;
  timeUtc: string;
  starAltitudeDeg: number;
  starAzimuthDeg: number;
  sunAltitudeDeg: number;
  distanceFromReferenceKm: number;
}

export interface SiteSuggestion {
  crossTrackKm: number;
  gap: CoverageGap;
  crosses: 'body' | 'rings';
  site: FoundSite | null;
  noSiteReason: string | null;
}

export interface SiteSearch {
  span: CrossTrackSpan;
  sigmaCrossTrackKm: number;
  gapsBefore: CoverageGap[];
  largestGapKmBefore: number;
  largestGapKmAfter: number;
  worstDistanceKmBefore: number;
  worstDistanceKmAfter: number;
  reference: { kind: 'stations' | 'region' | 'substellar'; latDeg: number; lonDeg: number };
  suggestions: SiteSuggestion[];
}

/** Great-circle distance on the mean sphere (haversine; Sinnott, Sky & Telescope 68(2), 1984, p. 159). */
export function greatCircleKm(
  a: { latDeg: number; lonDeg: number },
  b: { latDeg: number; lonDeg: number },
): number {
  const dLat = (b.latDeg - a.latDeg) * DEG;
  const dLon = (b.lonDeg - a.lonDeg) * DEG;
  const h =
    Math.sin(dLat / 2) ** 2 + Math.cos(a.latDeg * DEG) * Math.cos(b.latDeg * DEG) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_MEAN_RADIUS_KM * asin(Math.sqrt(h));
}

export function insideRegion(point: { latDeg: number; lonDeg: number }, region: Region): boolean {
  if (point.latDeg < region.latMinDeg || point.latDeg > region.latMaxDeg) return false;
  return region.lonMinDeg <= region.lonMaxDeg
    ? point.lonDeg >= region.lonMinDeg && point.lonDeg <= region.lonMaxDeg
    : point.lonDeg >= region.lonMinDeg || point.lonDeg <= region.lonMaxDeg;
}

/** The mean direction of some places, as a place (the centroid on the sphere). */
function centroid(points: Array<{ latDeg: number; lonDeg: number }>): { latDeg: number; lonDeg: number } {
  let x = 0;
  let y = 0;
  let z = 0;
  for (const p of points) {
    const c = Math.cos(p.latDeg * DEG);
    x += c * Math.cos(p.lonDeg * DEG);
    y += c * Math.sin(p.lonDeg * DEG);
    z += Math.sin(p.latDeg * DEG);
  }
  return { latDeg: Math.atan2(z, Math.hypot(x, y)) * RAD, lonDeg: Math.atan2(y, x) * RAD };
}

function regionCentre(region: Region): { latDeg: number; lonDeg: number } {
  const width =
    region.lonMinDeg <= region.lonMaxDeg
      ? region.lonMaxDeg - region.lonMinDeg
      : region.lonMaxDeg + 360 - region.lonMinDeg;
  const lon = region.lonMinDeg + width / 2;
  return { latDeg: (region.latMinDeg + region.latMaxDeg) / 2, lonDeg: lon >= 180 ? lon - 360 : lon };
}

/**
 * The placement of `request.sites` more stations. The span to cover is ± the body's radius, or with
 * `ringsToo` ± the outermost ring's. Each suggestion's site is the candidate of its path line nearest the
 * reference: the team's stations' centroid, else the region's centre, else the point under the star at
 * closest approach.
 */
export function suggestSites(
  event: EventInput,
  settings: PredictionSettings,
  prediction: Prediction,
  request: SiteSearchRequest,
): SiteSearch {
  const sky = new PredictionSky(event, settings.offsetMas);
  const window = predictionWindow(sky.ephemeris, settings);
  const closestTt = utcIsoToTtSeconds(prediction.closestApproach.timeUtc, 'closestApproach.timeUtc');
  const sigmaCrossTrackKm = pathSigmaCrossTrackKm(sky, settings, closestTt);
  const reachKm = request.ringsToo
    ? Math.max(settings.bodyRadiusKm, ...settings.rings.map((r) => r.radiusKm))
    : settings.bodyRadiusKm;
  const span = { fromKm: -reachKm, toKm: reachKm };
  const offsets = suggestOffsets(
    span,
    request.stations.map((s) => s.crossTrackKm),
    request.sites,
  );
  const reference =
    request.stations.length > 0
      ? { kind: 'stations' as const, ...centroid(request.stations) }
      : request.region !== null
        ? { kind: 'region' as const, ...regionCentre(request.region) }
        : { kind: 'substellar' as const, ...substellarPoint(sky, closestTt) };

  const speed = prediction.closestApproach.speedKmPerS;
  const step = Math.max(
    1,
    Math.min(settings.stepSeconds, CANDIDATE_SPACING_KM / speed),
    (window.toTt - window.fromTt) / MAX_CANDIDATE_TIMES,
  );
  const count = Math.floor((window.toTt - window.fromTt) / step) + 1;
  const gridTt = Array.from({ length: count }, (_, k) => window.fromTt + k * step);
  const lines = pathLines(
    sky,
    gridTt,
    offsets.suggestions.map((s) => s.crossTrackKm),
  );
  // One Sun direction per candidate time, shared by every line (astronomy-engine is the slow part).
  const sunByTime = new Map<number, Vec3>();
  const sunAltitudeDeg = (p: PathPoint, tt: number) => {
    let sun = sunByTime.get(tt);
    if (sun === undefined) {
      sun = sunDirection(tt);
      sunByTime.set(tt, sun);
    }
    return asin(dot(sky.toCelestial(geodeticUp(p.latDeg * DEG, p.lonDeg * DEG), tt), sun)) * RAD;
  };

  const suggestions = offsets.suggestions.map((s, i): SiteSuggestion => {
    const crosses = Math.abs(s.crossTrackKm) < settings.bodyRadiusKm ? ('body' as const) : ('rings' as const);
    const line = lines[i] ?? [];
    let best: FoundSite | null = null;
    let sawRegion = false;
    let sawNight = false;
    for (const p of line) {
      if (request.region !== null && !insideRegion(p, request.region)) continue;
      sawRegion = true;
      const tt = utcIsoToTtSeconds(p.timeUtc);
      const star = starAltAzDeg(sky, p.latDeg, p.lonDeg, tt);
      if (star.altitudeDeg < request.starAltitudeAboveDeg) continue;
      const sun = sunAltitudeDeg(p, tt);
      if (sun >= request.sunAltitudeBelowDeg) continue;
      sawNight = true;
      const distanceFromReferenceKm = greatCircleKm(reference, p);
      if (best === null || distanceFromReferenceKm < best.distanceFromReferenceKm)
        best = {
          latDeg: p.latDeg,
          lonDeg: p.lonDeg,
          timeUtc: p.timeUtc,
          starAltitudeDeg: star.altitudeDeg,
          starAzimuthDeg: star.azimuthDeg,
          sunAltitudeDeg: sun,
          distanceFromReferenceKm,
        };
    }
    const where = request.region === null ? 'anywhere' : 'inside the region';
    const noSiteReason =
      best !== null
        ? null
        : line.length === 0
          ? 'the line at this offset does not cross the Earth with the star above the horizon in the window'
          : !sawRegion
            ? 'the line at this offset does not pass through the region'
            : !sawNight
              ? `no point of this line ${where} has the star above ${request.starAltitudeAboveDeg}° with the Sun below ${request.sunAltitudeBelowDeg}°`
              : null;
    return { crossTrackKm: s.crossTrackKm, gap: s.gap, crosses, site: best, noSiteReason };
  });
  return {
    span,
    sigmaCrossTrackKm,
    gapsBefore: offsets.gapsBefore,
    largestGapKmBefore: offsets.largestGapKmBefore,
    largestGapKmAfter: offsets.largestGapKmAfter,
    worstDistanceKmBefore: offsets.worstDistanceKmBefore,
    worstDistanceKmAfter: offsets.worstDistanceKmAfter,
    reference,
    suggestions,
  };
}
