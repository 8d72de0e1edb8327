// Text fields of the API and the files. Each limit here matches its database column, and a field
// refuses the C0 and C1 control characters (free-text notes keep tab and newline): a NUL or an ESC in
// a title would otherwise reach the SVG and PDF renderers, which cannot draw it.

import { z } from 'zod';

// C0 (U+0000–U+001F), DEL (U+007F) and C1 (U+0080–U+009F): matching them is the point here.
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;
// The same, less tab (U+0009), line feed (U+000A) and carriage return (U+000D).
// eslint-disable-next-line no-control-regex
const CONTROL_IN_NOTES = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;

/** A one-line text of at most `max` characters, trimmed; empty is refused unless `allowEmpty`. */
export function lineText(max: number, what = 'text', options: { allowEmpty?: boolean } = {}) {
  const base = z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .refine((s) => !CONTROL.test(s), 'must not contain control characters');
  return options.allowEmpty ? base : base.refine((s) => s.length > 0, `${what} must not be empty`);
}

/** Free text over several lines (notes, comments, messages): tab and newline allowed. */
export function noteText(max: number) {
  return z
    .string()
    .trim()
    .max(max, `at most ${max} characters`)
    .refine(
      (s) => !CONTROL_IN_NOTES.test(s),
      'must not contain control characters other than tab and newline',
    );
}

/** Column widths the text limits above are checked against (packages/api entities use the same). */
export const TEXT_LIMITS = {
  teamName: 200,
  personName: 200,
  email: 254,
  bodyName: 200,
  bodyDesignation: 100,
  eventTitle: 300,
  stationCode: 100,
  ringLabel: 100,
  stationDetail: 200,
  note: 10_000,
  reason: 2_000,
} as const;
