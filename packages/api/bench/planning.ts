// In-process cost of planning an event, the work behind the planning routes once the event's rows are read:
// the prediction (as `limbus predict` computes it), the map description, the briefing of every station, a
// placement of 3 sites with the rings, and the map as SVG and PNG. Quillon's demo event with its own 10
// stations and with 200 stations spread over ±1500 km of the path. Run from packages/api with
//   pnpm --filter @limbus/geometry exec tsx --tsconfig ../api/tsconfig.json ../api/bench/planning.ts
// (tsx from the geometry package; the API's tsconfig for its decorators).
// docs/performance.md ("Planning") records a run.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { predictEvent, type EventInput, type PredictionSettings } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import { renderPng } from '../src/exports/raster';
import { briefingStations } from '../src/planning/briefing';
import { mapMeta } from '../src/planning/map-exports.service';
import { renderPathMapSvg } from '../src/planning/map-svg';
import { placementOf } from '../src/planning/placement';
import type { PlanningSnapshot } from '../src/planning/prediction-cache';
import { predictionMapOf } from '../src/planning/prediction-map';

const RUNS = 5;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
}

function timed<T>(what: () => T): { ms: number; value: T } {
  const start = performance.now();
  const value = what();
  return { ms: performance.now() - start, value };
}

function snapshotOf(file: EventInput, settings: PredictionSettings): PlanningSnapshot {
  const prediction = predictEvent(file, settings);
  return {
    eventId: 'bench',
    teamId: 'bench',
    title: file.title,
    bodyName: 'Quillon',
    eventTimeUtc: '2029-09-07T21:42:00Z',
    offsetSource: null,
    stations: file.stations.map((s, i) => ({
      id: `s${i}`,
      code: s.id,
      status: 'observing',
      observerId: null,
      observerName: null,
      latDeg: s.latDeg,
      lonDeg: s.lonDeg,
      heightM: s.heightM,
    })),
    file,
    settings,
    prediction,
  };
}

const validation = validateEventFile(
  JSON.parse(readFileSync(path.resolve(__dirname, '../src/demo/quillon-event.json'), 'utf8')),
);
if (!validation.ok || !validation.prediction) throw new Error('the demo event file does not validate');
const settings = validation.prediction;
const demo = validation.event;
// 200 stations on a line across the path near the demo's, 15 km apart (±1500 km), all at night.
const wide: EventInput = {
  ...demo,
  stations: Array.from({ length: 200 }, (_, i) => ({
    id: `site-${i}`,
    latDeg: 9 - 13.5 + (27 * i) / 199,
    lonDeg: 70.8 + 2 * Math.sin(i),
    heightM: 100,
  })),
};

for (const [label, file] of [
  ['10 stations', demo],
  ['200 stations', wide],
] as const) {
  const rows: Record<string, number[]> = {};
  const add = (key: string, ms: number) => (rows[key] ??= []).push(ms);
  for (let run = 0; run <= RUNS; run++) {
    const predicted = timed(() => snapshotOf(file, settings));
    const snapshot = predicted.value;
    const map = timed(() => predictionMapOf(snapshot));
    const briefing = timed(() => briefingStations(snapshot));
    const placement = timed(() => placementOf(snapshot, { sites: 3, ringsToo: true }));
    const svg = timed(() =>
      renderPathMapSvg({
        map: map.value,
        stepSeconds: settings.stepSeconds,
        widthMm: 180,
        embedFont: false,
        sizeUnit: 'mm',
        meta: mapMeta(snapshot),
      }),
    );
    const png = timed(() => renderPng(svg.value.svg, 180, 300, mapMeta(snapshot)));
    if (run === 0) continue; // the first run warms the JIT and reads Natural Earth
    add('prediction', predicted.ms);
    add('map description', map.ms);
    add('briefing (all stations)', briefing.ms);
    add('placement, 3 sites with rings', placement.ms);
    add('map SVG 180 mm', svg.ms);
    add('map PNG 180 mm 300 dpi', png.ms);
  }
  for (const [key, values] of Object.entries(rows))
    console.log(
      `${label}\t${key}\tmedian ${median(values).toFixed(0)} ms\tmax ${Math.max(...values).toFixed(0)} ms`,
    );
}
