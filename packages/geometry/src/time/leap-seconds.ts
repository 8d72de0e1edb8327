// The UTC leap-second table: TAI − UTC from 1972 on, one row per step, from IERS Bulletin C (the steps
// are as the Bulletins announced them; listed from memory and checked against Bulletin C's statement
// that TAI − UTC = 37 s since 2017-01-01). Before 1972 UTC had fractional rate offsets, which Limbus
// does not support. A new Bulletin C announcing a leap second means appending a row here.

export interface LeapSecondStep {
  /** UTC calendar date (0h) from which the offset applies. */
  year: number;
  month: number;
  taiMinusUtcSeconds: number;
}

export const LEAP_SECOND_STEPS: readonly LeapSecondStep[] = [
  { year: 1972, month: 1, taiMinusUtcSeconds: 10 },
  { year: 1972, month: 7, taiMinusUtcSeconds: 11 },
  { year: 1973, month: 1, taiMinusUtcSeconds: 12 },
  { year: 1974, month: 1, taiMinusUtcSeconds: 13 },
  { year: 1975, month: 1, taiMinusUtcSeconds: 14 },
  { year: 1976, month: 1, taiMinusUtcSeconds: 15 },
  { year: 1977, month: 1, taiMinusUtcSeconds: 16 },
  { year: 1978, month: 1, taiMinusUtcSeconds: 17 },
  { year: 1979, month: 1, taiMinusUtcSeconds: 18 },
  { year: 1980, month: 1, taiMinusUtcSeconds: 19 },
  { year: 1981, month: 7, taiMinusUtcSeconds: 20 },
  { year: 1982, month: 7, taiMinusUtcSeconds: 21 },
  { year: 1983, month: 7, taiMinusUtcSeconds: 22 },
  { year: 1985, month: 7, taiMinusUtcSeconds: 23 },
  { year: 1988, month: 1, taiMinusUtcSeconds: 24 },
  { year: 1990, month: 1, taiMinusUtcSeconds: 25 },
  { year: 1991, month: 1, taiMinusUtcSeconds: 26 },
  { year: 1992, month: 7, taiMinusUtcSeconds: 27 },
  { year: 1993, month: 7, taiMinusUtcSeconds: 28 },
  { year: 1994, month: 7, taiMinusUtcSeconds: 29 },
  { year: 1996, month: 1, taiMinusUtcSeconds: 30 },
  { year: 1997, month: 7, taiMinusUtcSeconds: 31 },
  { year: 1999, month: 1, taiMinusUtcSeconds: 32 },
  { year: 2006, month: 1, taiMinusUtcSeconds: 33 },
  { year: 2009, month: 1, taiMinusUtcSeconds: 34 },
  { year: 2012, month: 7, taiMinusUtcSeconds: 35 },
  { year: 2015, month: 7, taiMinusUtcSeconds: 36 },
  { year: 2017, month: 1, taiMinusUtcSeconds: 37 },
];
