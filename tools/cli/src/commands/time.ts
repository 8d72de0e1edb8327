// `limbus time LIGHTCURVE.csv --speed-km-s V --distance-km D --exposure-s E [...]`: disappearance and
// reappearance times with 1-sigma, and secondary dips, from one station's light curve.
// Step in the data flow: CSV file -> validated arrays (seconds since the first row) -> geometry fitTiming
// -> JSON on stdout. The geometry package does no I/O; this file owns parsing and the output format.

import {
  buildEdgeProfile,
  DEFAULT_DETECTION_SIGMA,
  fitTiming,
  GeometryInputError,
  starAngularDiameterMasFromVK,
  starDiameterKmFromMas,
  type TimingResult,
} from '@limbus/geometry';

import {
  parseLightCurveCsv,
  parseUtc,
  secondsBetweenUtc,
  TIMING_FORMAT,
  timingDocument,
  type LightCurve,
  type TimingDocument,
} from '@limbus/schema';

import { InputProblems, readFileBytes, runCommand, type Problem } from '../io.js';

export const TIMING_OUTPUT_FORMAT = TIMING_FORMAT;

const USAGE =
  'usage: limbus time LIGHTCURVE.csv --speed-km-s V [--speed-d-km-s VD] [--speed-r-km-s VR] ' +
  '--distance-km D --exposure-s E [--wavelength-um 0.65] ' +
  '[--bandwidth-um 0.3] [--star-diameter-km S | --star-diameter-mas M | --star-v-mag V --star-k-mag K] ' +
  '[--bottom free|zero] [--ring-opening-deg B [--ring-opening-sigma-deg SB]] ' +
  '[--dip START/END ...] [--detection-sigma 6]';

export interface TimingOptions {
  file: string;
  speedKmPerS: number;
  /** The limb-normal speeds of the two edges; each defaults to speedKmPerS. */
  speedDisappearanceKmPerS: number;
  speedReappearanceKmPerS: number;
  distanceKm: number;
  exposureSeconds: number;
  wavelengthUm: number;
  bandwidthUm: number;
  starDiameterKm?: number;
  starDiameterMas?: number;
  starVMag?: number;
  starKMag?: number;
  bottom: 'free' | 'zero';
  /** The ring's opening angle and its 1-sigma, for the dips' normal optical depth. */
  ringOpeningAngle?: { valueDeg: number; sigmaDeg: number };
  detectionSigma: number;
  dips: Array<{ start: string; end: string }>;
}

/** The limbus-timing/1 document (one builder in @limbus/schema, shared with the server). */
export type TimingOutput = TimingDocument;

const NUMBER_OPTIONS = {
  '--speed-km-s': 'speedKmPerS',
  '--speed-d-km-s': 'speedDisappearanceKmPerS',
  '--speed-r-km-s': 'speedReappearanceKmPerS',
  '--ring-opening-deg': 'ringOpeningDeg',
  '--ring-opening-sigma-deg': 'ringOpeningSigmaDeg',
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
  const edgeSpeed = (key: 'speedDisappearanceKmPerS' | 'speedReappearanceKmPerS', flag: string): number => {
    const x = numbers[key];
    if (x === undefined) return speedKmPerS;
    if (!(x > 0)) problems.push({ path: flag, message: 'must be positive' });
    return x;
  };
  const speedDisappearanceKmPerS = edgeSpeed('speedDisappearanceKmPerS', '--speed-d-km-s');
  const speedReappearanceKmPerS = edgeSpeed('speedReappearanceKmPerS', '--speed-r-km-s');
  const ringOpeningDeg = numbers.ringOpeningDeg;
  const ringOpeningSigmaDeg = numbers.ringOpeningSigmaDeg ?? 0;
  if (ringOpeningDeg !== undefined && !(Math.abs(ringOpeningDeg) <= 90))
    problems.push({ path: '--ring-opening-deg', message: 'must be within ±90°' });
  if (!(ringOpeningSigmaDeg >= 0))
    problems.push({ path: '--ring-opening-sigma-deg', message: 'must be zero or positive' });
  if (ringOpeningDeg === undefined && numbers.ringOpeningSigmaDeg !== undefined)
    problems.push({ path: '--ring-opening-sigma-deg', message: 'needs --ring-opening-deg' });
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
    speedDisappearanceKmPerS,
    speedReappearanceKmPerS,
    distanceKm,
    exposureSeconds,
    wavelengthUm,
    bandwidthUm,
    ...(numbers.starDiameterKm === undefined ? {} : { starDiameterKm: numbers.starDiameterKm }),
    ...(numbers.starDiameterMas === undefined ? {} : { starDiameterMas: numbers.starDiameterMas }),
    ...(numbers.starVMag === undefined ? {} : { starVMag: numbers.starVMag }),
    ...(numbers.starKMag === undefined ? {} : { starKMag: numbers.starKMag }),
    bottom,
    ...(ringOpeningDeg === undefined
      ? {}
      : { ringOpeningAngle: { valueDeg: ringOpeningDeg, sigmaDeg: ringOpeningSigmaDeg } }),
    detectionSigma,
    dips,
  };
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
  const parsed = parseLightCurveCsv((await readFileBytes(options.file)).toString('utf8'));
  if (!parsed.ok) throw new InputProblems(parsed.problems);
  const curve = parsed.curve;
  const markedDips = options.dips.map((d, k) => {
    const start = parseUtc(d.start);
    const end = parseUtc(d.end);
    const problems: Problem[] = [];
    if (typeof start === 'string') problems.push({ path: `--dip[${k}]`, message: `start: ${start}` });
    if (typeof end === 'string') problems.push({ path: `--dip[${k}]`, message: `end: ${end}` });
    if (typeof start === 'string' || typeof end === 'string') throw new InputProblems(problems);
    const startSeconds = secondsBetweenUtc(start, curve.origin);
    const endSeconds = secondsBetweenUtc(end, curve.origin);
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
      edgeSpeedsKmPerS: {
        disappearanceKmPerS: options.speedDisappearanceKmPerS,
        reappearanceKmPerS: options.speedReappearanceKmPerS,
      },
      ...(options.ringOpeningAngle === undefined ? {} : { ringOpeningAngle: options.ringOpeningAngle }),
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
  const output: TimingOutput = timingDocument(result, curve.origin);
  return { output, result };
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const options = parseTimingArguments(args);
    const { output, result } = await timingFromFile(options);
    if (output.disappearance === null && output.reappearance === null) {
      process.stderr.write(
        `limbus time: no event found: the strongest drop is ${result.eventSignificance.toFixed(1)} sigma, ` +
          `below the detection threshold of ${options.detectionSigma} sigma; disappearance and reappearance are null\n`,
      );
    } else if (output.disappearance === null || output.reappearance === null) {
      const held = output.disappearance === null ? 'reappearance' : 'disappearance';
      const where = held === 'reappearance' ? 'starts' : 'ends';
      process.stderr.write(
        `limbus time: the light curve ${where} inside the event: only the ${held} is timed; ` +
          `the other is null (a single-edge chord, docs/file-formats.md)\n`,
      );
    }
    process.stdout.write(JSON.stringify(output, null, 2) + '\n');
  });
}
