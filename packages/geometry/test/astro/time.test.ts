import { describe, expect, it } from 'vitest';
import { julianDate, parseIsoCalendar } from '../../src/time/calendar.js';
import {
  isoToTtSeconds,
  taiMinusUtcSeconds,
  tdbToTtSeconds,
  ttMinusUtcSeconds,
  ttSecondsToUt1Seconds,
  ttSecondsToUtcIso,
  ttToTdbSeconds,
  utcIsoToTtSeconds,
} from '../../src/time/scales.js';
import { GeometryInputError } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

describe('time scales', () => {
  it('julianDate() gives Meeus Example 7.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 7.a: 1957 October 4.81 → JD 2436116.31.
    expectClose(
      julianDate({ year: 1957, month: 10, day: 4, secondsOfDay: 0.81 * 86_400 }),
      2_436_116.31,
      1e-9,
    );
  });

  it('isoToTtSeconds() puts J2000.0 (2000-01-01T12:00:00 TT, JD 2451545.0) at zero', () => {
    // IAU definition of J2000.0 (Explanatory Supplement to the Astronomical Almanac).
    expect(isoToTtSeconds('2000-01-01T12:00:00', 'TT')).toBe(0);
    expect(julianDate({ year: 2000, month: 1, day: 1, secondsOfDay: 43_200 })).toBe(2_451_545);
  });

  it('taiMinusUtcSeconds() is 37 s since 2017-01-01 and 36 s the day before', () => {
    // IERS Bulletin C: TAI − UTC = 37 s from 2017 January 1, 0h UTC until further notice.
    expect(taiMinusUtcSeconds(2017, 1, 1)).toBe(37);
    expect(taiMinusUtcSeconds(2028, 3, 14)).toBe(37);
    expect(taiMinusUtcSeconds(2016, 12, 31)).toBe(36);
    // IERS Bulletin C: the first integral offset, 10 s, from 1972 January 1.
    expect(taiMinusUtcSeconds(1972, 1, 1)).toBe(10);
    expect(() => taiMinusUtcSeconds(1971, 12, 31)).toThrow(RangeError);
  });

  it('utcIsoToTtSeconds() adds TAI − UTC and TT − TAI = 32.184 s', () => {
    // TT − TAI = 32.184 s (IAU 1991 Resolution A4); TAI − UTC = 37 s (IERS Bulletin C) → TT − UTC = 69.184 s.
    const utc = utcIsoToTtSeconds('2028-03-14T02:10:00Z');
    const tt = isoToTtSeconds('2028-03-14T02:10:00', 'TT');
    // A count of ~9e8 s resolves to ~1.2e-7 s, hence the 1e-6 s tolerances.
    expectClose(tt - utc, -69.184, 1e-6);
    expectClose(ttMinusUtcSeconds(utc), 69.184, 1e-12);
  });

  it('utcIsoToTtSeconds() counts the 2016-12-31 leap second as one real second', () => {
    // IERS Bulletin C 52: a positive leap second was inserted at the end of 2016 December 31.
    const before = utcIsoToTtSeconds('2016-12-31T23:59:59.500Z');
    const inside = utcIsoToTtSeconds('2016-12-31T23:59:60.500Z');
    const after = utcIsoToTtSeconds('2017-01-01T00:00:00.500Z');
    expectClose(inside - before, 1, 1e-6);
    expectClose(after - inside, 1, 1e-6);
    expect(ttSecondsToUtcIso(inside)).toBe('2016-12-31T23:59:60.500Z');
    expect(ttSecondsToUtcIso(after)).toBe('2017-01-01T00:00:00.500Z');
    expect(ttSecondsToUtcIso(before)).toBe('2016-12-31T23:59:59.500Z');
  });

  it('utcIsoToTtSeconds() rejects second 60 on an ordinary day and malformed text, naming the path', () => {
    expect(() => utcIsoToTtSeconds('2028-03-14T23:59:60Z', 'chords[0].start')).toThrow(
      'chords[0].start: second 60 on a day without a leap second',
    );
    expect(() => utcIsoToTtSeconds('2028-02-30T00:00:00Z', 'x')).toThrow(GeometryInputError);
    expect(() => utcIsoToTtSeconds('2028-03-14 02:10', 'x')).toThrow(/not an ISO 8601 time/);
    expect(parseIsoCalendar('2028-13-01T00:00:00Z')).toMatch(/month 13/);
  });

  it('ttSecondsToUtcIso() inverts utcIsoToTtSeconds() to the millisecond, including rounding up to midnight', () => {
    for (const text of ['2028-03-14T02:10:00.000Z', '2028-02-29T23:59:59.999Z', '1999-12-31T00:00:00.001Z']) {
      expect(ttSecondsToUtcIso(utcIsoToTtSeconds(text))).toBe(text);
    }
    expect(ttSecondsToUtcIso(utcIsoToTtSeconds('2028-03-14T23:59:59.9996Z'))).toBe(
      '2028-03-15T00:00:00.000Z',
    );
  });

  it('ttSecondsToUt1Seconds() applies UT1 = UTC + DUT1', () => {
    const tt = utcIsoToTtSeconds('2028-03-14T02:10:00Z');
    const utcAsCount = isoToTtSeconds('2028-03-14T02:10:00', 'TT');
    expectClose(ttSecondsToUt1Seconds(tt, 0.25) - utcAsCount, 0.25, 1e-6);
  });

  it('ttToTdbSeconds() stays within 1.7 ms of TT and tdbToTtSeconds() inverts it', () => {
    // TDB − TT amplitude 1.657 ms (Explanatory Supplement to the Astronomical Almanac; from memory).
    let largest = 0;
    for (let day = 0; day < 366; day += 3) {
      const tt = 8.8e8 + day * 86_400;
      const tdb = ttToTdbSeconds(tt);
      largest = Math.max(largest, Math.abs(tdb - tt));
      expectClose(tdbToTtSeconds(tdb), tt, 1e-8);
    }
    expect(largest).toBeGreaterThan(0.0016);
    expect(largest).toBeLessThan(0.0017);
  });
});
