import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';

import {
  evenTimes,
  gaussianSource,
  syntheticFlux,
  type SyntheticSetup,
} from '../../../packages/geometry/test/lightcurve/synthetic.js';
import { formatUtc, parseUtc } from '@limbus/schema';

import { run, type TimingOutput } from '../src/commands/time.js';
import { buildCliIfStale, runCli } from './built-cli.js';

// Light curves of an invented event: station "Harrow Moss" watching an invented body pass in front of an
// invented star, written by the geometry package's independent synthetic generator (direct integration of the
// straight-edge diffraction integral), so the CLI is checked end to end against the same truth.

const setup: SyntheticSetup = {
  distanceKm: 6e9,
  wavelengthUm: 0.65,
  bandwidthUm: 0.3,
  starDiameterKm: 0.6,
  speedKmPerS: 6,
  exposureSeconds: 0.08,
  bandSlices: 40,
  discStrips: 16,
  exposureSteps: 12,
};
const ORIGIN = '2031-05-20T03:14:00';
const CADENCE = 0.1;
const truth = { disappearanceSeconds: 12.5371, reappearanceSeconds: 19.0829 };
const dipTruth = { startSeconds: 5.2, endSeconds: 6.0, opacity: 0.5 };
const FLAGS = [
  '--speed-km-s',
  '6',
  '--distance-km',
  '6e9',
  '--exposure-s',
  '0.08',
  '--star-diameter-km',
  '0.6',
];

function isoAt(seconds: number): string {
  const origin = parseUtc(`${ORIGIN}Z`);
  if (typeof origin === 'string') throw new Error(origin);
  return formatUtc(origin, seconds);
}

const dir = mkdtempSync(join(tmpdir(), 'limbus-time-'));
let fileCount = 0;
function writeCsv(text: string): string {
  const path = join(dir, `lc-${fileCount++}.csv`);
  writeFileSync(path, text);
  return path;
}

function lightCurveCsv(
  options: { withErr?: boolean; event?: boolean; dip?: boolean; count?: number } = {},
): string {
  const times = evenTimes(0, CADENCE, options.count ?? 300);
  const clean =
    options.event === false
      ? times.map(() => 1000)
      : syntheticFlux(setup, {
          timesSeconds: times,
          ...truth,
          baselineFlux: 1000,
          bottomFlux: 80,
          ...(options.dip === false ? {} : { dips: [dipTruth] }),
        });
  const gauss = gaussianSource(3);
  const lines = [options.withErr ? 'time,flux,fluxErr' : 'time,flux'];
  times.forEach((t, i) => {
    const flux = ((clean[i] ?? 0) + 30 * gauss()).toFixed(3);
    lines.push(options.withErr ? `${isoAt(t)},${flux},30` : `${isoAt(t)},${flux}`);
  });
  return lines.join('\n') + '\n';
}

function seconds(iso: string): number {
  const a = parseUtc(iso);
  const b = parseUtc(`${ORIGIN}Z`);
  if (typeof a === 'string' || typeof b === 'string') throw new Error('bad time');
  return a.unixSeconds - b.unixSeconds + (a.fractionSeconds - b.fractionSeconds);
}

// run() imports @limbus/geometry from its dist, so that must hold the current sources.
beforeAll(() => buildCliIfStale(), 240_000);

let stdout = '';
let stderr = '';
beforeEach(() => {
  stdout = '';
  stderr = '';
  vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stdout += String(chunk);
    return true;
  });
  vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stderr += String(chunk);
    return true;
  });
});
afterEach(() => {
  vi.restoreAllMocks();
});

const mainCsv = lightCurveCsv();

describe('limbus time', () => {
  it('run() prints limbus-timing/1 with the times, levels, scales and the ring dip', async () => {
    expect(await run([writeCsv(mainCsv), ...FLAGS])).toBe(0);
    expect(stderr).toBe('');
    const out = JSON.parse(stdout) as TimingOutput;
    expect(Object.keys(out)).toEqual([
      'format',
      'disappearance',
      'reappearance',
      'edgeSpeedsKmPerS',
      'baselineFlux',
      'bottomFlux',
      'chi2',
      'dof',
      'fresnelScaleKm',
      'starDiameterKm',
      'noiseSigmaFlux',
      'eventSignificance',
      'dips',
    ]);
    // Without --speed-d-km-s and --speed-r-km-s both edges take --speed-km-s.
    expect(out.edgeSpeedsKmPerS).toEqual({ disappearance: 6, reappearance: 6 });
    expect(out.format).toBe('limbus-timing/1');
    if (out.disappearance === null || out.reappearance === null) throw new Error('event not found');
    // At least four decimals of a second.
    expect(out.disappearance.time).toMatch(/^2031-05-20T03:14:12\.\d{4,}Z$/);
    expect(Math.abs(seconds(out.disappearance.time) - truth.disappearanceSeconds)).toBeLessThan(
      3 * out.disappearance.sigmaSeconds,
    );
    expect(Math.abs(seconds(out.reappearance.time) - truth.reappearanceSeconds)).toBeLessThan(
      3 * out.reappearance.sigmaSeconds,
    );
    expect(Math.abs(out.baselineFlux - 1000)).toBeLessThan(8);
    expect(Math.abs((out.bottomFlux ?? NaN) - 80)).toBeLessThan(15);
    // √(λD/2) at the central 0.65 µm (Roques, Moncuquet & Sicardy 1987; from memory).
    expect(Math.abs(out.fresnelScaleKm - Math.sqrt(1.95))).toBeLessThan(1e-9);
    expect(out.starDiameterKm).toBe(0.6);
    // Four parameters for the well (two levels, two times); one dip costs 3 dof.
    expect(out.dof).toBe(300 - 4 - 3);
    // The noise scale comes from the residuals: the generator's 30 within its own sampling spread.
    expect(Math.abs((out.noiseSigmaFlux ?? NaN) - 30)).toBeLessThan(4 * (30 / Math.sqrt(2 * out.dof)));

    expect(out.dips).toHaveLength(1);
    const dip = out.dips[0];
    if (dip === undefined) throw new Error('no dip');
    expect(Object.keys(dip)).toEqual([
      'start',
      'end',
      'apparentOpacity',
      'apparentOpacitySigma',
      'apparentOpticalDepth',
      'apparentOpticalDepthSigma',
      'normalOpticalDepth',
      'normalOpticalDepthSigma',
      'widthKm',
      'widthKmSigma',
      'equivalentWidthKm',
      'equivalentWidthKmSigma',
      'equivalentDepthKm',
      'equivalentDepthKmSigma',
      'lowerLimits',
      'significance',
      'marked',
    ]);
    const start = seconds(dip.start.time);
    const end = seconds(dip.end.time);
    expect(Math.abs(start - dipTruth.startSeconds)).toBeLessThan(3 * dip.start.sigmaSeconds);
    expect(Math.abs(end - dipTruth.endSeconds)).toBeLessThan(3 * dip.end.sigmaSeconds);
    expect(Math.abs(dip.apparentOpacity - dipTruth.opacity)).toBeLessThan(0.05);
    // Against the generator's truth, within 3 sigma: τ = −ln(1 − 0.5), E = 0.5 × 6 km/s × 0.8 s = 2.4 km,
    // A = τ × 4.8 km; no opening angle given, so no normal optical depth; 4.8 km is resolved (F = 1.4 km).
    const tau = -Math.log(1 - dipTruth.opacity);
    expect(Math.abs((dip.apparentOpticalDepth ?? NaN) - tau)).toBeLessThan(
      3 * (dip.apparentOpticalDepthSigma ?? 0),
    );
    expect(Math.abs(dip.equivalentWidthKm - 2.4)).toBeLessThan(3 * (dip.equivalentWidthKmSigma ?? 0));
    expect(Math.abs((dip.equivalentDepthKm ?? NaN) - tau * 4.8)).toBeLessThan(
      3 * (dip.equivalentDepthKmSigma ?? 0),
    );
    expect(dip.normalOpticalDepth).toBeNull();
    expect(dip.lowerLimits).toBeNull();
    expect(dip.marked).toBe(false);
    expect(dip.significance).toBeGreaterThan(6);
  });

  it('run() with a fluxErr column weights by 1/fluxErr² without rescaling', async () => {
    expect(await run([writeCsv(lightCurveCsv({ withErr: true, dip: false })), ...FLAGS])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    expect(out.dof).toBe(296);
    // χ² of white noise of the stated size: dof ± a few √(2·dof).
    expect(Math.abs(out.chi2 - out.dof)).toBeLessThan(4 * Math.sqrt(2 * out.dof));
    expect(out.chi2).not.toBe(out.dof);
    expect(out.dips).toEqual([]);
  });

  it('run() converts --star-diameter-mas at the body distance', async () => {
    const flags = [
      '--speed-km-s',
      '6',
      '--distance-km',
      '6e9',
      '--exposure-s',
      '0.08',
      '--star-diameter-mas',
      '0.02',
    ];
    expect(await run([writeCsv(mainCsv), ...flags])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    // 0.02 mas = 0.02 × 4.8481368e-9 rad; × 6e9 km = 0.58178 km.
    expect(Math.abs(out.starDiameterKm - 0.581776)).toBeLessThan(1e-6);
  });

  it('run() estimates the star diameter from --star-v-mag and --star-k-mag', async () => {
    const flags = ['--speed-km-s', '6', '--distance-km', '6e9', '--exposure-s', '0.08'];
    expect(await run([writeCsv(mainCsv), ...flags, '--star-v-mag', '12', '--star-k-mag', '10.5'])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    // Kervella et al. 2004 (V−K) relation: log θ = 0.0755·1.5 + 0.5170 − 0.2·10.5 = −1.46975 → 0.033904 mas,
    // × 4.8481368e-9 rad/mas × 6e9 km = 0.98623 km.
    expect(Math.abs(out.starDiameterKm - 0.98623)).toBeLessThan(1e-4);
  });

  it('run() on a light curve with no event prints null times and no dips, and says so on stderr', async () => {
    expect(await run([writeCsv(lightCurveCsv({ event: false })), ...FLAGS])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    expect(out.disappearance).toBeNull();
    expect(out.reappearance).toBeNull();
    expect(out.dips).toEqual([]);
    expect(stderr).toMatch(/^limbus time: no event found/);
  });

  it('run() times the one edge of a light curve that ends inside the event, and says so', async () => {
    // Rows up to 16 s: the disappearance (12.54 s) is in, the reappearance (19.08 s) is not.
    const cut = mainCsv.trimEnd().split('\n').slice(0, 161).join('\n') + '\n';
    expect(await run([writeCsv(cut), ...FLAGS])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    expect(out.reappearance).toBeNull();
    if (out.disappearance === null) throw new Error('disappearance not timed');
    expect(Math.abs(seconds(out.disappearance.time) - truth.disappearanceSeconds)).toBeLessThan(
      3 * out.disappearance.sigmaSeconds,
    );
    // Three parameters (two levels, one time) and the dip's three.
    expect(out.dof).toBe(160 - 3 - 3);
    expect(stderr).toBe(
      'limbus time: the light curve ends inside the event: only the disappearance is timed; the other is null (a single-edge chord, docs/file-formats.md)\n',
    );
  });

  it('run() models each edge at --speed-d-km-s and --speed-r-km-s and gives τ_N with --ring-opening-deg', async () => {
    // A curve whose disappearance sweeps at 0.436 × 6 km/s (a chord at 0.9 R, docs/method.md) and whose
    // reappearance at 6 km/s, timed with those speeds: each time within 3 sigma of the generator's.
    const times = evenTimes(0, CADENCE, 300);
    const clean = syntheticFlux(setup, {
      timesSeconds: times,
      ...truth,
      baselineFlux: 1000,
      bottomFlux: 80,
      dips: [dipTruth],
      edgeSpeedsKmPerS: { disappearance: 0.436 * 6, reappearance: 6 },
    });
    const gauss = gaussianSource(5);
    const csv =
      [
        'time,flux',
        ...times.map((t, i) => `${isoAt(t)},${((clean[i] ?? 0) + 30 * gauss()).toFixed(3)}`),
      ].join('\n') + '\n';
    const flags = [
      ...FLAGS,
      '--speed-d-km-s',
      String(0.436 * 6),
      '--ring-opening-deg',
      '30',
      '--ring-opening-sigma-deg',
      '0',
    ];
    expect(await run([writeCsv(csv), ...flags])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    expect(out.edgeSpeedsKmPerS).toEqual({ disappearance: 0.436 * 6, reappearance: 6 });
    if (out.disappearance === null || out.reappearance === null) throw new Error('event not found');
    expect(Math.abs(seconds(out.disappearance.time) - truth.disappearanceSeconds)).toBeLessThan(
      3 * out.disappearance.sigmaSeconds,
    );
    expect(Math.abs(seconds(out.reappearance.time) - truth.reappearanceSeconds)).toBeLessThan(
      3 * out.reappearance.sigmaSeconds,
    );
    // τ_N = τ·|sin B| (PDS4 Rings dictionary, normal_optical_depth): the truth −ln(0.5)·sin 30° = 0.3466.
    const dip = out.dips[0];
    if (dip === undefined) throw new Error('no dip');
    expect(Math.abs((dip.normalOpticalDepth ?? NaN) - 0.34657)).toBeLessThan(
      3 * (dip.normalOpticalDepthSigma ?? 0),
    );
  });

  it('run() reports a dip marked by hand with --dip even where the search finds none', async () => {
    const mark = `${isoAt(25.0)}/${isoAt(25.6)}`;
    expect(await run([writeCsv(mainCsv), ...FLAGS, '--dip', mark])).toBe(0);
    const out = JSON.parse(stdout) as TimingOutput;
    expect(out.dips).toHaveLength(2);
    const marked = out.dips[1];
    if (marked === undefined) throw new Error('no marked dip');
    expect(seconds(marked.start.time)).toBeGreaterThan(24);
    expect(marked.apparentOpacity).toBeLessThan(0.1);
    expect(marked.significance).toBeLessThan(6);
  });

  describe('bad input (exit 2, one stderr line per problem, nothing on stdout)', () => {
    async function expectBad(csv: string, line: string, flags = FLAGS): Promise<void> {
      const code = await run([writeCsv(csv), ...flags]);
      expect(code).toBe(2);
      expect(stdout).toBe('');
      expect(stderr.split('\n')).toContain(line);
    }
    const rows = mainCsv.trimEnd().split('\n');

    it('run() names row 1 for an empty file', async () => {
      await expectBad('', 'row 1: empty file; expected a header row with time and flux');
    });

    it('run() names the missing column in row 1', async () => {
      await expectBad(
        'time,brightness\n2031-05-20T03:14:00Z,1\n',
        'row 1, column flux: missing column "flux"',
      );
    });

    it('run() names the row and column of a flux that is not a number', async () => {
      const bad = [...rows];
      bad[3] = `${isoAt(0.3)},bright`;
      await expectBad(bad.join('\n'), 'row 4, column flux: not a number: "bright"');
    });

    it('run() names the later row when times do not increase', async () => {
      const bad = [...rows];
      bad[10] = `${isoAt(0.75)},1000`;
      await expectBad(bad.join('\n'), 'row 11, column time: time does not increase from the row before');
    });

    it('run() names the row of a time that is not ISO 8601 UTC', async () => {
      const bad = [...rows];
      bad[6] = `20/05/2031 03:14:00.5,1000`;
      await expectBad(
        bad.join('\n'),
        'row 7, column time: not an ISO 8601 UTC time (e.g. 2031-05-20T03:14:15.25Z)',
      );
    });

    it('run() names the row and the column a short row lacks', async () => {
      const bad = [...rows];
      bad[8] = isoAt(0.7);
      await expectBad(bad.join('\n'), 'row 9, column flux: the row has 1 fields, the header 2');
    });

    it('run() names row 1 for a file with a header and no data', async () => {
      await expectBad('time,flux\n', 'row 1: only 0 data rows; at least 8 are needed');
    });

    it('run() names the row of a fluxErr that is not positive', async () => {
      const withErr = lightCurveCsv({ withErr: true }).trimEnd().split('\n');
      withErr[5] = `${isoAt(0.4)},1000,0`;
      await expectBad(withErr.join('\n'), 'row 6, column fluxErr: must be a positive number, not "0"');
    });

    it('run() names a non-positive edge speed and an opening-angle sigma without the angle', async () => {
      await expectBad(mainCsv, '--speed-d-km-s: must be positive', [...FLAGS, '--speed-d-km-s', '0']);
      await expectBad(mainCsv, '--ring-opening-sigma-deg: needs --ring-opening-deg', [
        ...FLAGS,
        '--ring-opening-sigma-deg',
        '1',
      ]);
      await expectBad(mainCsv, '--ring-opening-deg: must be within ±90°', [
        ...FLAGS,
        '--ring-opening-deg',
        '95',
      ]);
    });

    it('run() names a missing required option and conflicting star diameters', async () => {
      await expectBad(mainCsv, '--speed-km-s: is required', ['--distance-km', '6e9', '--exposure-s', '0.08']);
      await expectBad(
        mainCsv,
        '--star-diameter-km: give either --star-diameter-km or --star-diameter-mas, not both',
        [...FLAGS, '--star-diameter-mas', '0.1'],
      );
      await expectBad(
        mainCsv,
        '--star-k-mag: the diameter from magnitudes needs both --star-v-mag and --star-k-mag',
        [...FLAGS, '--star-v-mag', '12'],
      );
    });
  });
});

describe('./tools/limbus time (built, as a process)', () => {
  it('runCli() prints the timing on stdout with exit 0, and exit 2 with nothing on stdout for a bad row', () => {
    const good = runCli(['time', writeCsv(mainCsv), ...FLAGS]);
    expect(good.code).toBe(0);
    expect((JSON.parse(good.stdout) as TimingOutput).format).toBe('limbus-timing/1');
    const bad = runCli(['time', writeCsv('time,flux\n2031-05-20T03:14:00Z,x\n'), ...FLAGS]);
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe('');
    expect(bad.stderr).toContain('row 2, column flux: not a number: "x"');
  });
});

describe('formatUtc()', () => {
  it('formatUtc() keeps microseconds across a minute boundary', () => {
    const origin = parseUtc('2031-05-20T03:14:59.9999996Z');
    if (typeof origin === 'string') throw new Error(origin);
    expect(formatUtc(origin, 0)).toBe('2031-05-20T03:15:00.000000Z');
    expect(formatUtc(origin, 1.25)).toBe('2031-05-20T03:15:01.250000Z');
  });
});
