// A shape fit as a paper table (CSV, JSON or LaTeX), with the same cell rules as a fit's table export and
// a provenance that names every fit it was made from, the pole and rotation it assumed, and the engine.
// Step in the data flow: computed shape view (nothing stored) -> table text for download.
import { ENGINE_VERSION } from '@limbus/geometry';
import type { FitRun } from '../fits/entities/fit-run.entity';
import {
  type ParameterRow,
  tableCsvWith,
  tableJson,
  tableTexWith,
  type ParameterStatus,
} from '../exports/table';
import type { TableQuery } from '../exports/export-query';
import type { ShapeView } from './shapes.service';

export function shapeRows(view: ShapeView): ParameterRow[] {
  const r = view.result;
  const axisStatus: ParameterStatus = 'fitted';
  const rows: ParameterRow[] = [
    {
      group: 'shape',
      parameter: 'aKm',
      value: r.semiAxesKm.aKm,
      sigma: r.uncertainty.aKm,
      unit: 'km',
      status: axisStatus,
    },
    {
      group: 'shape',
      parameter: 'bKm',
      value: r.semiAxesKm.bKm,
      sigma: r.uncertainty.bKm,
      unit: 'km',
      // A spheroid has b = a by construction.
      status: r.model === 'spheroid' ? 'derived' : axisStatus,
    },
    {
      group: 'shape',
      parameter: 'cKm',
      value: r.semiAxesKm.cKm,
      sigma: r.uncertainty.cKm,
      unit: 'km',
      status: axisStatus,
    },
    {
      group: 'rotation',
      parameter: 'periodHours',
      value: r.periodHours,
      sigma: r.uncertainty.periodHours,
      unit: 'h',
      status: r.uncertainty.periodHours > 0 ? 'fitted' : 'fixed',
    },
  ];
  if (r.phaseDeg !== null)
    rows.push({
      group: 'rotation',
      parameter: 'phaseDeg',
      value: r.phaseDeg,
      sigma: r.uncertainty.phaseDeg,
      unit: 'deg',
      status: r.phaseFitted ? 'fitted' : 'fixed',
    });
  rows.push(
    { group: 'fit', parameter: 'chi2', value: r.chi2, sigma: null, unit: '', status: 'derived' },
    { group: 'fit', parameter: 'dof', value: r.dof, sigma: null, unit: '', status: 'derived' },
  );
  r.events.forEach((e, k) => {
    const group = `event ${view.fits[k]?.eventTitle ?? e.id}`;
    rows.push(
      { group, parameter: 'rmsRadialKm', value: e.rmsRadialKm, sigma: null, unit: 'km', status: 'derived' },
      { group, parameter: 'chi2', value: e.chi2, sigma: null, unit: '', status: 'derived' },
    );
  });
  if (r.equilibrium !== null)
    rows.push({
      group: `equilibrium (${r.equilibrium.sequence})`,
      parameter: 'densityKgM3',
      value: r.equilibrium.densityKgM3,
      sigma: r.equilibrium.densityKgM3Sigma,
      unit: 'kg/m3',
      status: 'derived',
    });
  return rows;
}

/** Ordered key/value provenance: which fits (in the view's order), what was assumed, which engine. */
export function shapeProvenance(view: ShapeView, runs: Map<string, FitRun>): Array<[string, string]> {
  const ids = view.fits.map((f) => f.fitId);
  const of = (pick: (run: FitRun) => string) =>
    ids.map((id) => (runs.has(id) ? pick(runs.get(id) as FitRun) : '')).join(' ');
  return [
    ['fitIds', ids.join(' ')],
    ['inputSha256', of((run) => run.inputSha256)],
    ['approvalState', of((run) => run.reviewState)],
    ['engineVersion', ENGINE_VERSION],
    ['model', view.result.model],
    ['pole', `RA ${view.pole.raDeg} deg, Dec ${view.pole.decDeg} deg (${view.pole.source})`],
    [
      'cautions',
      [...view.cautions, ...(view.result.equilibrium ? [view.result.equilibrium.caution] : [])].join(' '),
    ],
  ];
}

export function shapeTable(view: ShapeView, runs: Map<string, FitRun>, format: TableQuery['format']): string {
  const rows = shapeRows(view);
  const provenance = shapeProvenance(view, runs);
  if (format === 'csv') return tableCsvWith(rows, provenance);
  if (format === 'json') return tableJson(rows, Object.fromEntries(provenance));
  return tableTexWith(rows, provenance);
}
