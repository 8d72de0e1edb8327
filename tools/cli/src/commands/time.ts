// `limbus time LIGHTCURVE.csv --speed-km-s V --distance-km D --exposure-s E [...]`: disappearance and
// reappearance times with 1-sigma, and secondary dips, from one station's light curve.
// Step in the data flow: CSV file -> validated arrays (seconds since the first row) -> geometry fitTiming
// -> JSON on stdout. The geometry package does no I/O; this file owns parsing and the output format.

import Papa from 'papaparse';

import {
  buildEdgeProfile,
  DEFAULT_DETECTION_SIGMA,
  fitTiming,
  GeometryInputError,
  starAngularDiameterMasFromVK,
  starDiameterKmFromMas,
  type TimedEdge,
  type TimingResult,
} from '@limbus/geometry';

import { InputProblems, readFileBytes, runCommand, type Problem } from '../io.js';

export const TIMING_OUTPUT_FORMAT = 'limbus-timing/1';

const USAGE =
  'usage: limbus time LIGHTCURVE.csv --speed-km-s V --distance-km D --exposure-s E [--wavelength-um 0.65] ' +
  '[--bandwidth-um 0.3] [--star-diameter-km S | --star-diameter-mas M | --star-v-mag V --star-k-mag K] ' +
  '[--bottom free|zero] ' +
  '[--dip START/END ...] [--detection-sigma 6]';

const MIN_ROWS = 8;

export interface TimingOptions {
  file: string;
  speedKmPerS: number;
  distanceKm: number;
  exposureSeconds: number;
  wavelengthUm: number;
  bandwidthUm: number;
  starDiameterKm?: number;
  starDiameterMas?: number;
  starVMag?: number;
  starKMag?: number;
  bottom: 'free' | 'zero';
  detectionSigma: number;
  dips: Array<{ start: string; end: string }>;
}

export interface TimingOutput {
  format: typeof TIMING_OUTPUT_FORMAT;
  disappearance: { time: string; sigmaSeconds: number } | null;
  reappearance: { time: string; sigmaSeconds: number } | null;
  baselineFlux: number;
  bottomFlux: number | null;
  chi2: number;
  dof: number;
  fresnelScaleKm: number;
  starDiameterKm: number;
  dips: Array<{
    start: { time: string; sigmaSeconds: number };
    end: { time: string; sigmaSeconds: number };
    apparentOpacity: number;
    apparentOpticalDepth: number | null;
    equivalentWidthKm: number;
    significance: number;
  }>;
}

const NUMBER_OPTIONS = {
  '--speed-km-s': 'speedKmPerS',
  '--distance-km': 'distanceKm',
  '--exposure-s': 'exposureSeconds',
  '--wavelength-um': 'wavelengthUm',
  '--bandwidth-um': 'bandwidthUm',
  '--star-diameter-km': 'starDiameterKm',
  '--star-diameter-mas': 'starDiameterMas',
  '--star-v-mag': 'starVMag',
  '--star-k-mag': 'starKMag',
  '--detection-sigma': 'detectionSigma',
} as const;
type NumberOption = keyof typeof NUMBER_OPTIONS;

function isNumberOption(name: string): name is NumberOption {
  return name in NUMBER_OPTIONS;
}

export function parseTimingArguments(args: string[]): TimingOptions {
  const problems: Problem[] = [];
  const files: string[] = [];
  const numbers: Partial<Record<(typeof NUMBER_OPTIONS)[NumberOption], number>> = {};
  let bottom: 'free' | 'zero' = 'free';
  const dips: Array<{ start: string; end: string }> = [];
  for (let i = 0; i < args.length; i++) {
    const arg = args[i] ?? '';
    if (!arg.startsWith('--')) {
      files.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = eq >= 0 ? arg.slice(0, eq) : arg;
    let value: string | undefined;
    if (eq >= 0) {
      value = arg.slice(eq + 1);
    } else {
      value = args[i + 1];
      i++;
    }
    if (value === undefined) {
      problems.push({ path: name, message: 'needs a value' });
      continue;
    }
    if (isNumberOption(name)) {
      const x = value.trim() === '' ? NaN : Number(value);
      if (!Number.isFinite(x)) problems.push({ path: name, message: `not a number: "${value}"` });
      else numbers[NUMBER_OPTIONS[name]] = x;
    } else if (name === '--bottom') {
      if (value === 'free' || value === 'zero') bottom = value;
      else problems.push({ path: name, message: `must be free or zero, not "${value}"` });
    } else if (name === '--dip') {
      const [start, end, extra] = value.split('/');
      if (start === undefined || end === undefined || extra !== undefined) {
        problems.push({ path: name, message: `must be START/END (two ISO 8601 UTC times), not "${value}"` });
      } else {
        dips.push({ start, end });
      }
    } else {
      problems.push({ path: name, message: `unknown option; ${USAGE}` });
      if (eq < 0) i--;
    }
  }
  if (files.length !== 1) {
    problems.push({
      path: 'arguments',
      message: `expected one light-curve file, got ${files.length}; ${USAGE}`,
    });
  }
  const required = (
    key: 'speedKmPerS' | 'distanceKm' | 'exposureSeconds',
    flag: string,
    minimum: 'positive' | 'nonNegative',
  ) => {
    const x = numbers[key];
    if (x === undefined) {
      problems.push({ path: flag, message: 'is required' });
      return NaN;
    }
    if (minimum === 'positive' ? !(x > 0) : !(x >= 0)) {
      problems.push({
        path: flag,
        message: `must be ${minimum === 'positive' ? 'positive' : 'zero or positive'}`,
      });
    }
    return x;
  };
  const speedKmPerS = required('speedKmPerS', '--speed-km-s', 'positive');
  const distanceKm = required('distanceKm', '--distance-km', 'positive');
  const exposureSeconds = required('exposureSeconds', '--exposure-s', 'positive');
  const wavelengthUm = numbers.wavelengthUm ?? 0.65;
  const bandwidthUm = numbers.bandwidthUm ?? 0.3;
  if (!(wavelengthUm > 0)) problems.push({ path: '--wavelength-um', message: 'must be positive' });
  if (!(bandwidthUm >= 0 && bandwidthUm < 2 * wavelengthUm)) {
    problems.push({
      path: '--bandwidth-um',
      message: 'must be at least 0 and less than twice --wavelength-um',
    });
  }
  if (numbers.starDiameterKm !== undefined && numbers.starDiameterMas !== undefined) {
    problems.push({
      path: '--star-diameter-km',
      message: 'give either --star-diameter-km or --star-diameter-mas, not both',
    });
  }
  if (numbers.starDiameterKm !== undefined && !(numbers.starDiameterKm >= 0)) {
    problems.push({ path: '--star-diameter-km', message: 'must be zero or positive' });
  }
  if (numbers.starDiameterMas !== undefined && !(numbers.starDiameterMas >= 0)) {
    problems.push({ path: '--star-diameter-mas', message: 'must be zero or positive' });
  }
  const hasMagnitudes = numbers.starVMag !== undefined || numbers.starKMag !== undefined;
  if (hasMagnitudes && (numbers.starVMag === undefined || numbers.starKMag === undefined)) {
    problems.push({
      path: numbers.starVMag === undefined ? '--star-v-mag' : '--star-k-mag',
      message: 'the diameter from magnitudes needs both --star-v-mag and --star-k-mag',
    });
  }
  if (hasMagnitudes && (numbers.starDiameterKm !== undefined || numbers.starDiameterMas !== undefined)) {
    problems.push({
      path: '--star-v-mag',
      message: 'give the star diameter or its magnitudes, not both',
    });
  }
  const detectionSigma = numbers.detectionSigma ?? DEFAULT_DETECTION_SIGMA;
  if (!(detectionSigma > 0)) problems.push({ path: '--detection-sigma', message: 'must be positive' });
  if (problems.length > 0) throw new InputProblems(problems);
  return {
    file: files[0] ?? '',
    speedKmPerS,
    distanceKm,
    exposureSeconds,
    wavelengthUm,
    bandwidthUm,
    ...(numbers.starDiameterKm === undefined ? {} : { starDiameterKm: numbers.starDiameterKm }),
    ...(numbers.starDiameterMas === undefined ? {} : { starDiameterMas: numbers.starDiameterMas }),
    ...(numbers.starVMag === undefined ? {} : { starVMag: numbers.starVMag }),
    ...(numbers.starKMag === undefined ? {} : { starKMag: numbers.starKMag }),
    bottom,
    detectionSigma,
    dips,
  };
}

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

/** Parses and checks the CSV text; every problem names its row (file line, header = 1) and column. */
export function parseLightCurve(text: string): LightCurve {
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '')
    throw new InputProblems([
      { path: 'row 1', message: 'empty file; expected a header row with time and flux' },
    ]);
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
  if (problems.length > 0) throw new InputProblems(problems);

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
    } else if (previous !== null && compare(instant, previous) <= 0) {
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
  if (problems.length === 0 && rows.length < MIN_ROWS) {
    problems.push({
      path: `row ${rows[rows.length - 1] ?? 1}`,
      message: `only ${rows.length} data rows; at least ${MIN_ROWS} are needed`,
    });
  }
  if (problems.length > 0 || origin === null) throw new InputProblems(problems);
  return { origin, timesSeconds, flux, ...(errColumn >= 0 ? { fluxErr } : {}), rows };
}

function numberField(text: string | undefined): number | undefined {
  const t = (text ?? '').trim();
  if (t === '') return undefined;
  const x = Number(t);
  return Number.isFinite(x) ? x : undefined;
}

function compare(a: UtcInstant, b: UtcInstant): number {
  return a.unixSeconds - b.unixSeconds + (a.fractionSeconds - b.fractionSeconds);
}

const GEOMETRY_COLUMNS: Record<string, string> = { timesSeconds: 'time', flux: 'flux', fluxErr: 'fluxErr' };

/** Re-addresses a geometry complaint about point i to the CSV row and column it came from. */
function locate(error: GeometryInputError, curve: LightCurve): Problem {
  const m = /^(timesSeconds|flux|fluxErr)\[(\d+)\]$/.exec(error.path);
  if (m !== null) {
    const row = curve.rows[Number(m[2])] ?? 1;
    return { path: `row ${row}, column ${GEOMETRY_COLUMNS[m[1] ?? ''] ?? ''}`, message: error.detail };
  }
  return { path: error.path, message: error.detail };
}

export async function timingFromFile(
  options: TimingOptions,
): Promise<{ output: TimingOutput; result: TimingResult }> {
  const curve = parseLightCurve((await readFileBytes(options.file)).toString('utf8'));
  const markedDips = options.dips.map((d, k) => {
    const start = parseUtc(d.start);
    const end = parseUtc(d.end);
    const problems: Problem[] = [];
    if (typeof start === 'string') problems.push({ path: `--dip[${k}]`, message: `start: ${start}` });
    if (typeof end === 'string') problems.push({ path: `--dip[${k}]`, message: `end: ${end}` });
    if (typeof start === 'string' || typeof end === 'string') throw new InputProblems(problems);
    const startSeconds = compare(start, curve.origin);
    const endSeconds = compare(end, curve.origin);
    if (!(endSeconds > startSeconds))
      throw new InputProblems([{ path: `--dip[${k}]`, message: 'ends before it starts' }]);
    const last = curve.timesSeconds[curve.timesSeconds.length - 1] ?? 0;
    if (endSeconds < 0 || startSeconds > last) {
      throw new InputProblems([{ path: `--dip[${k}]`, message: 'lies outside the light curve' }]);
    }
    return { startSeconds, endSeconds };
  });
  const starDiameterMas =
    options.starDiameterMas ??
    (options.starVMag !== undefined && options.starKMag !== undefined
      ? starAngularDiameterMasFromVK(options.starVMag, options.starKMag)
      : undefined);
  const starDiameterKm =
    options.starDiameterKm ??
    (starDiameterMas === undefined ? 0 : starDiameterKmFromMas(starDiameterMas, options.distanceKm));
  const profile = buildEdgeProfile({
    distanceKm: options.distanceKm,
    wavelengthUm: options.wavelengthUm,
    bandwidthUm: options.bandwidthUm,
    starDiameterKm,
  });
  let result: TimingResult;
  try {
    result = fitTiming({
      timesSeconds: curve.timesSeconds,
      flux: curve.flux,
      ...(curve.fluxErr === undefined ? {} : { fluxErr: curve.fluxErr }),
      speedKmPerS: options.speedKmPerS,
      exposureSeconds: options.exposureSeconds,
      profile,
      bottom: options.bottom,
      detectionSigma: options.detectionSigma,
      markedDips,
    });
  } catch (error) {
    if (error instanceof GeometryInputError) throw new InputProblems([locate(error, curve)]);
    throw error;
  }
  const mark = (e: TimedEdge) => ({
    time: formatUtc(curve.origin, e.timeSeconds),
    sigmaSeconds: e.sigmaSeconds,
  });
  const output: TimingOutput = {
    format: TIMING_OUTPUT_FORMAT,
    disappearance: result.disappearance === null ? null : mark(result.disappearance),
    reappearance: result.reappearance === null ? null : mark(result.reappearance),
    baselineFlux: result.baselineFlux,
    bottomFlux: result.bottomFlux,
    chi2: result.chi2,
    dof: result.dof,
    fresnelScaleKm: result.fresnelScaleKm,
    starDiameterKm: result.starDiameterKm,
    dips: result.dips.map((d) => ({
      start: mark(d.start),
      end: mark(d.end),
      apparentOpacity: d.apparentOpacity,
      apparentOpticalDepth: d.apparentOpticalDepth,
      equivalentWidthKm: d.equivalentWidthKm,
      significance: d.significance,
    })),
  };
  return { output, result };
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const options = parseTimingArguments(args);
    const { output, result } = await timingFromFile(options);
    if (output.disappearance === null) {
      process.stderr.write(
        `limbus time: no event found: the strongest drop is ${result.eventSignificance.toFixed(1)} sigma, ` +
          `below the detection threshold of ${options.detectionSigma} sigma; disappearance and reappearance are null\n`,
      );
    }
    process.stdout.write(JSON.stringify(output, null, 2) + '\n');
  });
}
