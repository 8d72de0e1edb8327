// The light-curve CSV of docs/file-formats.md ("Light-curve CSV"): a header row naming `time` (ISO 8601 UTC,
// the middle of each exposure), `flux` and optionally `fluxErr`. One parser for the CLI's `limbus time`, the
// API's upload check and the queued timing job, so a file one accepts the others accept too.
// Step in the data flow: CSV text -> checked arrays on a seconds axis from the first row.
import Papa from 'papaparse';

import type { Problem } from './problems.js';

export const MIN_LIGHT_CURVE_ROWS = 8;

/** A UTC instant split so that sub-microsecond digits survive: whole Unix seconds and the fraction. */
export interface UtcInstant {
  unixSeconds: number;
  fractionSeconds: number;
}

const ISO_UTC = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2})(\.\d+)?(Z|[+-]00:?00)?$/;

/** Parses ISO 8601 in UTC ("Z", "+00:00" or no zone, read as UTC); a message saying why when it cannot. */
export function parseUtc(text: string): UtcInstant | string {
  const m = ISO_UTC.exec(text.trim());
  if (m === null) return 'not an ISO 8601 UTC time (e.g. 2031-05-20T03:14:15.25Z)';
  const [year, month, day, hour, minute, second] = m.slice(1, 7).map(Number) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  if (month < 1 || month > 12) return 'month out of range';
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const daysInMonth = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1] ?? 0;
  if (day < 1 || day > daysInMonth) return 'day out of range';
  if (hour > 23 || minute > 59) return 'hour or minute out of range';
  if (second === 60) return 'a leap second (:60) cannot be placed on this time axis';
  if (second > 59) return 'second out of range';
  return {
    unixSeconds: Date.UTC(year, month - 1, day, hour, minute, second) / 1000,
    fractionSeconds: m[7] === undefined ? 0 : Number(`0${m[7]}`),
  };
}

/** Six decimals of a second (the contract asks for at least four). */
export function formatUtc(origin: UtcInstant, offsetSeconds: number): string {
  const total = origin.fractionSeconds + offsetSeconds;
  let whole = Math.floor(total);
  let micro = Math.round((total - whole) * 1e6);
  if (micro >= 1_000_000) {
    whole += 1;
    micro -= 1_000_000;
  }
  const base = new Date((origin.unixSeconds + whole) * 1000).toISOString().slice(0, 19);
  return `${base}.${String(micro).padStart(6, '0')}Z`;
}

export interface LightCurve {
  origin: UtcInstant;
  /** Seconds since the first row's time. */
  timesSeconds: number[];
  flux: number[];
  fluxErr?: number[];
  /** The file's 1-based line number of each point (header = 1). */
  rows: number[];
}

export type LightCurveParse = { ok: true; curve: LightCurve } | { ok: false; problems: Problem[] };

/** Parses and checks the CSV text; every problem names its row (file line, header = 1) and column. */
export function parseLightCurveCsv(text: string): LightCurveParse {
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '') {
    return {
      ok: false,
      problems: [{ path: 'row 1', message: 'empty file; expected a header row with time and flux' }],
    };
  }
  const parsed = Papa.parse<string[]>(body, { header: false, skipEmptyLines: false });
  const lines = parsed.data;
  const problems: Problem[] = [];
  for (const e of parsed.errors) {
    if (e.code === 'UndetectableDelimiter') continue;
    problems.push({ path: `row ${(e.row ?? 0) + 1}`, message: e.message });
  }
  const header = (lines[0] ?? []).map((h) => h.trim());
  const column = (name: string): number => header.indexOf(name);
  const timeColumn = column('time');
  const fluxColumn = column('flux');
  const errColumn = column('fluxErr');
  if (timeColumn < 0) problems.push({ path: 'row 1, column time', message: 'missing column "time"' });
  if (fluxColumn < 0) problems.push({ path: 'row 1, column flux', message: 'missing column "flux"' });
  for (const name of ['time', 'flux', 'fluxErr']) {
    if (header.filter((h) => h === name).length > 1) {
      problems.push({ path: `row 1, column ${name}`, message: 'column appears more than once' });
    }
  }
  if (problems.length > 0) return { ok: false, problems };

  let origin: UtcInstant | null = null;
  let previous: UtcInstant | null = null;
  const timesSeconds: number[] = [];
  const flux: number[] = [];
  const fluxErr: number[] = [];
  const rows: number[] = [];
  for (let i = 1; i < lines.length; i++) {
    const fields = lines[i] ?? [];
    const row = i + 1;
    if (fields.length === 1 && (fields[0] ?? '').trim() === '') continue;
    if (fields.length !== header.length) {
      const missing = [timeColumn, fluxColumn, errColumn].filter((c) => c >= fields.length);
      const where =
        missing.length > 0
          ? `row ${row}, column ${header[Math.min(...missing)] ?? ''}`
          : `row ${row}, column ${header.length + 1}`;
      problems.push({
        path: where,
        message: `the row has ${fields.length} fields, the header ${header.length}`,
      });
      continue;
    }
    const instant = parseUtc(fields[timeColumn] ?? '');
    const f = numberField(fields[fluxColumn]);
    const e = errColumn >= 0 ? numberField(fields[errColumn]) : undefined;
    let ok = true;
    if (typeof instant === 'string') {
      problems.push({ path: `row ${row}, column time`, message: instant });
      ok = false;
    } else if (previous !== null && secondsBetweenUtc(instant, previous) <= 0) {
      problems.push({
        path: `row ${row}, column time`,
        message: 'time does not increase from the row before',
      });
      ok = false;
    }
    if (f === undefined) {
      problems.push({
        path: `row ${row}, column flux`,
        message: `not a number: "${fields[fluxColumn] ?? ''}"`,
      });
      ok = false;
    }
    if (errColumn >= 0 && !(e !== undefined && e > 0)) {
      problems.push({
        path: `row ${row}, column fluxErr`,
        message: `must be a positive number, not "${fields[errColumn] ?? ''}"`,
      });
      ok = false;
    }
    if (typeof instant !== 'string') previous = instant;
    if (!ok || typeof instant === 'string' || f === undefined) continue;
    origin ??= instant;
    timesSeconds.push(
      instant.unixSeconds - origin.unixSeconds + (instant.fractionSeconds - origin.fractionSeconds),
    );
    flux.push(f);
    if (e !== undefined) fluxErr.push(e);
    rows.push(row);
  }
  if (problems.length === 0 && rows.length < MIN_LIGHT_CURVE_ROWS) {
    problems.push({
      path: `row ${rows[rows.length - 1] ?? 1}`,
      message: `only ${rows.length} data rows; at least ${MIN_LIGHT_CURVE_ROWS} are needed`,
    });
  }
  if (problems.length > 0 || origin === null) return { ok: false, problems };
  return { ok: true, curve: { origin, timesSeconds, flux, ...(errColumn >= 0 ? { fluxErr } : {}), rows } };
}

function numberField(text: string | undefined): number | undefined {
  const t = (text ?? '').trim();
  if (t === '') return undefined;
  const x = Number(t);
  return Number.isFinite(x) ? x : undefined;
}

/** Seconds from b to a. */
export function secondsBetweenUtc(a: UtcInstant, b: UtcInstant): number {
  return a.unixSeconds - b.unixSeconds + (a.fractionSeconds - b.fractionSeconds);
}
