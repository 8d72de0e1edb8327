// Helpers shared by the CLI commands: reading input files, reporting input problems and mapping
// failures to exit codes (0 ok, 2 bad input, 1 internal error). Bad input never prints a stack trace
// and never writes to stdout, so a caller can pipe stdout straight into another program.

import { readFile } from 'node:fs/promises';

import { GeometryInputError } from '@limbus/geometry';

export interface Problem {
  /** JSON path ("chords[2].disappearance.time"), "row 3, column 2", or a file name. */
  path: string;
  message: string;
}

export const EXIT_OK = 0;
export const EXIT_INTERNAL = 1;
export const EXIT_BAD_INPUT = 2;

/** Input a person can fix; `runCommand` prints each problem on its own stderr line and exits 2. */
export class InputProblems extends Error {
  constructor(readonly problems: Problem[]) {
    super(problems.map((p) => `${p.path}: ${p.message}`).join('\n'));
    this.name = 'InputProblems';
  }
}

/**
 * The one file a command takes (`limbus solve EVENT.json`): anything else, or an option, is refused with
 * the command's usage line. `what` names the file in the message ("event file").
 */
export function oneFileArgument(args: string[], usage: string, what: string): string {
  const files = args.filter((a) => !a.startsWith('-'));
  const flags = args.filter((a) => a.startsWith('-'));
  const problems = flags.map((flag) => ({ path: 'arguments', message: `unknown option ${flag}; ${usage}` }));
  if (files.length !== 1)
    problems.push({ path: 'arguments', message: `expected one ${what}, got ${files.length}; ${usage}` });
  if (problems.length > 0) throw new InputProblems(problems);
  return files[0] as string;
}

export function printProblems(problems: Problem[]): void {
  for (const p of problems) process.stderr.write(`${p.path}: ${p.message}\n`);
}

/** The file's bytes; an unreadable file becomes an InputProblems naming the file. */
export async function readFileBytes(path: string): Promise<Buffer> {
  try {
    return await readFile(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'is a directory, not a file'
          : code === 'EACCES'
            ? 'permission denied'
            : `cannot be read (${code ?? String(error)})`;
    throw new InputProblems([{ path, message: why }]);
  }
}

/** 1-based line and column of a character offset, as editors count them. */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: offset - lineStart + 1 };
}

/** JSON.parse with the failure located by line and column where V8's message gives an offset. */
export function parseJsonText(text: string, path: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    const detail = error instanceof Error ? error.message : String(error);
    const position = /at position (\d+)/.exec(detail)?.[1];
    const offset =
      position !== undefined ? Number(position) : /Unexpected end/.test(detail) ? text.length : undefined;
    const at = offset === undefined ? undefined : lineAndColumn(text, offset);
    const where = at === undefined ? '' : ` at line ${at.line}, column ${at.column}`;
    const reason = detail
      .replace(/ in JSON at position \d+.*$/, '')
      .replace(/, ".*" is not valid JSON$/s, '');
    throw new InputProblems([{ path, message: `not JSON${where}: ${reason}` }]);
  }
}

/** Reads and parses a JSON file; returns the bytes too, for hashing exactly what was read. */
export async function readJsonFile(path: string): Promise<{ value: unknown; bytes: Buffer }> {
  const bytes = await readFileBytes(path);
  return { value: parseJsonText(bytes.toString('utf8'), path), bytes };
}

// By name as well as by class: a second copy of the geometry package (e.g. one bundled into another
// tool) throws an error of a different class object with the same shape.
function isGeometryInputError(error: unknown): error is GeometryInputError {
  return (
    error instanceof GeometryInputError || (error instanceof Error && error.name === 'GeometryInputError')
  );
}

/**
 * Runs a command body and turns its outcome into an exit code: InputProblems and GeometryInputError
 * become exit 2 with one stderr line per problem; anything else is an internal error (exit 1) reported
 * by its message alone.
 */
export async function runCommand(body: () => Promise<number | void>): Promise<number> {
  try {
    return (await body()) ?? EXIT_OK;
  } catch (error) {
    if (error instanceof InputProblems) {
      printProblems(error.problems);
      return EXIT_BAD_INPUT;
    }
    if (isGeometryInputError(error)) {
      printProblems([{ path: error.path, message: error.detail }]);
      return EXIT_BAD_INPUT;
    }
    const detail = error instanceof Error ? error.message : String(error);
    process.stderr.write(`limbus: internal error: ${detail}\n`);
    return EXIT_INTERNAL;
  }
}
