import type { ContextInputFile } from '@limbus/schema';

// The form's text fields, keyed by the JSON path of the value in limbus-context-input/1, so that a
// server issue ("body.radiusKm") lands on the very field it names.

export type MassFrom = 'densityKgM3' | 'massKg' | 'massFromSatellite';

export interface SatelliteDraft {
  name: string;
  semiMajorAxisKm: string;
  semiMajorAxisKmSigma: string;
  semiMajorAxisKmSource: string;
  periodDays: string;
  periodDaysSigma: string;
  periodDaysSource: string;
}

export interface ContextDraft {
  massFrom: MassFrom;
  /** value, sigma and source of each measured scalar, by path */
  values: Record<string, string>;
  satelliteForMass: string;
  satellites: SatelliteDraft[];
  /** Rings come from the file as stored; the fitted rings are added by the server. */
  rings: ContextInputFile['rings'];
  /** Mean-motion resonances named besides the default ones, as typed: "6:1, 11:2". */
  resonances: string;
  /** Resonance settings the form does not show, kept so that saving does not drop them. */
  kept: Pick<ContextInputFile, 'spinOrbitK' | 'resonanceMaxOrder' | 'resonanceMaxInteger'>;
}

/** "6:1, 11:2" from [{ p: 6, q: 1 }, { p: 11, q: 2 }]. */
export function resonancesText(resonances: ContextInputFile['resonances']): string {
  return (resonances ?? []).map((r) => `${r.p}:${r.q}`).join(', ');
}

/** The named resonances typed as "p:q" separated by commas or spaces; null when one is not p:q. */
export function parseResonances(text: string): Array<{ p: number; q: number }> | null {
  const parts = text.split(/[\s,;]+/).filter((t) => t !== '');
  const out: Array<{ p: number; q: number }> = [];
  for (const part of parts) {
    const m = /^(\d+):(\d+)$/.exec(part);
    if (!m) return null;
    out.push({ p: Number(m[1]), q: Number(m[2]) });
  }
  return out;
}

export const MEASURED = [
  { path: 'body.radiusKm', label: 'Body radius', unit: 'km' },
  { path: 'body.spinPeriodHours', label: 'Spin period', unit: 'h' },
  { path: 'particleDensityKgM3', label: 'Ring-particle density', unit: 'kg/m³' },
  { path: 'heliocentricDistanceAu', label: 'Heliocentric distance', unit: 'au' },
] as const;

export const MASS_FIELDS = {
  densityKgM3: { path: 'body.densityKgM3', label: 'Bulk density', unit: 'kg/m³' },
  massKg: { path: 'body.massKg', label: 'Mass', unit: 'kg' },
} as const;

const text = (x: number | undefined): string => (x === undefined ? '' : String(x));

function pick(object: object, key: string): unknown {
  return Reflect.get(object, key);
}

export function draftOf(input: ContextInputFile | null): ContextDraft {
  const values: Record<string, string> = {};
  if (input !== null) {
    const put = (path: string, object: object, key: string) => {
      const v = pick(object, key);
      const s = pick(object, `${key}Sigma`);
      const src = pick(object, `${key}Source`);
      values[path] = typeof v === 'number' ? text(v) : '';
      values[`${path}Sigma`] = typeof s === 'number' ? text(s) : '';
      values[`${path}Source`] = typeof src === 'string' ? src : '';
    };
    for (const key of ['radiusKm', 'spinPeriodHours', 'densityKgM3', 'massKg'])
      put(`body.${key}`, input.body, key);
    for (const key of ['particleDensityKgM3', 'heliocentricDistanceAu']) put(key, input, key);
  }
  const body = input?.body;
  return {
    massFrom:
      body?.massKg !== undefined
        ? 'massKg'
        : body?.massFromSatellite !== undefined
          ? 'massFromSatellite'
          : 'densityKgM3',
    values,
    satelliteForMass: body?.massFromSatellite ?? '',
    satellites: (input?.satellites ?? []).map((s) => ({
      name: s.name,
      semiMajorAxisKm: text(s.semiMajorAxisKm),
      semiMajorAxisKmSigma: text(s.semiMajorAxisKmSigma),
      semiMajorAxisKmSource: s.semiMajorAxisKmSource ?? '',
      periodDays: text(s.periodDays),
      periodDaysSigma: text(s.periodDaysSigma),
      periodDaysSource: s.periodDaysSource ?? '',
    })),
    rings: input?.rings ?? [],
    resonances: resonancesText(input?.resonances),
    kept: {
      ...(input?.spinOrbitK === undefined ? {} : { spinOrbitK: input.spinOrbitK }),
      ...(input?.resonanceMaxOrder === undefined ? {} : { resonanceMaxOrder: input.resonanceMaxOrder }),
      ...(input?.resonanceMaxInteger === undefined ? {} : { resonanceMaxInteger: input.resonanceMaxInteger }),
    },
  };
}

export type DraftResult =
  { ok: true; file: ContextInputFile } | { ok: false; errors: Record<string, string> };

/** Turns the draft into a file, naming each field that is not a number of the right sign. */
export function fileOf(draft: ContextDraft): DraftResult {
  const errors: Record<string, string> = {};
  const number = (path: string, raw: string, required: boolean, sigma: boolean): number | undefined => {
    const t = raw.trim();
    if (t === '') {
      if (required) errors[path] = `${path}: required`;
      return undefined;
    }
    const x = Number(t);
    if (!Number.isFinite(x) || (sigma ? x < 0 : x <= 0)) {
      errors[path] = `${path}: must be a number ${sigma ? '0 or more' : 'greater than 0'}`;
      return undefined;
    }
    return x;
  };
  const measured = (path: string, key: string, required: boolean): Record<string, number | string> => {
    const out: Record<string, number | string> = {};
    const v = number(path, draft.values[path] ?? '', required, false);
    const s = number(`${path}Sigma`, draft.values[`${path}Sigma`] ?? '', false, true);
    const src = (draft.values[`${path}Source`] ?? '').trim();
    if (v !== undefined) out[key] = v;
    if (s !== undefined) out[`${key}Sigma`] = s;
    if (src !== '') out[`${key}Source`] = src;
    return out;
  };
  const body: Record<string, unknown> = {
    ...measured('body.radiusKm', 'radiusKm', true),
    ...measured('body.spinPeriodHours', 'spinPeriodHours', true),
  };
  if (draft.massFrom === 'massFromSatellite') {
    if (draft.satelliteForMass.trim() === '')
      errors['body.massFromSatellite'] = 'body.massFromSatellite: name a satellite';
    body.massFromSatellite = draft.satelliteForMass.trim();
  } else {
    Object.assign(body, measured(MASS_FIELDS[draft.massFrom].path, draft.massFrom, true));
  }
  const satellites = draft.satellites.map((s, i) => {
    const p = `satellites[${i}]`;
    if (s.name.trim() === '') errors[`${p}.name`] = `${p}.name: must not be empty`;
    const out: Record<string, unknown> = { name: s.name.trim() };
    const a = number(`${p}.semiMajorAxisKm`, s.semiMajorAxisKm, false, false);
    const as = number(`${p}.semiMajorAxisKmSigma`, s.semiMajorAxisKmSigma, false, true);
    const d = number(`${p}.periodDays`, s.periodDays, false, false);
    const ds = number(`${p}.periodDaysSigma`, s.periodDaysSigma, false, true);
    if (a !== undefined) out.semiMajorAxisKm = a;
    if (as !== undefined) out.semiMajorAxisKmSigma = as;
    if (d !== undefined) out.periodDays = d;
    if (ds !== undefined) out.periodDaysSigma = ds;
    if (s.semiMajorAxisKmSource.trim() !== '') out.semiMajorAxisKmSource = s.semiMajorAxisKmSource.trim();
    if (s.periodDaysSource.trim() !== '') out.periodDaysSource = s.periodDaysSource.trim();
    if (a === undefined && d === undefined && errors[`${p}.semiMajorAxisKm`] === undefined) {
      errors[`${p}.semiMajorAxisKm`] = `${p}: give semiMajorAxisKm or periodDays`;
    }
    return out;
  });
  const resonances = parseResonances(draft.resonances);
  if (resonances === null)
    errors.resonances = 'resonances: write each as p:q with whole numbers, e.g. 6:1, 11:2';
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  const file = {
    format: 'limbus-context-input/1',
    body,
    ...measured('particleDensityKgM3', 'particleDensityKgM3', true),
    ...measured('heliocentricDistanceAu', 'heliocentricDistanceAu', true),
    satellites,
    rings: draft.rings,
    ...(resonances !== null && resonances.length > 0 ? { resonances } : {}),
    ...draft.kept,
  };
  // Shape checked field by field above; the server validates the whole file again with its schema.
  return { ok: true, file: file as ContextInputFile };
}
