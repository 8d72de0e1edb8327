import { describe, expect, it } from 'vitest';
import { parseChordCsv } from './chord-csv';

const stations = new Set(['north', 'south']);
const header =
  'station,type,disappearance_utc,disappearance_sigma_s,reappearance_utc,reappearance_sigma_s,start_utc,end_utc,time_offset_s';

describe('parseChordCsv()', () => {
  it('parseChordCsv() reads a positive and a negative row into event-file chords', () => {
    const csv = [
      header,
      'north,positive,2028-03-14T02:11:04.250Z,0.05,2028-03-14T02:11:20.000Z,0.06,,,0.1',
      'south,negative,,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,',
    ].join('\n');
    const result = parseChordCsv(csv, stations);
    expect(result).toEqual({
      ok: true,
      rows: [
        {
          row: 2,
          chord: {
            station: 'north',
            type: 'positive',
            disappearance: { time: '2028-03-14T02:11:04.250Z', sigmaSeconds: 0.05 },
            reappearance: { time: '2028-03-14T02:11:20.000Z', sigmaSeconds: 0.06 },
            timeOffsetSeconds: 0.1,
          },
        },
        {
          row: 3,
          chord: {
            station: 'south',
            type: 'negative',
            start: '2028-03-14T02:10:00Z',
            end: '2028-03-14T02:13:00Z',
            timeOffsetSeconds: 0,
          },
        },
      ],
    });
  });

  it('parseChordCsv() reads a positive row with one edge and names the row of one with neither', () => {
    const csv = [
      header,
      'north,positive,,,2028-03-14T02:11:20.000Z,0.06,,,',
      'south,positive,,,,,,,',
      'north,positive,2028-03-14T02:11:04Z,,,,,,',
    ].join('\n');
    const result = parseChordCsv(csv, stations);
    if (result.ok) throw new Error('expected problems');
    expect(result.problems.map((p) => `${p.path}: ${p.message}`)).toEqual([
      'row 3: a positive chord needs a disappearance, a reappearance or both',
      'row 4, column disappearance_sigma_s: missing; required for this chord type',
    ]);
    const one = parseChordCsv(
      [header, 'north,positive,,,2028-03-14T02:11:20.000Z,0.06,,,'].join('\n'),
      stations,
    );
    expect(one).toEqual({
      ok: true,
      rows: [
        {
          row: 2,
          chord: {
            station: 'north',
            type: 'positive',
            reappearance: { time: '2028-03-14T02:11:20.000Z', sigmaSeconds: 0.06 },
            timeOffsetSeconds: 0,
          },
        },
      ],
    });
  });

  it('parseChordCsv() accepts columns in any order and a header in any case', () => {
    const csv = 'TYPE,Station,start_utc,end_utc\nnegative,south,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z\n';
    const result = parseChordCsv(csv, stations);
    expect(result.ok).toBe(true);
  });

  it('parseChordCsv() names the row and column of every bad cell', () => {
    const csv = [
      header,
      'north,positive,2028-03-14T02:11:04Z,abc,2028-03-14T02:11:20Z,0.06,,,',
      'west,negative,,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,',
      'north,positive,2028-03-14T02:11:20Z,0.05,2028-03-14T02:11:04Z,0.05,,,',
      'south,grazing,,,,,,,',
      'south,negative,2028-03-14T02:11:04Z,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,',
    ].join('\n');
    const result = parseChordCsv(csv, stations);
    if (result.ok) throw new Error('expected problems');
    expect(result.problems.map((p) => [p.row, p.column])).toEqual([
      [2, 'disappearance_sigma_s'],
      [3, 'station'],
      [4, 'reappearance_utc'],
      [5, 'type'],
      [6, 'disappearance_utc'],
    ]);
  });

  it('parseChordCsv() rejects an unknown column and a missing one in the header row', () => {
    const result = parseChordCsv('station,kind\nnorth,positive\n', stations);
    if (result.ok) throw new Error('expected problems');
    expect(result.problems.map((p) => [p.row, p.column])).toEqual([
      [1, 'kind'],
      [1, 'type'],
    ]);
  });

  it('parseChordCsv() rejects a file with only a header', () => {
    const result = parseChordCsv(`${header}\n`, stations);
    expect(result.ok).toBe(false);
  });
});
