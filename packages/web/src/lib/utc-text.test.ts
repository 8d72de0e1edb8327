import { describe, expect, it } from 'vitest';
import { parseUtcInput, utcText } from './utc-text';

describe('utcText', () => {
  it('utcText() writes a server time in UTC to the second, whatever offset it came with', () => {
    expect(utcText('2029-09-07T21:38:00.000Z')).toBe('2029-09-07 21:38:00 UTC');
    expect(utcText('2029-09-07T23:38:05+02:00')).toBe('2029-09-07 21:38:05 UTC');
  });

  it('utcText() leaves text that is not a time as it is', () => {
    expect(utcText('not a time')).toBe('not a time');
  });
});

describe('utcText to the minute', () => {
  it("utcText(iso, 'minutes') drops the seconds, as the events list writes dates", () => {
    expect(utcText('2029-09-07T21:38:59Z', 'minutes')).toBe('2029-09-07 21:38 UTC');
  });
});

describe('parseUtcInput', () => {
  it('parseUtcInput() reads a UTC time with a space or T, with or without seconds, Z or "UTC"', () => {
    expect(parseUtcInput('2028-03-14 02:11')).toEqual({ ok: true, iso: '2028-03-14T02:11:00Z' });
    expect(parseUtcInput(' 2028-03-14T02:11:04.25Z ')).toEqual({ ok: true, iso: '2028-03-14T02:11:04.25Z' });
    expect(parseUtcInput('2028-03-14 02:11:04 UTC')).toEqual({ ok: true, iso: '2028-03-14T02:11:04Z' });
  });

  it('parseUtcInput() refuses a day the calendar lacks and a time that is not one', () => {
    // 2027 is not a leap year (Gregorian rule), so it has no 29 February.
    expect(parseUtcInput('2027-02-29 00:00')).toEqual({
      ok: false,
      message: '2027-02-29 is not a calendar date',
    });
    expect(parseUtcInput('2028-03-14 24:00')).toMatchObject({ ok: false });
    expect(parseUtcInput('14/03/2028')).toMatchObject({ ok: false });
  });
});
