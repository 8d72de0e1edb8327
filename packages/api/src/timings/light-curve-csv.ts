// Step in the data flow: the uploaded light-curve CSV (columns time, flux and optionally fluxErr) ->
// validated arrays on a seconds axis from the first row. Same column contract as `limbus time`
// (docs/file-formats.md, "Light-curve timing job").
import Papa from 'papaparse';
import type { FieldIssue } from '../common/domain-errors';
import { parseUtcInstant, secondsBetween, type UtcInstant } from './utc-instant';

export const MIN_LIGHT_CURVE_ROWS = 8;

export interface LightCurveSeries {
  origin: UtcInstant;
  timesSeconds: number[];
  flux: number[];
  fluxErr?: number[];
}

export type LightCurveParse = { ok: true; series: LightCurveSeries } | { ok: false; issues: FieldIssue[] };

function numberField(text: string | undefined): number | undefined {
  const t = (text ?? '').trim();
  if (t === '') return undefined;
  const x = Number(t);
  return Number.isFinite(x) ? x : undefined;
}

/** Every problem names its row (file line, header = 1) and column. */
export function parseLightCurveCsv(text: string): LightCurveParse {
  const body = text.replace(/^\uFEFF/, '');
  const issues: FieldIssue[] = [];
  if (body.trim() === '') {
    return {
      ok: false,
      issues: [{ path: 'row 1', message: 'empty file; expected a header with time and flux' }],
    };
  }
  const lines = Papa.parse<string[]>(body, { header: false, skipEmptyLines: true }).data;
  const header = (lines[0] ?? []).map((h) => h.trim());
  const timeColumn = header.indexOf('time');
  const fluxColumn = header.indexOf('flux');
  const errColumn = header.indexOf('fluxErr');
  if (timeColumn < 0) issues.push({ path: 'row 1, column time', message: 'missing column "time"' });
  if (fluxColumn < 0) issues.push({ path: 'row 1, column flux', message: 'missing column "flux"' });
  if (issues.length > 0) return { ok: false, issues };

  let origin: UtcInstant | null = null;
  let previous: UtcInstant | null = null;
  const timesSeconds: number[] = [];
  const flux: number[] = [];
  const fluxErr: number[] = [];
  for (let i = 1; i < lines.length; i++) {
    const fields = lines[i] ?? [];
    const row = i + 1;
    if (fields.length !== header.length) {
      issues.push({
        path: `row ${row}`,
        message: `has ${fields.length} fields, the header has ${header.length}`,
      });
      continue;
    }
    const instant = parseUtcInstant(fields[timeColumn] ?? '');
    const f = numberField(fields[fluxColumn]);
    const e = errColumn >= 0 ? numberField(fields[errColumn]) : undefined;
    if (typeof instant === 'string') {
      issues.push({ path: `row ${row}, column time`, message: instant });
      continue;
    }
    if (previous !== null && secondsBetween(previous, instant) <= 0) {
      issues.push({ path: `row ${row}, column time`, message: 'time does not increase from the row before' });
    }
    previous = instant;
    if (f === undefined) issues.push({ path: `row ${row}, column flux`, message: 'not a number' });
    if (errColumn >= 0 && !(e !== undefined && e > 0)) {
      issues.push({ path: `row ${row}, column fluxErr`, message: 'must be a positive number' });
    }
    origin ??= instant;
    timesSeconds.push(secondsBetween(origin, instant));
    flux.push(f ?? Number.NaN);
    if (e !== undefined) fluxErr.push(e);
  }
  if (issues.length === 0 && timesSeconds.length < MIN_LIGHT_CURVE_ROWS) {
    issues.push({
      path: `row ${lines.length}`,
      message: `only ${timesSeconds.length} data rows; at least ${MIN_LIGHT_CURVE_ROWS} are needed`,
    });
  }
  if (issues.length > 0 || origin === null) return { ok: false, issues };
  return { ok: true, series: { origin, timesSeconds, flux, ...(errColumn >= 0 ? { fluxErr } : {}) } };
}
