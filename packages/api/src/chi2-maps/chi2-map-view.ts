// Step in the data flow: stored map row -> the API's answer (Chi2MapSummary, Chi2MapView of
// @limbus/schema/chi2-map), and the CSV and JSON downloads of its grid.
import type { Chi2Map } from '@limbus/geometry';
import { type Chi2MapSummary, type Chi2MapView, chi2BandOf } from '@limbus/schema';
import { csvCell } from '../exports/table';
import type { Chi2MapRun } from './entities/chi2-map-run.entity';

export function chi2MapSummary(row: Chi2MapRun): Chi2MapSummary {
  return {
    id: row.id,
    fitId: row.fit.id,
    state: row.state,
    progress: row.progress,
    request: row.request,
    error: row.error,
    createdBy: row.createdBy ? { id: row.createdBy.id, name: row.createdBy.name } : null,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

export function chi2MapView(row: Chi2MapRun): Chi2MapView {
  return { ...chi2MapSummary(row), result: row.result };
}

/** Words for a Δχ² band: the region of two-parameter confidence a cell falls in. */
function regionOf(map: Chi2Map, chi2: number | null): string {
  if (chi2 === null) return 'empty';
  const band = chi2BandOf(chi2 - map.minChi2, map.levels);
  const level = map.levels[band];
  return level ? `within ${level.sigma}σ` : 'beyond';
}

/** What a map says about itself in a download, after the fit's own provenance. */
export function mapEntries(mapId: string, map: Chi2Map): Array<[string, string]> {
  return [
    ['mapId', mapId],
    ['chi2Of', map.ring === null ? map.chi2Of : `${map.chi2Of} ${map.ring}`],
    ['profiled', map.profiled.join(' ')],
    ['bestChi2', String(map.bestChi2)],
    ['minChi2', String(map.minChi2)],
    ['dof', String(map.dof)],
    ['levels', map.levels.map((l) => `${l.sigma}σ Δχ²=${l.deltaChi2}`).join('; ')],
  ];
}

/**
 * One row per grid point: x, y (solution units, named with their unit in the header), χ², Δχ² and the
 * region; empty χ² where no fit clear of the negative chords exists. Then the provenance rows. RFC 4180,
 * CRLF, cells a spreadsheet would run neutralised as in the fit's table.
 */
export function chi2MapCsv(map: Chi2Map, provenance: Array<[string, string]>): string {
  const label = (a: Chi2Map['x']) => (a.unit === '' ? a.parameter : `${a.parameter} [${a.unit}]`);
  const lines: string[][] = [[label(map.x), label(map.y), 'chi2', 'deltaChi2', 'region']];
  map.y.values.forEach((y, j) =>
    map.x.values.forEach((x, i) => {
      const c = map.chi2[j]?.[i] ?? null;
      lines.push([
        String(x),
        String(y),
        c === null ? '' : String(c),
        c === null ? '' : String(c - map.minChi2),
        regionOf(map, c),
      ]);
    }),
  );
  for (const [k, v] of provenance) lines.push(['provenance', k, v, '', '']);
  return lines.map((l) => l.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** The JSON download: the map as stored with its provenance. */
export function chi2MapJson(map: Chi2Map, provenance: Array<[string, string]>): string {
  return (
    JSON.stringify(
      { format: 'limbus-chi2-map/1', provenance: Object.fromEntries(provenance), map },
      null,
      2,
    ) + '\n'
  );
}
