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

const CONTROL_ALL = new RegExp(CONTROL.source, 'g');

/**
 * Text stored before these rules (or written around them) with each control character replaced by
 * U+FFFD, the replacement character: readers of stored data show that something was there.
 */
export function replaceControlCharacters(text: string): string {
  return text.replace(CONTROL_ALL, '\uFFFD');
}

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
  /** A UTC time as chords and reports store it: "2028-03-14T02:11:04." and Z leave 19 decimals. */
  utcTime: 40,
  /** The name an uploaded file is stored and offered for download under. */
  fileName: 300,
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

/**
 * The most one event holds. A campaign of a few hundred stations is already exceptional; beyond these a
 * list is a mistake or an attack, and every view, hash and fit of the event grows with it.
 */
export const EVENT_SIZE_LIMITS = {
  stations: 2_000,
  chords: 2_000,
  ringEvents: 5_000,
} as const;

const SIZE_WORDS: Record<keyof typeof EVENT_SIZE_LIMITS, string> = {
  stations: 'stations',
  chords: 'chords',
  ringEvents: 'ring events',
};

/** "an event holds at most 2000 chords", and what the request would have made of it. */
export function eventSizeMessage(kind: keyof typeof EVENT_SIZE_LIMITS, would?: number): string {
  const limit = EVENT_SIZE_LIMITS[kind];
  const base = `an event holds at most ${limit} ${SIZE_WORDS[kind]}`;
  return would === undefined ? base : `${base}; this would make ${would}`;
}

// Lone UTF-16 surrogates (not valid Unicode, refused by encodeURIComponent and by XML).
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;
// C0, DEL, C1, the line and paragraph separators (U+2028, U+2029), the byte-order mark and the
// direction marks and overrides (U+200E, U+200F, U+202A–U+202E, U+2066–U+2069), which can make a name
// read differently from what it is ("Trojan Source", CVE-2021-42574).
const UNSAFE_IN_NAME =
  // eslint-disable-next-line no-control-regex
  /[\u0000-\u001f\u007f-\u009f\u2028\u2029\ufeff\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

/**
 * The name an uploaded file is kept and offered under: Unicode NFC, without control characters, line or
 * paragraph separators, direction overrides and path separators, spaces collapsed, and at most
 * TEXT_LIMITS.fileName characters with its extension kept; `fallback` when nothing is left.
 */
export function safeFileName(name: string, fallback: string): string {
  const cleaned = name
    .replace(LONE_SURROGATE, '')
    .normalize('NFC')
    .replace(UNSAFE_IN_NAME, '')
    .replace(/[/\\]/g, '_')
    .replace(/\s+/g, ' ')
    .trim();
  const chars = Array.from(cleaned);
  if (chars.length === 0) return fallback;
  if (chars.length <= TEXT_LIMITS.fileName) return cleaned;
  const dot = cleaned.lastIndexOf('.');
  const extension = dot > 0 ? Array.from(cleaned.slice(dot)) : [];
  const keptExtension = extension.length <= 16 ? extension : [];
  return [...chars.slice(0, TEXT_LIMITS.fileName - keptExtension.length), ...keptExtension].join('');
}
