// Every fitted number of a solution with its 1-sigma error and unit, as CSV, JSON or a LaTeX table. The
// rows come straight from the stored solution; only the LaTeX table rounds (./number-format.ts).
import { LIMB_PARAMETERS, type FitOptions, type LimbParameter, type Solution } from '@limbus/geometry';
import { decimalsForSigma } from './number-format';
import { type Provenance, provenanceEntries } from './provenance';
import { printableText } from './svg-text';

export type ParameterStatus = 'fitted' | 'fixed' | 'derived';

export interface ParameterRow {
  /** "limb", "clock", "ring R1", "astrometry": what the parameter belongs to. */
  group: string;
  parameter: string;
  value: number;
  /** 1-sigma; null where the solution states none (χ², degrees of freedom, a correlation, old solutions). */
  sigma: number | null;
  unit: string;
  status: ParameterStatus;
}

const LIMB_UNIT: Record<LimbParameter, string> = {
  centerFKm: 'km',
  centerGKm: 'km',
  equatorialRadiusKm: 'km',
  oblateness: '',
  positionAngleDeg: 'deg',
};

export function parameterRows(solution: Solution, fit: FitOptions): ParameterRow[] {
  const rows: ParameterRow[] = [];
  const limb = solution.limb;
  if (limb !== null) {
    for (const p of LIMB_PARAMETERS) {
      const fixed = fit.limb.fixed[p] !== undefined;
      rows.push({
        group: 'limb',
        parameter: p,
        value: limb[p],
        sigma: fixed ? null : limb.uncertainty[p],
        unit: LIMB_UNIT[p],
        status: fixed ? 'fixed' : 'fitted',
      });
    }
    rows.push(
      {
        group: 'limb',
        parameter: 'equivalentRadiusKm',
        value: limb.equivalentRadiusKm,
        sigma: limb.uncertainty.equivalentRadiusKm,
        unit: 'km',
        status: 'derived',
      },
      { group: 'limb', parameter: 'chi2', value: limb.chi2, sigma: null, unit: '', status: 'derived' },
      { group: 'limb', parameter: 'dof', value: limb.dof, sigma: null, unit: '', status: 'derived' },
    );
    for (const t of limb.timeOffsets)
      rows.push({
        group: 'clock',
        parameter: `timeOffsetSeconds ${t.station}`,
        value: t.seconds,
        sigma: t.sigma,
        unit: 's',
        status: 'fitted',
      });
  }
  for (const ring of solution.rings) {
    const group = `ring ${ring.ring}`;
    const u = ring.uncertainty;
    // A centre taken from the limb carries the limb centre's 1-sigma (derived); a solution stored before
    // ring centre sigmas has none, and its limb-held centre stays "fixed".
    const from = ring.centerFrom ?? fit.ring.centerFrom;
    const centre: ParameterStatus =
      from !== 'limb' ? 'fitted' : u.centerFKm === undefined ? 'fixed' : 'derived';
    rows.push(
      {
        group,
        parameter: 'radiusKm',
        value: ring.radiusKm,
        sigma: ring.uncertainty.radiusKm,
        unit: 'km',
        status: 'fitted',
      },
      {
        group,
        parameter: 'openingAngleDeg',
        value: ring.openingAngleDeg,
        sigma: ring.uncertainty.openingAngleDeg,
        unit: 'deg',
        status: 'fitted',
      },
      {
        group,
        parameter: 'positionAngleDeg',
        value: ring.positionAngleDeg,
        sigma: ring.uncertainty.positionAngleDeg,
        unit: 'deg',
        status: 'fitted',
      },
      {
        group,
        parameter: 'centerFKm',
        value: ring.centerFKm,
        sigma: u.centerFKm ?? null,
        unit: 'km',
        status: centre,
      },
      {
        group,
        parameter: 'centerGKm',
        value: ring.centerGKm,
        sigma: u.centerGKm ?? null,
        unit: 'km',
        status: centre,
      },
    );
    ring.poles.forEach((pole, k) => {
      rows.push(
        {
          group,
          parameter: `pole${k + 1} raDeg`,
          value: pole.raDeg,
          sigma: pole.uncertainty?.raDeg ?? null,
          unit: 'deg',
          status: 'derived',
        },
        {
          group,
          parameter: `pole${k + 1} decDeg`,
          value: pole.decDeg,
          sigma: pole.uncertainty?.decDeg ?? null,
          unit: 'deg',
          status: 'derived',
        },
      );
      // The two 1-sigma are strongly correlated for a ring pole: a reader needs the correlation too.
      if (pole.uncertainty)
        rows.push({
          group,
          parameter: `pole${k + 1} raDecCorrelation`,
          value: pole.uncertainty.correlation,
          sigma: null,
          unit: '',
          status: 'derived',
        });
    });
    rows.push(
      { group, parameter: 'chi2', value: ring.chi2, sigma: null, unit: '', status: 'derived' },
      { group, parameter: 'dof', value: ring.dof, sigma: null, unit: '', status: 'derived' },
    );
  }
  const a = solution.astrometry;
  if (a !== null)
    rows.push(
      {
        group: `astrometry ${a.referenceTimeUtc}`,
        parameter: 'raOffsetCosDecMas',
        value: a.raOffsetCosDecMas,
        sigma: a.uncertainty.raOffsetCosDecMas,
        unit: 'mas',
        status: 'derived',
      },
      {
        group: `astrometry ${a.referenceTimeUtc}`,
        parameter: 'decOffsetMas',
        value: a.decOffsetMas,
        sigma: a.uncertainty.decOffsetMas,
        unit: 'mas',
        status: 'derived',
      },
    );
  return rows;
}

const PLAIN_NUMBER = /^-?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * A cell a spreadsheet would run as a formula (one starting with = + - @, tab or CR; OWASP, "CSV
 * Injection") gets a leading apostrophe. A plain number such as -12.5 is left alone: spreadsheets read
 * it as a number, and quoting it would turn every negative value into text.
 */
export function neutraliseCell(cell: string): string {
  if (PLAIN_NUMBER.test(cell)) return cell;
  return /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
}

/** RFC 4180 quoting: cells with a comma, quote or line break go in double quotes, quotes doubled. */
export function csvCell(cell: string): string {
  const safe = neutraliseCell(printableText(cell));
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function tableCsv(rows: ParameterRow[], provenance: Provenance): string {
  return tableCsvWith(rows, provenanceEntries(provenance));
}

/** The CSV table with any provenance given as ordered key/value pairs (e.g. a shape fit over several fits). */
export function tableCsvWith(rows: ParameterRow[], provenance: Array<[string, string]>): string {
  const lines = [['group', 'parameter', 'value', 'sigma', 'unit', 'status']];
  for (const r of rows)
    lines.push([
      r.group,
      r.parameter,
      String(r.value),
      r.sigma === null ? '' : String(r.sigma),
      r.unit,
      r.status,
    ]);
  for (const [k, v] of provenance) lines.push(['provenance', k, v, '', '', '']);
  return lines.map((l) => l.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

export function tableJson(rows: ParameterRow[], provenance: Provenance | Record<string, string>): string {
  return JSON.stringify({ format: 'limbus-table/1', provenance, parameters: rows }, null, 2) + '\n';
}

/** Escapes the ten LaTeX special characters (Lamport, "LaTeX", 2nd ed., section 2.2.1 lists them). */
export function texEscape(text: string): string {
  return printableText(text).replace(/[\\{}$&#^_%~]/g, (c) => {
    switch (c) {
      case '\\':
        return '\\textbackslash{}';
      case '^':
        return '\\textasciicircum{}';
      case '~':
        return '\\textasciitilde{}';
      default:
        return `\\${c}`;
    }
  });
}

const TEX_UNIT: Record<string, string> = { km: 'km', deg: '$^\\circ$', s: 's', mas: 'mas', '': '' };

export function texValue(r: ParameterRow): string {
  // Without an error there is no decimal place to round to; six significant digits keep what a paper needs.
  if (r.sigma === null || !(r.sigma > 0)) return `$${Number(r.value.toPrecision(6))}$`;
  const d = decimalsForSigma(r.sigma);
  return `$${r.value.toFixed(d)} \\pm ${r.sigma.toFixed(d)}$`;
}

export function tableTex(rows: ParameterRow[], provenance: Provenance): string {
  return tableTexWith(rows, provenanceEntries(provenance));
}

export function tableTexWith(rows: ParameterRow[], provenance: Array<[string, string]>): string {
  const out: string[] = [
    ...provenance.map(([k, v]) => `% ${k}: ${v}`),
    '\\begin{tabular}{lllll}',
    '\\hline',
    'Group & Parameter & Value & Unit & Status \\\\',
    '\\hline',
  ];
  for (const r of rows)
    out.push(
      `${texEscape(r.group)} & ${texEscape(r.parameter)} & ${texValue(r)} & ${TEX_UNIT[r.unit] ?? texEscape(r.unit)} & ${r.status} \\\\`,
    );
  out.push('\\hline', '\\end{tabular}');
  return out.join('\n') + '\n';
}
