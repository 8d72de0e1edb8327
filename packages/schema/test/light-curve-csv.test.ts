import { describe, expect, it } from 'vitest';
import { formatUtc, parseLightCurveCsv, parseUtc } from '../src/light-curve-csv.js';

const rows = (n: number) =>
  Array.from({ length: n }, (_, k) => `2028-03-14T02:13:${String(40 + k).padStart(2, '0')}.5Z,1.0`);

describe('light-curve CSV', () => {
  it('parseLightCurveCsv() reads seconds after the first row, keeping sub-millisecond digits', () => {
    const text = [
      'time,flux,fluxErr',
      '2028-03-14T02:13:40.000100Z,1,0.02',
      ...rows(8).map((r) => `${r},0.02`),
    ].join('\n');
    const parsed = parseLightCurveCsv(text);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.problems));
    // 02:13:40.5 − 02:13:40.0001 = 0.4999 s: plain clock arithmetic.
    expect(Math.abs((parsed.curve.timesSeconds[1] ?? 0) - 0.4999)).toBeLessThan(1e-9);
    expect(parsed.curve.fluxErr).toHaveLength(9);
  });

  it('parseLightCurveCsv() names the row and column of each problem', () => {
    const text = ['time,flux', ...rows(8), '2028-03-14T02:13:40Z,x', 'yesterday,1'].join('\n');
    const parsed = parseLightCurveCsv(text);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(parsed.problems.map((i) => i.path)).toEqual([
      'row 10, column time',
      'row 10, column flux',
      'row 11, column time',
    ]);
  });

  it('parseLightCurveCsv() refuses a file without the time column or with too few rows', () => {
    const noTime = parseLightCurveCsv('t,flux\n1,2\n');
    expect(noTime.ok ? [] : noTime.problems.map((i) => i.path)).toEqual(['row 1, column time']);
    const short = parseLightCurveCsv(['time,flux', ...rows(3)].join('\n'));
    expect(short.ok ? '' : short.problems[0]?.message).toBe('only 3 data rows; at least 8 are needed');
  });

  it('formatUtc() carries a fraction past the second and keeps six decimals', () => {
    const origin = parseUtc('2028-03-14T23:59:59.9999996Z');
    if (typeof origin === 'string') throw new Error(origin);
    expect(formatUtc(origin, 0)).toBe('2028-03-15T00:00:00.000000Z');
    expect(formatUtc(origin, 0.25)).toBe('2028-03-15T00:00:00.250000Z');
    expect(parseUtc('2028-02-30T00:00:00Z')).toBe('day out of range');
  });
});
