// A light curve as observers upload it, checked whole before any byte is stored (so the store never holds a
// file the timing job cannot use). The rules are the one parser shared with `limbus time` and the timing job
// (@limbus/schema, docs/file-formats.md "Light-curve CSV"); this adapter only adds row and column fields.
import { parseLightCurveCsv } from '@limbus/schema';

export interface LightCurveCheck {
  ok: boolean;
  problems: Array<{ path: string; row: number; column: string | null; message: string }>;
  rows: number;
}

const MAX_PROBLEMS = 20;
const LOCATION = /^row (\d+)(?:, column (.+))?$/;

export function checkLightCurveCsv(text: string): LightCurveCheck {
  const parsed = parseLightCurveCsv(text);
  if (parsed.ok) return { ok: true, problems: [], rows: parsed.curve.rows.length };
  const problems = parsed.problems.slice(0, MAX_PROBLEMS).map(({ path, message }) => {
    const m = LOCATION.exec(path);
    return { path, row: m ? Number(m[1]) : 1, column: m?.[2] ?? null, message };
  });
  return { ok: false, problems, rows: 0 };
}
