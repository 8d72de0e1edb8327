// Speed of the prediction: `predictEvent` in-process for a 10-station and a 200-station event, and the
// whole `./tools/limbus predict` process on the same two events written as files. The event is the
// invented Brennock planning scenario (test/predict/fixtures.ts): a body at 38.6 au moving ≈ 6 km/s, one
// ring, TDB rows over 2 h, the default 10 s grid (721 path times × 5 lines), stations spread 10° of
// latitude across the path.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { predictEvent } from '../src/predict/predict-event.js';
import type { PredictionSettings } from '../src/predict/types.js';
import type { EventInput, StationInput } from '../src/types.js';
import { AU_KM, predictScenario } from '../test/predict/fixtures.js';

const here = dirname(fileURLToPath(import.meta.url));

const SETTINGS: PredictionSettings = {
  bodyRadiusKm: 410,
  uncertaintyMas: { raCosDec: 6, dec: 9 },
  offsetMas: { raCosDec: 0, dec: 0 },
  rings: [{ ring: 'R1', radiusKm: 3900 }],
  stepSeconds: 10,
};

function event(n: number): EventInput {
  const stations: StationInput[] = Array.from({ length: n }, (_, k) => ({
    id: `site-${String(k).padStart(3, '0')}`,
    latDeg: -28.45 + (10 * (k + 0.5)) / n,
    lonDeg: -68.2 - 0.5 * Math.sin(k),
    heightM: 500 + k,
  }));
  return predictScenario({
    title: `Brennock, ${n} stations`,
    star: {
      raDeg: 271.84,
      decDeg: -27.31,
      catalogEpochJyear: 2016,
      pmRaCosDecMasPerYear: 3.2,
      pmDecMasPerYear: -5.9,
      parallaxMas: 0.42,
    },
    centre: { latDeg: -23.45, lonDeg: -68.2 },
    centralUtc: '2029-06-21T03:20:00.000Z',
    distanceKm: 38.6 * AU_KM,
    velocityKmPerS: [-5.6, 1.3, 2.1],
    dut1Seconds: 0.12,
    timeScale: 'TDB',
    rowMinutes: [-60, -40, -20, 0, 20, 40, 60],
    stations,
  }).event;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
}

/** CPU time of this process (user + system), ms: on a shared machine it moves far less than wall time. */
function cpuMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/** Wall and CPU time of the first call, then medians of `runs` calls after two more warm-up calls. */
function timeMs(
  runs: number,
  f: () => unknown,
): { first: number; firstCpu: number; median: number; medianCpu: number } {
  const t0 = performance.now();
  const c0 = cpuMs();
  f();
  const first = performance.now() - t0;
  const firstCpu = cpuMs() - c0;
  for (let i = 0; i < 2; i++) f();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    const c = cpuMs();
    f();
    times.push(performance.now() - t);
    cpu.push(cpuMs() - c);
  }
  return { first, firstCpu, median: median(times), medianCpu: median(cpu) };
}

export default async function bench(): Promise<void> {
  const rows: Array<[string, string]> = [];
  const scratch = mkdtempSync(join(tmpdir(), 'limbus-predict-bench-'));
  const cli = resolve(here, '../../../tools/limbus');
  try {
    for (const n of [10, 200]) {
      const e = event(n);
      const t = timeMs(9, () => predictEvent(e, SETTINGS));
      rows.push([
        `${n} stations: predictEvent, first call in the process`,
        `${t.first.toFixed(0)} ms wall, ${t.firstCpu.toFixed(0)} ms CPU`,
      ]);
      rows.push([
        `${n} stations: predictEvent, warm (median of 9)`,
        `${t.median.toFixed(1)} ms wall, ${t.medianCpu.toFixed(1)} ms CPU`,
      ]);
      const file = join(scratch, `predict-${n}.json`);
      const { fit: _fit, ringEvents: _ringEvents, chords: _chords, ...rest } = e;
      writeFileSync(file, JSON.stringify({ ...rest, prediction: SETTINGS }));
      const processTimes: number[] = [];
      for (let i = 0; i < 5; i++) {
        const t0 = performance.now();
        execFileSync(cli, ['predict', file], { stdio: ['ignore', 'ignore', 'inherit'] });
        processTimes.push(performance.now() - t0);
      }
      rows.push([
        `${n} stations: ./tools/limbus predict, whole process`,
        `${median(processTimes).toFixed(0)} ms (median of 5)`,
      ]);
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
  for (const [label, value] of rows) console.log(`${label.padEnd(60)} ${value}`);
}
