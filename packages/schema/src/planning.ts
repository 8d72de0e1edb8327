// Planning an event before it happens (issue 12): stations that are planned or proposed, the site an
// observer proposes, the offset taken from an earlier fit, the placement of more sites, the briefing of
// every observer and the map of the shadow path. The payloads the API validates and the answers the client
// parses, one definition each (docs/file-formats.md, "Planning documents"; docs/authorization.md,
// "Authorization (planning)"). No geometry here: the client imports this module on its own
// (`@limbus/schema/planning`).

import { z } from 'zod';

import { stationHeightMSchema } from './physical-ranges.js';
import { lineText, noteText, TEXT_LIMITS } from './text.js';

/**
 * Where a station stands: `observing` (the default, and every station made before planning existed),
 * `planned` (placed by a coordinator, from a placement suggestion or by hand) or `proposed` (an observer's
 * own site, awaiting a coordinator's decision).
 */
export const STATION_STATUSES = ['observing', 'planned', 'proposed'] as const;
export type StationStatus = (typeof STATION_STATUSES)[number];

export const STATION_STATUS_LABELS: Record<StationStatus, string> = {
  observing: 'Observing',
  planned: 'Planned',
  proposed: 'Proposed (awaiting the coordinator)',
};

/** What a coordinator gives a station directly; `proposed` comes only from an observer's proposal. */
export const COORDINATOR_STATION_STATUSES = ['observing', 'planned'] as const;
export type CoordinatorStationStatus = (typeof COORDINATOR_STATION_STATUSES)[number];
export const coordinatorStationStatusSchema = z.enum(COORDINATOR_STATION_STATUSES, {
  error: () =>
    `status must be one of ${COORDINATOR_STATION_STATUSES.join(', ')} (a proposal is an observer's)`,
});

export const latDegSchema = z
  .number()
  .min(-90, 'latitude must be within ±90°')
  .max(90, 'latitude must be within ±90°');
export const lonDegSchema = z
  .number()
  .min(-180, 'longitude must be within ±180° (east positive)')
  .max(180, 'longitude must be within ±180° (east positive)');

/** Where a station stands on the ground; the station forms and the site proposal share these. */
export const siteFields = {
  code: lineText(TEXT_LIMITS.stationCode, 'station id'),
  latDeg: latDegSchema,
  lonDeg: lonDegSchema,
  heightM: stationHeightMSchema,
};

/** `POST /api/events/:eventId/site-proposals`: an observer's own site; they become its observer. */
export const siteProposalPayloadSchema = z.strictObject({
  ...siteFields,
  notes: noteText(TEXT_LIMITS.note).optional(),
});
export type SiteProposalPayload = z.output<typeof siteProposalPayloadSchema>;

/** `POST …/site-proposals/:stationId/accept`: the proposal becomes a planned (default) or observing station. */
export const acceptSiteProposalPayloadSchema = z
  .strictObject({ status: coordinatorStationStatusSchema.default('planned') })
  .prefault({});
export type AcceptSiteProposalPayload = z.output<typeof acceptSiteProposalPayloadSchema>;

/** `POST …/site-proposals/:stationId/decline`: the proposed station is removed; the reason is audited. */
export const declineSiteProposalPayloadSchema = z
  .strictObject({ reason: noteText(TEXT_LIMITS.reason).default('') })
  .prefault({});
export type DeclineSiteProposalPayload = z.output<typeof declineSiteProposalPayloadSchema>;

const masPair = z.object({ raCosDec: z.number(), dec: z.number() });

/** `POST /api/events/:eventId/prediction/offset-from-fit`. */
export const offsetFromFitPayloadSchema = z.strictObject({
  fitId: z.string().min(1, 'fitId must not be empty').max(36, 'not a fit id'),
});
export type OffsetFromFitPayload = z.output<typeof offsetFromFitPayloadSchema>;

/**
 * Where the prediction's `offsetMas` and `uncertaintyMas` came from, when a coordinator took them from a
 * solved fit. Not part of the event file: kept beside it, and dropped as soon as either value is edited.
 */
export const predictionOffsetSourceSchema = z.object({
  fitId: z.string(),
  eventId: z.string(),
  eventTitle: z.string(),
  /** The earlier event's time, "YYYY-MM-DDThh:mm:ssZ". */
  eventTimeUtc: z.string(),
  /** The fit's astrometry reference time (ISO 8601 UTC). */
  referenceTimeUtc: z.string(),
  reviewState: z.string(),
  offsetMas: masPair,
  uncertaintyMas: masPair,
  appliedAt: z.string(),
  appliedById: z.string().nullable(),
  /** Days from the fit's reference time to this event: how far the offset is carried. */
  carriedDays: z.number(),
});
export type PredictionOffsetSource = z.output<typeof predictionOffsetSourceSchema>;

/**
 * The answer of offset-from-fit: the event's prediction section after the change (limbus-event/1
 * `prediction`, see `@limbus/schema/prediction`), where it came from, and what taking it assumes.
 */
export const offsetFromFitAnswerSchema = z.object({
  prediction: z.record(z.string(), z.unknown()),
  offsetSource: predictionOffsetSourceSchema,
  assumptions: z.array(z.string()),
});
export type OffsetFromFitAnswer = z.output<typeof offsetFromFitAnswerSchema>;

/** A point of a path line: where the line is at a grid time. */
export const pathPointSchema = z.object({ timeUtc: z.string(), latDeg: z.number(), lonDeg: z.number() });
export type PathPoint = z.output<typeof pathPointSchema>;

const flag = z.enum(['true', 'false']).transform((v) => v === 'true');

/** A rectangle of latitude and longitude; lonMinDeg > lonMaxDeg crosses the ±180° meridian. */
export interface PlacementRegion {
  latMinDeg: number;
  latMaxDeg: number;
  lonMinDeg: number;
  lonMaxDeg: number;
}

const regionSchema = z.string().transform((text, ctx): PlacementRegion => {
  const parts = text.split(',').map((p) => p.trim());
  const numbers = parts.map(Number);
  if (parts.length !== 4 || parts.some((p) => p === '') || numbers.some((n) => !Number.isFinite(n))) {
    ctx.addIssue({
      code: 'custom',
      message: 'region is latMin,latMax,lonMin,lonMax in degrees (e.g. "5,15,65,75")',
    });
    return z.NEVER;
  }
  const [latMinDeg = 0, latMaxDeg = 0, lonMinDeg = 0, lonMaxDeg = 0] = numbers;
  const problems: string[] = [];
  if (latMinDeg < -90 || latMaxDeg > 90) problems.push('latitudes must be within ±90°');
  if (latMinDeg >= latMaxDeg) problems.push('latMin must be below latMax');
  if (lonMinDeg < -180 || lonMinDeg > 180 || lonMaxDeg < -180 || lonMaxDeg > 180)
    problems.push('longitudes must be within ±180° (east positive)');
  if (lonMinDeg === lonMaxDeg) problems.push('lonMin and lonMax must differ');
  for (const message of problems) ctx.addIssue({ code: 'custom', message });
  return problems.length > 0 ? z.NEVER : { latMinDeg, latMaxDeg, lonMinDeg, lonMaxDeg };
});

/** The most sites one request places; more would not be fielded by a volunteer team (common practice, no source). */
export const MAX_PLACEMENT_SITES = 50;

/** `GET /api/events/:eventId/placement?sites=N&ringsToo=true|false&region=latMin,latMax,lonMin,lonMax`. */
export const placementQuerySchema = z.strictObject({
  sites: z.coerce
    .number()
    .int('sites must be a whole number')
    .min(1, 'sites must be at least 1')
    .max(MAX_PLACEMENT_SITES, `sites must be at most ${MAX_PLACEMENT_SITES}`),
  ringsToo: flag.default(false),
  region: regionSchema.optional(),
});
export type PlacementQuery = z.output<typeof placementQuerySchema>;

/** When a suggested ground point is usable: astronomical night, and the star well above the horizon. */
export const PLACEMENT_CRITERIA = {
  /** Astronomical twilight ends at −18°; at −12° (nautical) the sky is dark enough for the bright stars occultations use. */
  sunAltitudeBelowDeg: -12,
  /** Above about 20° the airmass is below 3: less extinction and scintillation, and clear of most horizons. */
  starAltitudeAboveDeg: 20,
} as const;

const gapSchema = z.object({ fromKm: z.number(), toKm: z.number(), widthKm: z.number() });

export const placementSiteSchema = z.object({
  latDeg: z.number(),
  lonDeg: z.number(),
  /** When the star passes this point's offset line there (the grid time of the path line). */
  timeUtc: z.string(),
  starAltitudeDeg: z.number(),
  starAzimuthDeg: z.number(),
  sunAltitudeDeg: z.number(),
  /** Great-circle distance from the reference point, km. */
  distanceFromReferenceKm: z.number(),
});
export type PlacementSite = z.output<typeof placementSiteSchema>;

export const placementSuggestionSchema = z.object({
  /** Cross-track offset from the path's centre line, km; positive: left of the body's centre. */
  crossTrackKm: z.number(),
  /** The gap in coverage this site splits. */
  gap: gapSchema,
  /** What the chord would cross: the body, or only rings. */
  crosses: z.enum(['body', 'rings']),
  /** A suggested code for the station made from it. */
  code: z.string(),
  site: placementSiteSchema.nullable(),
  /** Why there is no site (null when there is one). */
  noSiteReason: z.string().nullable(),
});
export type PlacementSuggestion = z.output<typeof placementSuggestionSchema>;

export const placementAnswerSchema = z.object({
  bodyRadiusKm: z.number(),
  ringsToo: z.boolean(),
  /** The cross-track span to cover: ± the body's radius, or ± the outermost ring's. */
  spanKm: z.object({ fromKm: z.number(), toKm: z.number() }),
  /** 1σ of the path's cross-track position at closest approach, km. */
  sigmaCrossTrackKm: z.number(),
  /** The stations counted (planned and observing), by their predicted cross-track offset. */
  stations: z.array(
    z.object({
      stationId: z.string(),
      code: z.string(),
      status: z.enum(STATION_STATUSES),
      crossTrackKm: z.number(),
    }),
  ),
  gapsBefore: z.array(gapSchema),
  /** The widest interval between neighbouring chords (or a chord and the span's edge), before and after. */
  largestGapKmBefore: z.number(),
  largestGapKmAfter: z.number(),
  /**
   * What the suggestions minimise: the largest distance from any offset of the span to its nearest chord,
   * before and after (null before when no station lies inside the span).
   */
  worstDistanceKmBefore: z.number().nullable(),
  worstDistanceKmAfter: z.number(),
  suggestions: z.array(placementSuggestionSchema),
  criteria: z.object({
    sunAltitudeBelowDeg: z.number(),
    starAltitudeAboveDeg: z.number(),
    region: z
      .object({ latMinDeg: z.number(), latMaxDeg: z.number(), lonMinDeg: z.number(), lonMaxDeg: z.number() })
      .nullable(),
    /** The point suggestions are nearest to. */
    reference: z.object({
      kind: z.enum(['stations', 'region', 'substellar']),
      latDeg: z.number(),
      lonDeg: z.number(),
    }),
  }),
  cautions: z.array(z.string()),
});
export type PlacementAnswer = z.output<typeof placementAnswerSchema>;

/** A predicted contact time and the ± (1σ) that the path's uncertainty implies there. */
const predictedTimeSchema = z.object({ timeUtc: z.string(), sigmaSeconds: z.number() });

/** How a station's chord is predicted to fall; the map's marker look and the briefing's headline. */
export const STATION_OUTLOOKS = ['inside', 'ring-only', 'outside', 'star-down', 'sun-up'] as const;
export type StationOutlook = (typeof STATION_OUTLOOKS)[number];

export const STATION_OUTLOOK_LABELS: Record<StationOutlook, string> = {
  inside: 'Inside the path of the body',
  'ring-only': 'Outside the body, inside a ring',
  outside: 'Outside the path',
  'star-down': 'Star below the horizon',
  'sun-up': 'Sun above the horizon',
};

/**
 * The look of a station on the map and in the briefing. The sky comes first: a station that cannot see
 * the star (below the geometric horizon) or is in daylight (Sun above the horizon) is said so whatever the
 * path; then inside the body's path, inside a ring's only, or outside.
 */
export function stationOutlook(station: {
  starAltitudeDeg: number;
  sunAltitudeDeg: number;
  disappearanceUtc: string | null;
  rings: Array<{ window: [string, string] | null }>;
}): StationOutlook {
  if (station.starAltitudeDeg <= 0) return 'star-down';
  if (station.sunAltitudeDeg > 0) return 'sun-up';
  if (station.disappearanceUtc !== null) return 'inside';
  if (station.rings.some((r) => r.window !== null)) return 'ring-only';
  return 'outside';
}

export const briefingPointingSchema = z.object({
  /** Geometric altitude of the star at the station at closest approach, degrees. */
  starAltitudeDeg: z.number(),
  /** Azimuth of the star, degrees from north through east. */
  starAzimuthDeg: z.number(),
  sunAltitudeDeg: z.number(),
  /** Angle between the Moon and the star, degrees. */
  moonSeparationDeg: z.number(),
  /** Fraction of the Moon's disc lit, 0–1. */
  moonIlluminatedFraction: z.number(),
  moonAltitudeDeg: z.number(),
});
export type BriefingPointing = z.output<typeof briefingPointingSchema>;

export const briefingStationSchema = z.object({
  stationId: z.string(),
  code: z.string(),
  status: z.enum(STATION_STATUSES),
  observerId: z.string().nullable(),
  observerName: z.string().nullable(),
  latDeg: z.number(),
  lonDeg: z.number(),
  heightM: z.number(),
  outlook: z.enum(STATION_OUTLOOKS),
  closestTimeUtc: z.string(),
  distanceKm: z.number(),
  crossTrackKm: z.number(),
  sigmaCrossTrackKm: z.number(),
  /** The star's speed across the station's sky plane, km/s. */
  speedKmPerS: z.number(),
  disappearance: predictedTimeSchema.nullable(),
  reappearance: predictedTimeSchema.nullable(),
  rings: z.array(z.object({ ring: z.string(), window: z.tuple([z.string(), z.string()]).nullable() })),
  /** When to record: every contact the body or a ring could make with the path shifted by up to 3σ. */
  watch: z.object({ fromUtc: z.string(), toUtc: z.string() }),
  pointing: briefingPointingSchema,
  /** Station-specific warnings (low star, twilight, Moon close, grazing). */
  notes: z.array(z.string()),
});
export type BriefingStation = z.output<typeof briefingStationSchema>;

/** `GET /api/events/:eventId/briefing`: the caller's own stations (coordinators: every station). */
export const briefingSchema = z.object({
  eventId: z.string(),
  eventTitle: z.string(),
  bodyName: z.string(),
  eventTimeUtc: z.string(),
  bodyRadiusKm: z.number(),
  closestApproachUtc: z.string(),
  /** The event's page in the client, absolute. */
  link: z.string(),
  /** Where the prediction's offset came from, if a fit gave it. */
  offsetSource: predictionOffsetSourceSchema.nullable(),
  stations: z.array(briefingStationSchema),
  /** What the numbers assume, and the safety cautions every briefing carries. */
  predictionCautions: z.array(z.string()),
  safetyCautions: z.array(z.string()),
});
export type Briefing = z.output<typeof briefingSchema>;

/** `POST /api/events/:eventId/briefings`: who was sent a briefing. */
export const briefingsSentSchema = z.object({
  sent: z.array(z.object({ userId: z.string(), name: z.string(), stations: z.array(z.string()) })),
  /** Stations without an observer account, which no e-mail can reach. */
  withoutObserver: z.array(z.string()),
  /** Observers whose e-mail the mail server did not take, with its reason; try again later. */
  failed: z.array(z.object({ userId: z.string(), name: z.string(), reason: z.string() })),
});
export type BriefingsSent = z.output<typeof briefingsSentSchema>;

/** What a line of the shadow-path map is; limits and ring limits have a side. */
export const PATH_LINE_KINDS = ['central', 'left', 'right'] as const;
export type PathLineKind = (typeof PATH_LINE_KINDS)[number];

/**
 * The shadow-path map as data: the one description the client's map, the server's SVG/PNG/PDF and the
 * GeoJSON/KML exports all draw. `GET /api/events/:eventId/prediction/map`.
 */
export const predictionMapSchema = z.object({
  eventId: z.string(),
  eventTitle: z.string(),
  closestApproachUtc: z.string(),
  /** Where the Sun is overhead at closest approach: the day side is the hemisphere around it. */
  subsolarPoint: z.object({ latDeg: z.number(), lonDeg: z.number() }),
  sigmaCrossTrackKm: z.number(),
  /**
   * Every line: the central line, the body's limits, each ring's limits (`ring` set) and the edges of the
   * 1σ and 3σ bands (`sigma` 1 or 3, `edge` outer at R + kσ or inner at R − kσ; a limit has sigma 0).
   */
  lines: z.array(
    z.object({
      line: z.enum(PATH_LINE_KINDS),
      ring: z.string().nullable(),
      sigma: z.union([z.literal(0), z.literal(1), z.literal(3)]),
      edge: z.enum(['limit', 'outer', 'inner']),
      offsetKm: z.number(),
      points: z.array(pathPointSchema),
    }),
  ),
  /** Time ticks along the central line, each on a whole minute. */
  ticks: z.array(pathPointSchema.extend({ label: z.string() })),
  stations: z.array(
    z.object({
      stationId: z.string(),
      code: z.string(),
      status: z.enum(STATION_STATUSES),
      latDeg: z.number(),
      lonDeg: z.number(),
      outlook: z.enum(STATION_OUTLOOKS),
    }),
  ),
  cautions: z.array(z.string()),
});
export type PredictionMap = z.output<typeof predictionMapSchema>;
