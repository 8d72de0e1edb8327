import { describe, expect, it } from 'vitest';
import { checkLightCurveCsv } from './light-curve-csv';

describe('checkLightCurveCsv()', () => {
  it('checkLightCurveCsv() accepts seconds or UTC times with an optional flux error', () => {
    expect(checkLightCurveCsv('time,flux\n0.00,1.01\n0.04,0.99\n0.08,0.12\n')).toEqual({
      ok: true,
      problems: [],
      rows: 3,
    });
    expect(
      checkLightCurveCsv(
        'time,flux,fluxErr\n2028-03-14T02:11:04.00Z,1.0,0.02\n2028-03-14T02:11:04.04Z,0.1,0.02\n',
      ).ok,
    ).toBe(true);
  });

  it('checkLightCurveCsv() names the row and column of a bad time, a bad flux and a time going back', () => {
    const result = checkLightCurveCsv('time,flux\n0.00,1.0\nsoon,1.0\n0.08,high\n0.04,1.0\n');
    expect(result.problems.map((p) => [p.row, p.column])).toEqual([
      [3, 'time'],
      [4, 'flux'],
      [5, 'time'],
    ]);
  });

  it('checkLightCurveCsv() rejects another header and a file that is not a light curve', () => {
    expect(checkLightCurveCsv('t,f\n0,1\n1,1\n').ok).toBe(false);
    expect(checkLightCurveCsv('\u0000\u0001PNG').ok).toBe(false);
  });
});
