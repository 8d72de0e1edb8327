import { describe, expect, it } from 'vitest';

import { createInvitationPayloadSchema, lineText, noteText } from '../src/index.js';

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
