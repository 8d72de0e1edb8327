// Turning zod issues into problems a person can act on: a JSON path in the form
// `chords[2].disappearance.time` and a message in plain words.

import type { z } from 'zod';

export interface Problem {
  path: string;
  message: string;
}

export type PathSegment = PropertyKey;

export function formatPath(segments: readonly PathSegment[]): string {
  let out = '';
  for (const segment of segments) {
    if (typeof segment === 'number') out += `[${segment}]`;
    else out += out === '' ? String(segment) : `.${String(segment)}`;
  }
  return out === '' ? '(top level)' : out;
}

function describeValue(input: unknown): string {
  if (input === null) return 'null';
  if (Array.isArray(input)) return 'a list';
  if (typeof input === 'string')
    return `the text ${JSON.stringify(input.length > 40 ? input.slice(0, 40) + '…' : input)}`;
  if (typeof input === 'number') return Number.isFinite(input) ? `the number ${input}` : String(input);
  if (typeof input === 'object') return 'an object';
  return `a ${typeof input}`;
}

const TYPE_WORDS: Record<string, string> = {
  number: 'a number',
  string: 'a text string',
  object: 'an object',
  array: 'a list',
  boolean: 'true or false',
  int: 'a whole number',
};

function quoteAll(values: readonly unknown[]): string {
  const quoted = values.map((v) => JSON.stringify(v));
  return quoted.length <= 1 ? (quoted[0] ?? '') : `${quoted.slice(0, -1).join(', ')} or ${quoted.at(-1)}`;
}

/**
 * Error map passed to `safeParse`: it words the issues that the schemas do not word themselves
 * (missing fields, wrong types, wrong literal or enum values). Schema-level messages win over it.
 */
export const plainErrorMap: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type': {
      const wanted = TYPE_WORDS[issue.expected] ?? issue.expected;
      return issue.input === undefined
        ? `missing; ${wanted} is required`
        : `expected ${wanted}, got ${describeValue(issue.input)}`;
    }
    case 'invalid_value':
      return issue.values.length === 1
        ? `expected ${quoteAll(issue.values)}, got ${describeValue(issue.input)}`
        : `expected one of ${quoteAll(issue.values)}, got ${describeValue(issue.input)}`;
    case 'invalid_union':
      // A discriminated union reports at the discriminator's path but carries the whole object.
      if ('options' in issue && Array.isArray(issue.options)) {
        const key =
          'discriminator' in issue && typeof issue.discriminator === 'string' ? issue.discriminator : '';
        const input: unknown = issue.input;
        const value =
          typeof input === 'object' && input !== null && key in input ? Reflect.get(input, key) : input;
        return `expected ${quoteAll(issue.options)}, got ${describeValue(value)}`;
      }
      return 'does not match any allowed form';
    case 'unrecognized_keys':
      return 'unknown field (check the spelling)';
    default:
      return undefined;
  }
};

/** One problem per issue; an unknown-keys issue becomes one problem per unknown key, located at the key. */
export function problemsFromIssues(issues: readonly z.core.$ZodIssue[]): Problem[] {
  const problems: Problem[] = [];
  for (const issue of issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys)
        problems.push({ path: formatPath([...issue.path, key]), message: issue.message });
    } else {
      problems.push({ path: formatPath(issue.path), message: issue.message });
    }
  }
  return problems;
}
