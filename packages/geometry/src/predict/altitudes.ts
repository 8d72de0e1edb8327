// Geometric altitudes (no refraction) of the star and the Sun at a station: asin(up·d), with up the WGS84
// geodetic vertical turned into celestial axes by the same Earth orientation as the station vectors, and
// d the geocentric unit direction. The Sun is astronomy-engine's geocentric vector (VSOP87 Earth, J2000
// mean equator axes), without aberration like the star; its 8.8″ of horizontal parallax is left out, as
// "geocentric" says.
import { AstroTime, Body, GeoVector } from 'astronomy-engine';
import type { Vec3 } from '../astro/vec3.js';
import { dot, unit } from '../astro/vec3.js';
import { RAD, SECONDS_PER_DAY, asin } from '../math.js';
import { geodeticUp } from './ellipsoid.js';
import type { PredictionSky } from './sky-frame.js';

/** Geocentric unit vector to the Sun at a TT instant (J2000 axes). */
export function sunDirection(ttSeconds: number): Vec3 {
  const v = GeoVector(Body.Sun, AstroTime.FromTerrestrialTime(ttSeconds / SECONDS_PER_DAY), false);
  return unit([v.x, v.y, v.z]);
}

/** Altitudes in degrees of the star and the Sun above the geodetic horizon of (lat, lon) at a TT instant. */
export function stationAltitudesDeg(
  sky: PredictionSky,
  latRad: number,
  lonRad: number,
  ttSeconds: number,
): { starAltitudeDeg: number; sunAltitudeDeg: number } {
  const up = sky.toCelestial(geodeticUp(latRad, lonRad), ttSeconds);
  return {
    starAltitudeDeg: asin(dot(up, sky.basis(ttSeconds).s)) * RAD,
    sunAltitudeDeg: asin(dot(up, sunDirection(ttSeconds))) * RAD,
  };
}
