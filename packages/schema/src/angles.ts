// Right ascension and declination as people type them: decimal degrees, or sexagesimal (hours for RA,
// degrees for Dec) with h/m/s, °/′/″ (or d, ', "), colons or spaces between the parts. The API takes
// degrees; the client's forms turn what was typed into degrees with these, so both sides read one way.

export type AngleParse = { ok: true; deg: number } | { ok: false; message: string };

const NUMBER = String.raw`(\d+(?:\.\d*)?|\.\d+)`;
const SEP = String.raw`\s*(?:[:\s]|[hHdD°]|[mM′'])\s*`;
// Up to three numeric parts with optional unit marks or separators between and after them.
const SEXAGESIMAL = new RegExp(
  String.raw`^([-+−]?)\s*${NUMBER}(?:${SEP}${NUMBER}(?:${SEP}${NUMBER})?)?\s*(?:[sS″"]|''|[mM′'])?\s*$`,
);
const DECIMAL_HOURS = new RegExp(String.raw`^${NUMBER}\s*[hH]$`);
const DECIMAL_DEGREES = new RegExp(String.raw`^([-+−]?)\s*${NUMBER}\s*(?:°|[dD]|deg)?$`);

interface Parts {
  negative: boolean;
  whole: number;
  minutes: number;
  seconds: number;
  count: number;
}

function partsOf(text: string): Parts | null {
  const m = SEXAGESIMAL.exec(text);
  if (m === null) return null;
  const [, sign, a, b, c] = m;
  return {
    negative: sign === '-' || sign === '−',
    whole: Number(a),
    minutes: b === undefined ? 0 : Number(b),
    seconds: c === undefined ? 0 : Number(c),
    count: [a, b, c].filter((p) => p !== undefined).length,
  };
}

function checkMinutesSeconds(p: Parts): string | null {
  if (p.count >= 2 && !Number.isInteger(p.whole)) return 'only the last part may have decimals';
  if (p.count === 3 && !Number.isInteger(p.minutes)) return 'only the last part may have decimals';
  if (p.minutes >= 60) return 'minutes must be below 60';
  if (p.seconds >= 60) return 'seconds must be below 60';
  return null;
}

/**
 * Right ascension in degrees, [0, 360). One plain number is degrees ("78.63"), a number with h is
 * hours ("5.242h"), two or three parts are hours, minutes and seconds ("05h14m32.27s", "5:14:32.27").
 */
export function parseRightAscension(input: string): AngleParse {
  const text = input.trim();
  if (text === '') return { ok: false, message: 'enter the right ascension' };
  const plain = DECIMAL_DEGREES.exec(text);
  if (plain !== null) {
    if (plain[1] !== '') return { ok: false, message: 'right ascension has no sign' };
    const deg = Number(plain[2]);
    return deg < 360
      ? { ok: true, deg }
      : { ok: false, message: 'right ascension must be within 0–360° (or 0–24 h)' };
  }
  const hoursOnly = DECIMAL_HOURS.exec(text);
  if (hoursOnly !== null) {
    const hours = Number(hoursOnly[1]);
    return hours < 24 ? { ok: true, deg: hours * 15 } : { ok: false, message: 'hours must be below 24' };
  }
  const p = partsOf(text);
  if (p === null || p.count < 2)
    return { ok: false, message: 'not a right ascension (e.g. 78.6345, 5h14m32.27s or 05:14:32.27)' };
  if (p.negative) return { ok: false, message: 'right ascension has no sign' };
  const problem = checkMinutesSeconds(p);
  if (problem !== null) return { ok: false, message: problem };
  if (p.whole >= 24) return { ok: false, message: 'hours must be below 24' };
  return { ok: true, deg: (p.whole + p.minutes / 60 + p.seconds / 3600) * 15 };
}

/**
 * Declination in degrees, [−90, +90]. One number is degrees ("-8.2016"); two or three parts are
 * degrees, arcminutes and arcseconds ("-08°12′05.9″", "-8:12:05.9"). The sign belongs to the whole
 * angle, so "-00 30 00" is −0.5°.
 */
export function parseDeclination(input: string): AngleParse {
  const text = input.trim();
  if (text === '') return { ok: false, message: 'enter the declination' };
  const plain = DECIMAL_DEGREES.exec(text);
  if (plain !== null) {
    const deg = (plain[1] === '-' || plain[1] === '−' ? -1 : 1) * Number(plain[2]);
    return Math.abs(deg) <= 90
      ? { ok: true, deg }
      : { ok: false, message: 'declination must be within ±90°' };
  }
  const p = partsOf(text);
  if (p === null || p.count < 2)
    return { ok: false, message: 'not a declination (e.g. -8.2016, -08°12′05.9″ or -08:12:05.9)' };
  const problem = checkMinutesSeconds(p);
  if (problem !== null) return { ok: false, message: problem };
  const deg = (p.negative ? -1 : 1) * (p.whole + p.minutes / 60 + p.seconds / 3600);
  return Math.abs(deg) <= 90 ? { ok: true, deg } : { ok: false, message: 'declination must be within ±90°' };
}
