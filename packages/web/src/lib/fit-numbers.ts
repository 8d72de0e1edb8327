// How the desk writes a fit's numbers and options, shared by the fit view and the review, so the two
// cannot show the same fit in two ways.

// The limb parameters a fit may hold fixed, as the event file names them (docs/file-formats.md). A fitted
// value is rounded by its σ (value-sigma.ts); `decimals` is for a value held fixed, which has no σ: km to
// 0.1 m would claim more than any occultation measures.
export const LIMB_PARAMETERS = [
  { key: 'centerFKm', label: 'Centre f', unit: 'km', decimals: 2 },
  { key: 'centerGKm', label: 'Centre g', unit: 'km', decimals: 2 },
  { key: 'equatorialRadiusKm', label: 'Equatorial radius', unit: 'km', decimals: 2 },
  { key: 'oblateness', label: 'Oblateness', unit: '', decimals: 4 },
  { key: 'positionAngleDeg', label: 'Position angle', unit: '°', decimals: 2 },
] as const;
export type LimbParameterKey = (typeof LIMB_PARAMETERS)[number]['key'];

/** Where a ring's centre comes from (the event file's fit.ring.centerFrom), and how the desk says it. */
export const RING_CENTER_SOURCES = ['limb', 'free', 'joint'] as const;
export type RingCenterFrom = (typeof RING_CENTER_SOURCES)[number];
export const RING_CENTER_WORDS: Record<RingCenterFrom, string> = {
  limb: 'taken from the limb centre',
  free: 'fitted freely',
  joint: 'fitted jointly with the limb (one shared centre)',
};

/** What a fit was asked to do; null where the stored options leave it to the event's defaults. */
export interface FitOptionsRead {
  fixed: Partial<Record<LimbParameterKey, number>> | null;
  modelErrorKm: number | null;
  fitTimeOffsets: string[] | null;
  ringCenterFrom: RingCenterFrom | null;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** A fit keeps the options it was sent, which may name only what differs from the event's defaults. */
export function readFitOptions(options: Record<string, unknown> | undefined): FitOptionsRead {
  const limb = isRecord(options?.limb) ? options.limb : {};
  const ring = isRecord(options?.ring) ? options.ring : {};
  const fixed = isRecord(limb.fixed)
    ? Object.fromEntries(
        LIMB_PARAMETERS.flatMap((p) => {
          const value = (limb.fixed as Record<string, unknown>)[p.key];
          return typeof value === 'number' ? [[p.key, value]] : [];
        }),
      )
    : null;
  return {
    fixed,
    modelErrorKm: typeof limb.modelErrorKm === 'number' ? limb.modelErrorKm : null,
    fitTimeOffsets: Array.isArray(limb.fitTimeOffsets)
      ? limb.fitTimeOffsets.filter((s): s is string => typeof s === 'string')
      : null,
    ringCenterFrom: RING_CENTER_SOURCES.find((c) => c === ring.centerFrom) ?? null,
  };
}
