// Where to point and what else is in the sky, for a site at an instant: the star's altitude (the
// prediction's own, predict/altitudes.ts) and azimuth, the Sun's altitude, and the Moon's separation from
// the star, altitude and lit fraction. Also the points under the Sun and under the star, which the map's
// day/night and the placement's reference use.
//   Azimuth: atan2(s·east, s·north) on the geodetic horizon, from north through east (the usual
//   navigator's convention; Meeus, Astronomical Algorithms, 2nd ed., ch. 13, counts from the south).
//   The Moon: astronomy-engine's GeoMoon (geocentric, J2000 mean equator), made topocentric by subtracting
//   the site's celestial position (its ~1° of parallax matters for the separation), and its lit fraction
//   from astronomy-engine's Illumination.
import { AstroTime, Body, GeoMoon, Illumination } from 'astronomy-engine';
import { geodeticToEarthFixedKm } from '../astro/station.js';
import { dot, sub, unit, type Vec3 } from '../astro/vec3.js';
import { acos, asin, AU_KM, DEG, RAD, SECONDS_PER_DAY, wrap } from '../math.js';
import { stationAltitudesDeg, sunDirection } from '../predict/altitudes.js';
import { geodeticUp } from '../predict/ellipsoid.js';
import { longitudeDeg } from '../predict/path-lines.js';
import type { PredictionSky } from '../predict/sky-frame.js';

export interface Site {
  latDeg: number;
  lonDeg: number;
  heightM: number;
}

export interface Pointing {
  /** Geometric (no refraction), above the WGS84 geodetic horizon. */
  starAltitudeDeg: number;
  /** From north through east, [0, 360). */
  starAzimuthDeg: number;
  sunAltitudeDeg: number;
  moonSeparationDeg: number;
  /** 0 (new) to 1 (full). */
  moonIlluminatedFraction: number;
  moonAltitudeDeg: number;
}

/** The local east and north unit vectors at a geodetic latitude and longitude, Earth-fixed axes. */
function eastNorth(latRad: number, lonRad: number): { east: Vec3; north: Vec3 } {
  const sinLat = Math.sin(latRad);
  return {
    east: [-Math.sin(lonRad), Math.cos(lonRad), 0],
    north: [-sinLat * Math.cos(lonRad), -sinLat * Math.sin(lonRad), Math.cos(latRad)],
  };
}

/** Altitude and azimuth on the site's geodetic horizon of the star alone (cheap: no Sun or Moon). */
export function starAltAzDeg(
  sky: PredictionSky,
  latDeg: number,
  lonDeg: number,
  ttSeconds: number,
): { altitudeDeg: number; azimuthDeg: number } {
  const latRad = latDeg * DEG;
  const lonRad = lonDeg * DEG;
  const { east, north } = eastNorth(latRad, lonRad);
  const s = sky.basis(ttSeconds).s;
  const up = sky.toCelestial(geodeticUp(latRad, lonRad), ttSeconds);
  return {
    altitudeDeg: asin(dot(up, s)) * RAD,
    azimuthDeg: wrap(
      Math.atan2(dot(sky.toCelestial(east, ttSeconds), s), dot(sky.toCelestial(north, ttSeconds), s)) * RAD,
      360,
    ),
  };
}

export function pointingAt(sky: PredictionSky, site: Site, ttSeconds: number): Pointing {
  const latRad = site.latDeg * DEG;
  const lonRad = site.lonDeg * DEG;
  const { starAltitudeDeg, sunAltitudeDeg } = stationAltitudesDeg(sky, latRad, lonRad, ttSeconds);
  const { azimuthDeg } = starAltAzDeg(sky, site.latDeg, site.lonDeg, ttSeconds);
  const time = AstroTime.FromTerrestrialTime(ttSeconds / SECONDS_PER_DAY);
  const moonGeocentric = GeoMoon(time);
  const siteKm = sky.toCelestial(geodeticToEarthFixedKm(site.latDeg, site.lonDeg, site.heightM), ttSeconds);
  const moon = unit(
    sub([moonGeocentric.x * AU_KM, moonGeocentric.y * AU_KM, moonGeocentric.z * AU_KM], siteKm),
  );
  const up = sky.toCelestial(geodeticUp(latRad, lonRad), ttSeconds);
  return {
    starAltitudeDeg,
    starAzimuthDeg: azimuthDeg,
    sunAltitudeDeg,
    moonSeparationDeg: acos(dot(moon, sky.basis(ttSeconds).s)) * RAD,
    moonIlluminatedFraction: Illumination(Body.Moon, time).phase_fraction,
    moonAltitudeDeg: asin(dot(up, moon)) * RAD,
  };
}

/** The geodetic latitude and longitude where a celestial direction is at the zenith. */
function zenithPoint(
  sky: PredictionSky,
  direction: Vec3,
  ttSeconds: number,
): { latDeg: number; lonDeg: number } {
  const d = sky.toEarthFixed(ttSeconds)(direction);
  // The geodetic vertical at (φ, λ) is (cos φ cos λ, cos φ sin λ, sin φ) (predict/ellipsoid.ts).
  return { latDeg: asin(d[2]) * RAD, lonDeg: longitudeDeg(Math.atan2(d[1], d[0])) };
}

/** Where the Sun stands overhead (geocentric direction, as the Sun altitudes use). */
export function subsolarPoint(sky: PredictionSky, ttSeconds: number): { latDeg: number; lonDeg: number } {
  return zenithPoint(sky, sunDirection(ttSeconds), ttSeconds);
}

/** Where the star stands overhead: the middle of the Earth's disc as the star sees it. */
export function substellarPoint(sky: PredictionSky, ttSeconds: number): { latDeg: number; lonDeg: number } {
  return zenithPoint(sky, sky.basis(ttSeconds).s, ttSeconds);
}
