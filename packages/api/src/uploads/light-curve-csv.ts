// A light curve as observers upload it: CSV with a header row `time,flux` or `time,flux,fluxErr`;
// time is an ISO 8601 UTC instant or seconds (any zero point), increasing. Checked whole before any
// byte is stored, so the store never holds a file the report cannot use.
import { parseUtcTime } from '@limbus/schema';
import Papa from 'papaparse';

export interface LightCurveCheck {
  ok: boolean;
  problems: Array<{ path: string; row: number; column: string | null; message: string }>;
  rows: number;
}

const MAX_PROBLEMS = 20;

export function checkLightCurveCsv(text: string): LightCurveCheck {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
  });
  const problems: LightCurveCheck['problems'] = [];
  const add = (row: number, column: string | null, message: string) => {
    if (problems.length < MAX_PROBLEMS)
      problems.push({ path: column ? `row ${row}, column ${column}` : `row ${row}`, row, column, message });
  };
  const header = parsed.meta.fields ?? [];
  const expected = header.length === 3 ? ['time', 'flux', 'fluxErr'] : ['time', 'flux'];
  if (header.join(',') !== expected.join(','))
    add(1, null, `the header must be "time,flux" or "time,flux,fluxErr", got "${header.join(',')}"`);
  if (problems.length > 0) return { ok: false, problems, rows: 0 };
  let previous = -Infinity;
  parsed.data.forEach((record, index) => {
    const row = index + 2;
    const timeText = (record.time ?? '').trim();
    const seconds =
      /^[-+]?\d/.test(timeText) && !timeText.includes('T')
        ? Number(timeText)
        : parseUtcTime(timeText)?.orderSeconds;
    if (seconds === undefined || !Number.isFinite(seconds)) add(row, 'time', `not a time: "${timeText}"`);
    else if (seconds <= previous) add(row, 'time', 'times must increase');
    else previous = seconds;
    for (const column of expected.slice(1)) {
      const value = Number((record[column] ?? '').trim());
      if ((record[column] ?? '').trim() === '' || !Number.isFinite(value))
        add(row, column, `not a number: "${record[column] ?? ''}"`);
    }
  });
  for (const error of parsed.errors)
    add((error.row ?? 0) + 2, null, `the row cannot be read as CSV: ${error.message}`);
  if (parsed.data.length < 2) add(2, null, 'a light curve needs at least two rows');
  return { ok: problems.length === 0, problems, rows: parsed.data.length };
}
