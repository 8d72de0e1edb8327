// Speed of light-curve timing on a 50 000-point light curve with diffraction (0.3 µm band), a 0.8 km
// stellar disc and 20 ms exposures, containing the main event and one ring dip: the profile table, the
// full timing fit (fitTiming: detection, fit, χ² profiles, dip search and refits), the main fit alone,
// the dip search alone, and the whole `./tools/limbus time` process on the same data as a CSV file.
// Targets (issue 6): full timing fit ≤ 2 s, dip search ≤ 1 s.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';

import { buildEdgeProfile } from '../src/lightcurve/edge-profile.js';
import { fitMainEvent, fitTiming, searchDips, type TimingInput } from '../src/lightcurve/timing.js';
import { WellModel } from '../src/lightcurve/well-model.js';
import { gaussianSource } from '../test/lightcurve/synthetic.js';

const here = dirname(fileURLToPath(import.meta.url));
const POINTS = 50_000;
const CADENCE_S = 0.02;
const setup = { distanceKm: 6e9, wavelengthUm: 0.65, bandwidthUm: 0.3, starDiameterKm: 0.8 };
const SPEED = 20;
const EXPOSURE_S = 0.02;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] ?? NaN;
}

function timeIt<T>(runs: number, f: () => T): { ms: number; value: T } {
  const times: number[] = [];
  let value = f();
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    value = f();
    times.push(performance.now() - t0);
  }
  return { ms: median(times), value };
}

export default async function bench(): Promise<void> {
  const times = Array.from({ length: POINTS }, (_, i) => i * CADENCE_S);
  // The data are drawn from the fitter's own model here (speed, not accuracy, is measured; the accuracy
  // tests use the independent generator), plus white noise of 3 % of the star.
  const truthProfile = buildEdgeProfile(setup);
  const model = new WellModel(
    times,
    truthProfile,
    { disappearanceKmPerS: SPEED, reappearanceKmPerS: SPEED },
    EXPOSURE_S,
  );
  const gauss = gaussianSource(42);
  const flux = times.map(
    (t) =>
      50 +
      950 * model.intensityAt(t, 400.1234, 430.5678) -
      0.3 * 950 * (1 - model.intensityAt(t, 600.1, 601.2)) +
      30 * gauss(),
  );

  const build = timeIt(3, () => buildEdgeProfile(setup));
  const input: TimingInput = {
    timesSeconds: times,
    flux,
    speedKmPerS: SPEED,
    exposureSeconds: EXPOSURE_S,
    profile: build.value,
    bottom: 'free',
  };
  const full = timeIt(3, () => fitTiming({ ...input, profile: buildEdgeProfile(setup) }));
  const main = timeIt(3, () => fitMainEvent(input));
  const mainFit = main.value;
  if (mainFit === null) throw new Error('benchmark event not detected');
  const dips = timeIt(3, () => searchDips(mainFit));

  const r = full.value;
  console.log(
    `points                          ${POINTS} (cadence ${CADENCE_S * 1000} ms, exposure ${EXPOSURE_S * 1000} ms)`,
  );
  console.log(
    `profile table                   ${build.ms.toFixed(0)} ms (${build.value.values.length} nodes, ${build.value.bandSlices} band slices)`,
  );
  console.log(`full timing fit (incl. table)   ${full.ms.toFixed(0)} ms   target ≤ 2000 ms`);
  console.log(`main fit alone                  ${main.ms.toFixed(0)} ms`);
  console.log(
    `dip search alone                ${dips.ms.toFixed(0)} ms   target ≤ 1000 ms (${dips.value.length} dip found)`,
  );
  console.log(
    `result: D ${r.disappearance?.timeSeconds.toFixed(5)} ± ${r.disappearance?.sigmaSeconds.toFixed(5)} s (truth 400.12340), ` +
      `R ${r.reappearance?.timeSeconds.toFixed(5)} ± ${r.reappearance?.sigmaSeconds.toFixed(5)} s (truth 430.56780), ` +
      `dips ${r.dips.length}`,
  );

  // The whole command, as a user runs it, on the same light curve written as CSV.
  const repo = resolve(here, '../../..');
  const dir = mkdtempSync(join(tmpdir(), 'limbus-bench-'));
  const csv = join(dir, 'lightcurve.csv');
  const origin = Date.UTC(2031, 4, 20, 3, 0, 0);
  const lines = ['time,flux'];
  for (let i = 0; i < POINTS; i++) {
    lines.push(
      `${new Date(origin + Math.round((times[i] ?? 0) * 1000)).toISOString()},${(flux[i] ?? 0).toFixed(3)}`,
    );
  }
  writeFileSync(csv, lines.join('\n') + '\n');
  const cliTimes: number[] = [];
  for (let k = 0; k < 3; k++) {
    const t0 = performance.now();
    execFileSync(
      join(repo, 'tools/limbus'),
      [
        'time',
        csv,
        '--speed-km-s',
        String(SPEED),
        '--distance-km',
        '6e9',
        '--exposure-s',
        String(EXPOSURE_S),
        '--star-diameter-km',
        '0.8',
      ],
      { stdio: ['ignore', 'ignore', 'inherit'] },
    );
    cliTimes.push(performance.now() - t0);
  }
  console.log(`./tools/limbus time (process)   ${median(cliTimes).toFixed(0)} ms`);
}
