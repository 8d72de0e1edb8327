import { describe, expect, it } from 'vitest';

import { InputProblems, lineAndColumn, parseJsonText } from '../src/io.js';

function problemOf(text: string): string {
  try {
    parseJsonText(text, 'event.json');
  } catch (error) {
    if (error instanceof InputProblems)
      return error.problems.map((p) => `${p.path}: ${p.message}`).join('\n');
    throw error;
  }
  throw new Error('expected the text to be refused');
}

describe('io', () => {
  it('lineAndColumn() counts lines and columns from 1', () => {
    expect(lineAndColumn('ab\ncd\n', 0)).toEqual({ line: 1, column: 1 });
    expect(lineAndColumn('ab\ncd\n', 4)).toEqual({ line: 2, column: 2 });
    expect(lineAndColumn('ab\ncd\n', 6)).toEqual({ line: 3, column: 1 });
  });

  it('parseJsonText() locates a missing comma by line and column', () => {
    expect(problemOf('{\n  "a": 1\n  "b": 2\n}')).toBe(
      "event.json: not JSON at line 3, column 3: Expected ',' or '}' after property value",
    );
  });

  it('parseJsonText() places a truncated document at its end', () => {
    expect(problemOf('{"a": [1, 2')).toMatch(/^event\.json: not JSON at line 1, column 12: /);
    expect(problemOf('')).toBe('event.json: not JSON at line 1, column 1: Unexpected end of JSON input');
  });

  it('parseJsonText() returns the value of valid JSON', () => {
    expect(parseJsonText('{"a": [1, 2.5, null]}', 'x.json')).toEqual({ a: [1, 2.5, null] });
  });
});
