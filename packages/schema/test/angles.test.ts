import { describe, expect, it } from 'vitest';

import { parseDeclination, parseRightAscension, type AngleParse } from '../src/angles.js';

function degreesOf(parsed: AngleParse): number {
  if (!parsed.ok) throw new Error(`expected an angle, got: ${parsed.message}`);
  return parsed.deg;
}

// Meeus, Astronomical Algorithms, 2nd ed., Example 13.a (Pollux): α = 7h45m18.946s = 116.328942°,
// δ = +28°01′34.26″ = +28.026183° (from memory; the decimal values are the book's, to 1e-6°).
const POLLUX_RA_DEG = 116.328942;
const POLLUX_DEC_DEG = 28.026183;

describe('parseRightAscension()', () => {
  it.each(['7h45m18.946s', '07h 45m 18.946s', '7:45:18.946', '07 45 18.946'])(
    'parseRightAscension() reads %s as Pollux in Meeus Example 13.a',
    (text) => {
      expect(degreesOf(parseRightAscension(text))).toBeCloseTo(POLLUX_RA_DEG, 6);
    },
  );

  it('parseRightAscension() takes one plain number as degrees and a number with h as hours', () => {
    expect(degreesOf(parseRightAscension('116.328942'))).toBe(116.328942);
    expect(degreesOf(parseRightAscension('116.328942°'))).toBe(116.328942);
    // 6 h is a quarter turn: 90° exactly.
    expect(degreesOf(parseRightAscension('6h'))).toBe(90);
    expect(degreesOf(parseRightAscension('6h30m'))).toBe(97.5);
  });

  it('parseRightAscension() refuses out-of-range parts, signs and words, saying why', () => {
    expect(parseRightAscension('24:00:00')).toEqual({ ok: false, message: 'hours must be below 24' });
    expect(parseRightAscension('7:60:00')).toEqual({ ok: false, message: 'minutes must be below 60' });
    expect(parseRightAscension('7:45:60')).toEqual({ ok: false, message: 'seconds must be below 60' });
    expect(parseRightAscension('360')).toMatchObject({ ok: false });
    expect(parseRightAscension('-7:45:18')).toEqual({ ok: false, message: 'right ascension has no sign' });
    expect(parseRightAscension('7.5:45:18')).toEqual({
      ok: false,
      message: 'only the last part may have decimals',
    });
    expect(parseRightAscension('Pollux')).toMatchObject({ ok: false });
    expect(parseRightAscension('  ')).toEqual({ ok: false, message: 'enter the right ascension' });
  });
});

describe('parseDeclination()', () => {
  it.each(['+28°01′34.26″', '28d01m34.26s', '+28 01\' 34.26"', '28:01:34.26'])(
    'parseDeclination() reads %s as Pollux in Meeus Example 13.a',
    (text) => {
      expect(degreesOf(parseDeclination(text))).toBeCloseTo(POLLUX_DEC_DEG, 6);
    },
  );

  it('parseDeclination() applies the sign to the whole angle, also below one degree', () => {
    // Half a degree south: the "-" belongs to the angle, not to the zero degrees.
    expect(degreesOf(parseDeclination('-00 30 00'))).toBe(-0.5);
    expect(degreesOf(parseDeclination('−00°30′'))).toBe(-0.5);
    expect(degreesOf(parseDeclination('-28:01:34.26'))).toBeCloseTo(-POLLUX_DEC_DEG, 6);
    expect(degreesOf(parseDeclination('-8.2016'))).toBe(-8.2016);
  });

  it('parseDeclination() refuses a declination beyond ±90° and malformed parts', () => {
    expect(parseDeclination('90:00:01')).toEqual({ ok: false, message: 'declination must be within ±90°' });
    expect(parseDeclination('-91')).toEqual({ ok: false, message: 'declination must be within ±90°' });
    expect(parseDeclination('10:75:00')).toEqual({ ok: false, message: 'minutes must be below 60' });
    expect(parseDeclination('north')).toMatchObject({ ok: false });
  });
});
