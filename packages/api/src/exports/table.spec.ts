import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { exampleEvent, exampleProvenance, exampleSolution } from '../../e2e/exports/example-fixture';
import { captionDraft } from './caption';
import { decimalsForSigma, formatValueSigma } from './number-format';
import { neutraliseCell, parameterRows, tableCsv, tableJson, tableTex, texEscape } from './table';

function rows() {
  return parameterRows(exampleSolution(), exampleEvent().fit);
}

describe('parameterRows', () => {
  it('parameterRows() states every limb, ring and astrometry number of the solution with its 1-sigma', () => {
    const s = exampleSolution();
    const byKey = new Map(rows().map((r) => [`${r.group}/${r.parameter}`, r]));
    const limb = s.limb;
    const ring = s.rings[0];
    const astrometry = s.astrometry;
    if (limb === null || ring === undefined || astrometry === null)
      throw new Error('example lost its limb or ring');
    expect(byKey.get('limb/equatorialRadiusKm')).toMatchObject({
      value: limb.equatorialRadiusKm,
      sigma: limb.uncertainty.equatorialRadiusKm,
      unit: 'km',
      status: 'fitted',
    });
    expect(byKey.get('limb/positionAngleDeg')).toMatchObject({ value: limb.positionAngleDeg, unit: 'deg' });
    expect(byKey.get(`ring ${ring.ring}/openingAngleDeg`)).toMatchObject({
      value: ring.openingAngleDeg,
      sigma: ring.uncertainty.openingAngleDeg,
    });
    expect(byKey.get(`ring ${ring.ring}/pole2 decDeg`)?.value).toBe(ring.poles[1].decDeg);
    expect(byKey.get(`astrometry ${astrometry.referenceTimeUtc}/decOffsetMas`)).toMatchObject({
      value: astrometry.decOffsetMas,
      sigma: astrometry.uncertainty.decOffsetMas,
      unit: 'mas',
    });
  });

  it('parameterRows() marks a parameter the fit held fixed, with no error', () => {
    const fit = structuredClone(exampleEvent().fit);
    fit.limb.fixed.oblateness = 0;
    const row = parameterRows(exampleSolution(), fit).find((r) => r.parameter === 'oblateness');
    expect(row).toMatchObject({ status: 'fixed', sigma: null });
  });
});

describe('parameterRows() ring centres and poles', () => {
  it('parameterRows() gives a limb-held ring centre the limb centre 1-sigma, and each pole its 1-sigma and correlation', () => {
    const s = exampleSolution();
    const ring = s.rings[0];
    if (ring === undefined || s.limb === null) throw new Error('example lost its limb or ring');
    const byKey = new Map(rows().map((r) => [`${r.group}/${r.parameter}`, r]));
    // The example event takes its ring centre from the limb (docs/examples/event-example.json).
    expect(byKey.get(`ring ${ring.ring}/centerFKm`)).toMatchObject({
      value: s.limb.centerFKm,
      sigma: s.limb.uncertainty.centerFKm,
      status: 'derived',
    });
    const pole = ring.poles[0];
    expect(byKey.get(`ring ${ring.ring}/pole1 raDeg`)).toMatchObject({ sigma: pole.uncertainty?.raDeg });
    expect(byKey.get(`ring ${ring.ring}/pole1 decDeg`)).toMatchObject({ sigma: pole.uncertainty?.decDeg });
    expect(byKey.get(`ring ${ring.ring}/pole1 raDecCorrelation`)?.value).toBe(pole.uncertainty?.correlation);
  });

  it('parameterRows() of a solution stored before ring centre and pole sigmas keeps them null', () => {
    const s = structuredClone(exampleSolution());
    for (const ring of s.rings) {
      delete ring.uncertainty.centerFKm;
      delete ring.uncertainty.centerGKm;
      delete ring.centerFrom;
      for (const pole of ring.poles) delete pole.uncertainty;
    }
    const got = parameterRows(s, exampleEvent().fit).filter((r) => r.group.startsWith('ring '));
    expect(got.find((r) => r.parameter === 'centerFKm')).toMatchObject({ sigma: null, status: 'fixed' });
    expect(got.find((r) => r.parameter === 'pole1 raDeg')?.sigma).toBeNull();
    expect(got.some((r) => r.parameter.endsWith('raDecCorrelation'))).toBe(false);
  });
});

describe('tableCsv', () => {
  it('tableCsv() carries every number exactly as stored, then the provenance', () => {
    const csv = tableCsv(rows(), exampleProvenance);
    const parsed = Papa.parse<string[]>(csv.trim(), { newline: '\r\n' });
    expect(parsed.errors).toEqual([]);
    const [header, ...body] = parsed.data;
    expect(header).toEqual(['group', 'parameter', 'value', 'sigma', 'unit', 'status']);
    const numeric = body.filter((r) => r[0] !== 'provenance');
    expect(numeric.map((r) => Number(r[2]))).toEqual(rows().map((r) => r.value));
    expect(numeric.map((r) => (r[3] === '' ? null : Number(r[3])))).toEqual(rows().map((r) => r.sigma));
    const prov = Object.fromEntries(body.filter((r) => r[0] === 'provenance').map((r) => [r[1], r[2]]));
    expect(prov).toEqual({ ...exampleProvenance, seed: '1' });
  });

  it('tableCsv() neutralises a station name that a spreadsheet would run as a formula', () => {
    const evil = rows().map((r) => ({ ...r, group: '=HYPERLINK("http://x","y")' }));
    const csv = tableCsv(evil, exampleProvenance);
    expect(csv).toContain(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(
      csv
        .split('\r\n')
        .slice(1)
        .some((l) => l.startsWith('=')),
    ).toBe(false);
  });
});

describe('neutraliseCell', () => {
  it('neutraliseCell() quotes = + - @ tab and CR openings but leaves plain numbers', () => {
    expect(['=1+1', '+1+1', '-1+1', '@SUM(A1)', '\t=1', '\r=1', 'A=1'].map(neutraliseCell)).toEqual([
      "'=1+1",
      "'+1+1",
      "'-1+1",
      "'@SUM(A1)",
      "'\t=1",
      "'\r=1",
      'A=1',
    ]);
    expect(['-12.5', '3e-7', '-0.25E+3', '42'].map(neutraliseCell)).toEqual([
      '-12.5',
      '3e-7',
      '-0.25E+3',
      '42',
    ]);
  });
});

describe('tableJson', () => {
  it('tableJson() round-trips the rows and the provenance', () => {
    const doc = JSON.parse(tableJson(rows(), exampleProvenance)) as unknown;
    expect(doc).toEqual({ format: 'limbus-table/1', provenance: exampleProvenance, parameters: rows() });
  });
});

describe('tableTex', () => {
  it('tableTex() writes value ± error rounded to the error, with units and provenance comments', () => {
    const tex = tableTex(rows(), exampleProvenance);
    const limb = exampleSolution().limb;
    if (limb === null) throw new Error('example lost its limb');
    const d = decimalsForSigma(limb.uncertainty.equatorialRadiusKm);
    expect(tex).toContain(
      `limb & equatorialRadiusKm & $${limb.equatorialRadiusKm.toFixed(d)} \\pm ${limb.uncertainty.equatorialRadiusKm.toFixed(d)}$ & km & fitted \\\\`,
    );
    expect(tex).toContain(`% fitId: ${exampleProvenance.fitId}`);
    expect(tex).toContain('\\begin{tabular}');
    expect(tex.trimEnd().endsWith('\\end{tabular}')).toBe(true);
  });

  it('texEscape() escapes the LaTeX special characters', () => {
    expect(texEscape('a_b & 50% #1 $x$ {y} ~ ^ \\')).toBe(
      'a\\_b \\& 50\\% \\#1 \\$x\\$ \\{y\\} \\textasciitilde{} \\textasciicircum{} \\textbackslash{}',
    );
  });
});

describe('formatValueSigma', () => {
  it('formatValueSigma() rounds the error to two significant digits and the value to match', () => {
    expect(formatValueSigma(1080.04, 2.3)).toBe('1080.0 ± 2.3');
    expect(formatValueSigma(0.12, 0.00096)).toBe('0.12000 ± 0.00096');
    expect(formatValueSigma(1080.4, 12.3)).toBe('1080 ± 12');
    expect(formatValueSigma(389.2961, 0.1834)).toBe('389.30 ± 0.18');
  });
});

describe('captionDraft', () => {
  it('captionDraft() lists what was fitted and what was held fixed', () => {
    const fit = structuredClone(exampleEvent().fit);
    fit.limb.fixed.oblateness = 0;
    const caption = captionDraft('the example event', exampleSolution(), fit);
    expect(caption).toContain('held fixed: oblateness = 0');
    expect(caption).toMatch(
      /Limb ellipse fitted for centre f, centre g, equatorial radius, position angle \(/,
    );
    expect(caption).toContain(`Ring ${exampleSolution().rings[0]?.ring}`);
    expect(captionDraft('x', exampleSolution(), exampleEvent().fit)).toContain('nothing held fixed');
  });
});
