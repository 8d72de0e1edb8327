import { describe, expect, it } from 'vitest';
import { checkLightCurveCsv } from './light-curve-csv';

const rows = (n: number, flux = '1.0') =>
  Array.from(
    { length: n },
    (_, k) => `${new Date(Date.UTC(2028, 2, 14, 2, 11, 4) + 40 * k).toISOString()},${flux}`,
  );

describe('checkLightCurveCsv()', () => {
  it('checkLightCurveCsv() accepts UTC mid-exposure times with an optional flux error', () => {
    expect(checkLightCurveCsv(['time,flux', ...rows(8)].join('\n'))).toEqual({
      ok: true,
      problems: [],
      rows: 8,
    });
    const withErrors = ['time,flux,fluxErr', ...rows(8).map((r) => `${r},0.02`)].join('\n');
    expect(checkLightCurveCsv(withErrors).ok).toBe(true);
  });

  it('checkLightCurveCsv() names the row and column of a bad time, a bad flux and a time going back', () => {
    const lines = ['time,flux', ...rows(10)];
    lines[2] = 'soon,1.0';
    lines[3] = lines[3]!.replace(/,1\.0$/, ',high');
    lines[5] = lines[1]!;
    const result = checkLightCurveCsv(lines.join('\n'));
    expect(result.problems.map((p) => [p.row, p.column])).toEqual([
      [3, 'time'],
      [4, 'flux'],
      [6, 'time'],
    ]);
  });

  it('checkLightCurveCsv() refuses seconds on the time axis, another header and a file that is not a light curve', () => {
    // The timing job needs UTC instants; a file it could not use is refused at upload, not later.
    const seconds = ['time,flux', ...Array.from({ length: 8 }, (_, k) => `${0.04 * k},1.0`)].join('\n');
    expect(checkLightCurveCsv(seconds).problems[0]).toEqual(
      expect.objectContaining({ row: 2, column: 'time' }),
    );
    expect(checkLightCurveCsv('t,f\n0,1\n1,1\n').ok).toBe(false);
    expect(checkLightCurveCsv('\u0000\u0001PNG').ok).toBe(false);
  });
});
