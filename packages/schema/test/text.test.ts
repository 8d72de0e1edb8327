import { describe, expect, it } from 'vitest';

import {
  createInvitationPayloadSchema,
  lineText,
  noteText,
  replaceControlCharacters,
  safeFileName,
  TEXT_LIMITS,
  utcTimeSchema,
} from '../src/index.js';

describe('lineText()', () => {
  it('lineText() trims, and refuses empty text, overlong text and control characters', () => {
    const title = lineText(5, 'title');
    expect(title.parse('  abc ')).toBe('abc');
    expect(title.safeParse('   ').error?.issues[0]?.message).toBe('title must not be empty');
    expect(title.safeParse('abcdef').error?.issues[0]?.message).toBe('at most 5 characters');
    for (const control of ['\u0000', '\u001b', '\t', '\n', '\u0085', '\u007f'])
      expect(title.safeParse(`a${control}b`).error?.issues[0]?.message).toBe(
        'must not contain control characters',
      );
    // A title in another script is text like any other.
    expect(title.parse('κύκλ')).toBe('κύκλ');
  });

  it('noteText() keeps tab and newline and refuses the other control characters', () => {
    const note = noteText(100);
    expect(note.parse('line 1\n\tline 2')).toBe('line 1\n\tline 2');
    expect(note.safeParse('bell\u0007').success).toBe(false);
    expect(note.safeParse('esc\u001b[31m').success).toBe(false);
  });
});

describe('createInvitationPayloadSchema', () => {
  it('createInvitationPayloadSchema takes several roles, or one as the older `role`, and lower-cases the address', () => {
    expect(
      createInvitationPayloadSchema.parse({
        email: 'New.Person@Example.org',
        roles: ['observer', 'modeller'],
      }),
    ).toEqual({ email: 'new.person@example.org', roles: ['modeller', 'observer'] });
    expect(createInvitationPayloadSchema.parse({ email: 'a@example.org', role: 'reviewer' })).toEqual({
      email: 'a@example.org',
      roles: ['reviewer'],
    });
  });

  it('createInvitationPayloadSchema refuses no role, both spellings and an unknown role, naming the field', () => {
    const paths = (body: unknown) =>
      createInvitationPayloadSchema.safeParse(body).error?.issues.map((i) => i.path.join('.'));
    expect(paths({ email: 'a@example.org' })).toEqual(['roles']);
    expect(paths({ email: 'a@example.org', roles: [] })).toEqual(['roles']);
    expect(paths({ email: 'a@example.org', roles: ['observer'], role: 'observer' })).toEqual(['role']);
    expect(paths({ email: 'a@example.org', roles: ['admin'] })).toEqual(['roles.0']);
  });
});

describe('utcTimeSchema', () => {
  it('utcTimeSchema takes up to 19 decimals (40 characters, its column) and refuses more, naming the limit', () => {
    const time = (decimals: number) => `2028-03-14T02:11:04.${'5'.repeat(decimals)}Z`;
    expect(time(19)).toHaveLength(TEXT_LIMITS.utcTime);
    expect(utcTimeSchema.parse(time(19))).toBe(time(19));
    expect(utcTimeSchema.safeParse(time(30)).error?.issues.map((i) => i.message)).toEqual([
      'at most 40 characters (a time keeps at most 19 decimals)',
    ]);
  });
});

describe('replaceControlCharacters()', () => {
  it('replaceControlCharacters() puts U+FFFD where a C0, DEL or C1 character was, and keeps other text', () => {
    expect(replaceControlCharacters('Quillon\u0000 \u001b[31m\u007f\u0085 κύκλ')).toBe(
      'Quillon\uFFFD \uFFFD[31m\uFFFD\uFFFD κύκλ',
    );
  });
});

describe('safeFileName()', () => {
  it('safeFileName() keeps a UTF-8 name, composed (NFC), and drops controls, separators and overrides', () => {
    // "κυ" spelt with a combining acute (U+0301) composes to U+03CD under NFC (Unicode UAX #15).
    expect(safeFileName('🌑κυ\u0301rve.csv', 'x.csv')).toBe('🌑κ\u03cdrve.csv');
    expect(safeFileName('night\u0000one\u2028two\u2029.csv', 'x.csv')).toBe('nightonetwo.csv');
    expect(safeFileName('evil\u202egpj.csv', 'x.csv')).toBe('evilgpj.csv');
    expect(safeFileName('../../etc/passwd', 'x.csv')).toBe('.._.._etc_passwd');
    expect(safeFileName('  a \t  b .csv ', 'x.csv')).toBe('a b .csv');
    expect(safeFileName('\u0000\u0001', 'light-curve.csv')).toBe('light-curve.csv');
    expect(safeFileName('half \ud83c.csv', 'x.csv')).toBe('half .csv');
  });

  it('safeFileName() cuts a long name to TEXT_LIMITS.fileName characters, keeping its extension', () => {
    const name = safeFileName(`${'🌑'.repeat(400)}.csv`, 'x.csv');
    expect(Array.from(name)).toHaveLength(TEXT_LIMITS.fileName);
    expect(name.endsWith('🌑.csv')).toBe(true);
  });
});
