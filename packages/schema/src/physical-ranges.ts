// Physical ranges of the numbers a person or a file gives: one home for each limit and where it comes from.
// Two levels. A payload (a form, an API request) is held to what is plausible for a ground station and a
// catalogue star, so a slip of the keyboard is caught. The event file (limbus-event/1, a contract) refuses
// only what cannot be, so no real observation is ever refused; docs/file-formats.md lists its limits.
// Imports nothing but zod, so the client's subpaths can use it.

import { z } from 'zod';

/** A closed range with its unit and why it ends where it does. */
interface Range {
  min: number;
  max: number;
}

/**
 * Station height above the WGS 84 ellipsoid, metres, in a payload: −500 m lies below the lowest dry land
 * (the Dead Sea shore, about −430 m) and 9000 m above the highest summit (Everest, 8849 m; both from
 * memory). An airborne station (the Kuiper Airborne Observatory and SOFIA observed occultations from
 * 12–14 km) is given in an event file, whose range is wider.
 */
export const STATION_HEIGHT_M: Range = { min: -500, max: 9000 };

/**
 * Station height in the event file: nothing observes from below the deepest point of the Earth's surface
 * (the Challenger Deep, about −10 935 m, from memory) or keeps a fixed place above the Kármán line
 * (100 km; a balloon's record is about 53 km), so a station, a place fixed to the rotating Earth, is
 * within these.
 */
export const FILE_STATION_HEIGHT_M: Range = { min: -11_000, max: 100_000 };

/**
 * Parallax, mas, in a payload: no star is nearer than Proxima Centauri (768.07 mas, Gaia DR3; from
 * memory). Catalogues give negative parallaxes (noise for a distant star), and a star imported with one
 * is sent back whole by the Setup form, so a payload keeps them as the event file does.
 */
export const PARALLAX_MAS: Range = { min: -1000, max: 1000 };

/** Parallax in the event file: measured values may be negative, never beyond the nearest star's size. */
export const FILE_PARALLAX_MAS: Range = { min: -1000, max: 1000 };

/**
 * Each proper-motion component, mas/yr, in a payload: Barnard's star moves fastest, 10.39″/yr in total,
 * +10 362 mas/yr in declination (Gaia DR3; from memory), so ±10 000 would refuse it; ±11 000 keeps every
 * known star.
 */
export const PROPER_MOTION_MAS_PER_YEAR: Range = { min: -11_000, max: 11_000 };

/**
 * Each proper-motion component in the event file: a star bound to the Galaxy passes the Sun at under
 * ~800 km/s (escape speed ~550 km/s plus the Sun's own ~250 km/s; from memory), and none is nearer than
 * 1.30 pc, so μ = v / (4.74 d) stays under 800 / (4.74 × 1.30) ≈ 130″/yr; 150 000 mas/yr with margin.
 */
export const FILE_PROPER_MOTION_MAS_PER_YEAR: Range = { min: -150_000, max: 150_000 };

/**
 * Stellar angular diameter, mas, payload and file alike: the largest stellar discs seen from Earth are
 * about 40–60 mas (R Doradus, Betelgeuse; from memory), so 1000 mas is far beyond any star but the Sun.
 */
export const ANGULAR_DIAMETER_MAS: Range = { min: 0, max: 1000 };

/**
 * Telescope aperture, mm, in a payload: at most 40 000 mm, the largest primary mirror being built
 * (the ELT, 39.3 m; from memory). Above zero.
 */
export const APERTURE_MAX_MM = 40_000;

/**
 * Exposure of one frame, s, in a payload: at most 600 s. An occultation lasts from a fraction of a second
 * to a few minutes, and timing needs frames far shorter than it; common practice, no source. Above zero.
 */
export const EXPOSURE_MAX_SECONDS = 600;

function within(range: Range, what: string, unit: string, why: string) {
  const message = `${what} must be between ${range.min} and ${range.max} ${unit} (${why})`;
  return z.number().min(range.min, message).max(range.max, message);
}

export const stationHeightMSchema = within(
  STATION_HEIGHT_M,
  'heightM',
  'm',
  'from below the Dead Sea shore to above Everest; an airborne station comes in an event file',
);
export const fileStationHeightMSchema = within(
  FILE_STATION_HEIGHT_M,
  'heightM',
  'm',
  'from the deepest ocean floor to the edge of space',
);
export const parallaxMasSchema = within(
  PARALLAX_MAS,
  'parallaxMas',
  'mas',
  'Proxima Centauri, the nearest star, has 768 mas',
);
export const fileParallaxMasSchema = within(
  FILE_PARALLAX_MAS,
  'parallaxMas',
  'mas',
  'Proxima Centauri, the nearest star, has 768 mas',
);
export const properMotionMasPerYearSchema = (what: string) =>
  within(
    PROPER_MOTION_MAS_PER_YEAR,
    what,
    'mas/yr',
    "Barnard's star, the fastest, moves 10 362 mas/yr in declination",
  );
export const fileProperMotionMasPerYearSchema = (what: string) =>
  within(FILE_PROPER_MOTION_MAS_PER_YEAR, what, 'mas/yr', 'faster than any star bound to the Galaxy');
/** Payload and file alike; the lower bound keeps the file's message of before. */
export const angularDiameterMasSchema = z
  .number()
  .min(ANGULAR_DIAMETER_MAS.min, 'angularDiameterMas must not be negative')
  .max(
    ANGULAR_DIAMETER_MAS.max,
    `angularDiameterMas must be at most ${ANGULAR_DIAMETER_MAS.max} mas (the largest stars seen from Earth span about 60 mas)`,
  );
export const apertureMmSchema = z
  .number()
  .positive('apertureMm must be greater than zero')
  .max(
    APERTURE_MAX_MM,
    `apertureMm must be at most ${APERTURE_MAX_MM} mm (the largest telescope being built has 39.3 m)`,
  );
export const exposureSecondsSchema = z
  .number()
  .positive('exposureSeconds must be greater than zero')
  .max(
    EXPOSURE_MAX_SECONDS,
    `exposureSeconds must be at most ${EXPOSURE_MAX_SECONDS} s (one frame; an occultation lasts seconds to minutes)`,
  );
