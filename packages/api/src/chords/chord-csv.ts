// The chord CSV (docs/file-formats.md, "Chord CSV"): one chord per row, a header row naming the
// columns in any order. Each row becomes an event-file chord and is checked with the event file's own
// chord schema, so a CSV chord and a JSON chord are judged alike. Problems carry the row number as a
// spreadsheet shows it (the header is row 1) and the column name.
import type { ChordInput } from '@limbus/geometry';
import { chordPayloadSchema } from '@limbus/schema';
import Papa from 'papaparse';

export const CHORD_CSV_COLUMNS = [
  'station',
  'type',
  'disappearance_utc',
  'disappearance_sigma_s',
  'reappearance_utc',
  'reappearance_sigma_s',
  'start_utc',
  'end_utc',
  'time_offset_s',
] as const;
type Column = (typeof CHORD_CSV_COLUMNS)[number];

export interface CsvProblem {
  path: string;
  row: number;
  column: string | null;
  message: string;
}

export interface ParsedChordRow {
  row: number;
  chord: ChordInput;
}

const NUMBER_COLUMNS: ReadonlySet<Column> = new Set([
  'disappearance_sigma_s',
  'reappearance_sigma_s',
  'time_offset_s',
]);

function problem(row: number, column: string | null, message: string): CsvProblem {
  return { path: column ? `row ${row}, column ${column}` : `row ${row}`, row, column, message };
}

/** The column a schema issue belongs to, from its path inside the chord object. */
function columnOf(path: readonly PropertyKey[]): string | null {
  const [head, sub] = path;
  if (head === 'disappearance' || head === 'reappearance')
    return sub === 'sigmaSeconds' ? `${head}_sigma_s` : `${head}_utc`;
  if (head === 'start') return 'start_utc';
  if (head === 'end') return 'end_utc';
  if (head === 'timeOffsetSeconds') return 'time_offset_s';
  if (head === 'station' || head === 'type') return head;
  return null;
}

/**
 * Every row's problems, or every row's chord when there are none. `knownStations` are the event's
 * station ids; a row naming another station is a problem of that row.
 */
export function parseChordCsv(
  text: string,
  knownStations: ReadonlySet<string>,
): { ok: true; rows: ParsedChordRow[] } | { ok: false; problems: CsvProblem[] } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim().toLowerCase(),
  });
  const problems: CsvProblem[] = [];
  const header = parsed.meta.fields ?? [];
  for (const name of header)
    if (!(CHORD_CSV_COLUMNS as readonly string[]).includes(name))
      problems.push(problem(1, name, `unknown column; the columns are ${CHORD_CSV_COLUMNS.join(', ')}`));
  for (const name of ['station', 'type'])
    if (!header.includes(name)) problems.push(problem(1, name, 'missing column'));
  for (const error of parsed.errors)
    problems.push(problem((error.row ?? 0) + 2, null, `the row cannot be read as CSV: ${error.message}`));
  if (problems.length > 0) return { ok: false, problems };
  if (parsed.data.length === 0)
    return { ok: false, problems: [problem(2, null, 'no chord rows after the header')] };

  const rows: ParsedChordRow[] = [];
  parsed.data.forEach((record, index) => {
    const row = index + 2;
    const cell = (c: Column): string => (record[c] ?? '').trim();
    const numberAt = (c: Column): number | undefined => {
      const value = cell(c);
      if (value === '') return undefined;
      const n = Number(value);
      if (!Number.isFinite(n)) {
        problems.push(problem(row, c, `expected a number, got "${value}"`));
        return undefined;
      }
      return n;
    };
    for (const c of NUMBER_COLUMNS) numberAt(c);
    if (problems.some((p) => p.row === row)) return;
    const type = cell('type');
    const offset = numberAt('time_offset_s');
    // A positive chord may give one edge: both cells of the other left empty (a single-edge chord).
    const mark = (which: 'disappearance' | 'reappearance') =>
      cell(`${which}_utc`) === '' && cell(`${which}_sigma_s`) === ''
        ? {}
        : { [which]: { time: cell(`${which}_utc`), sigmaSeconds: numberAt(`${which}_sigma_s`) } };
    const candidate: Record<string, unknown> =
      type === 'positive'
        ? { station: cell('station'), type, ...mark('disappearance'), ...mark('reappearance') }
        : { station: cell('station'), type, start: cell('start_utc'), end: cell('end_utc') };
    if (offset !== undefined) candidate.timeOffsetSeconds = offset;
    const result = chordPayloadSchema.safeParse(candidate);
    if (!result.success) {
      for (const issue of result.error.issues) {
        const column = columnOf(issue.path);
        const message =
          issue.code === 'invalid_type' && issue.input === undefined
            ? 'missing; required for this chord type'
            : issue.message;
        problems.push(
          problem(
            row,
            column,
            column === 'type' ? `expected "positive" or "negative", got "${type}"` : message,
          ),
        );
      }
      return;
    }
    if (!knownStations.has(result.data.station)) {
      problems.push(problem(row, 'station', `unknown station "${result.data.station}" in this event`));
      return;
    }
    // Cells of the other chord type must be empty, or the row says two things at once.
    const unused: Column[] =
      type === 'positive'
        ? ['start_utc', 'end_utc']
        : ['disappearance_utc', 'disappearance_sigma_s', 'reappearance_utc', 'reappearance_sigma_s'];
    for (const c of unused)
      if (cell(c) !== '') problems.push(problem(row, c, `must be empty for a ${type} chord`));
    rows.push({ row, chord: result.data });
  });
  return problems.length > 0 ? { ok: false, problems } : { ok: true, rows };
}
