// The shapes that cross the prediction's edge: the event file's `prediction` section (after defaults) and
// the `limbus-prediction/1` document. docs/file-formats.md, "Prediction section" and "Prediction file",
// describes both; the schema package validates them (packages/schema/src/prediction.ts).

export const PREDICTION_FORMAT = 'limbus-prediction/1';

/** A pair of sky-plane angles, mas: east (Δα·cos δ) and north (Δδ). */
export interface MasPair {
  raCosDec: number;
  dec: number;
}

export interface PredictionRing {
  ring: string;
  /** Radius of the ring's circular envelope on the sky plane, km. */
  radiusKm: number;
}

/** The event file's `prediction` section with its defaults applied. */
export interface PredictionSettings {
  bodyRadiusKm: number;
  /** 1σ of the body–star offset. */
  uncertaintyMas: MasPair;
  /** Shift of the body from its ephemeris: B' = B + D·(raCosDec·e_f + dec·e_g). */
  offsetMas: MasPair;
  rings: PredictionRing[];
  stepSeconds: number;
  /** ISO 8601 UTC ("…Z"); absent: the first ephemeris row. */
  from?: string;
  /** ISO 8601 UTC ("…Z"); absent: the last ephemeris row. */
  to?: string;
}

export interface PathPoint {
  timeUtc: string;
  latDeg: number;
  /** In [−180, 180). */
  lonDeg: number;
}

export interface PathLimits {
  left: PathPoint[];
  right: PathPoint[];
}

export interface RingPath extends PathLimits {
  ring: string;
}

export interface StationRingWindow {
  ring: string;
  /** The two times the station's |(f, g)| equals the ring's radius; null when it stays outside. */
  window: [string, string] | null;
}

export interface StationPrediction {
  station: string;
  closestTimeUtc: string;
  distanceKm: number;
  /** Positive: the station passes left of the body centre. */
  crossTrackKm: number;
  sigmaCrossTrackKm: number;
  disappearanceUtc: string | null;
  reappearanceUtc: string | null;
  rings: StationRingWindow[];
  starAltitudeDeg: number;
  sunAltitudeDeg: number;
}

export interface ClosestApproach {
  timeUtc: string;
  distanceKm: number;
  speedKmPerS: number;
}

export interface Prediction {
  format: typeof PREDICTION_FORMAT;
  closestApproach: ClosestApproach;
  centralLine: PathPoint[];
  limits: PathLimits;
  rings: RingPath[];
  stations: StationPrediction[];
}
