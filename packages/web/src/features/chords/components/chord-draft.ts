import { chordInputSchema, type ChordInput } from '../api/save-chord';
import type { ChordRow } from '../api/get-chords';

/** What the row editor holds: text as typed, parsed only on save so a half-typed time is not lost. */
export interface ChordDraft {
  station: string;
  type: 'positive' | 'negative';
  from: string;
  fromSigma: string;
  to: string;
  toSigma: string;
  offset: string;
}

export type DraftField = keyof ChordDraft;

export function draftOf(row: ChordRow): ChordDraft {
  return {
    station: row.station,
    type: row.type,
    from: (row.type === 'positive' ? row.disappearance?.time : row.start) ?? '',
    fromSigma: row.disappearance === null ? '' : String(row.disappearance.sigmaSeconds),
    to: (row.type === 'positive' ? row.reappearance?.time : row.end) ?? '',
    toSigma: row.reappearance === null ? '' : String(row.reappearance.sigmaSeconds),
    offset: String(row.timeOffsetSeconds),
  };
}

export function emptyDraft(station: string): ChordDraft {
  return { station, type: 'positive', from: '', fromSigma: '', to: '', toSigma: '', offset: '0' };
}

/** An empty box is "missing" (NaN fails the number check with its own message), never zero. */
function numberOf(text: string): number {
  return text.trim() === '' ? Number.NaN : Number(text);
}

const FIELD_OF_PATH: Record<string, DraftField> = {
  // The chord as a whole: a positive chord with neither edge.
  '': 'from',
  station: 'station',
  'disappearance.time': 'from',
  'disappearance.sigmaSeconds': 'fromSigma',
  'reappearance.time': 'to',
  'reappearance.sigmaSeconds': 'toSigma',
  start: 'from',
  end: 'to',
  timeOffsetSeconds: 'offset',
};

export type DraftResult =
  { ok: true; input: ChordInput } | { ok: false; errors: Partial<Record<DraftField, string>> };

export function parseDraft(draft: ChordDraft): DraftResult {
  // An edge whose time and σ are both left empty is not given: a single-edge chord.
  const edge = (time: string, sigma: string) =>
    time.trim() === '' && sigma.trim() === ''
      ? undefined
      : { time: time.trim(), sigmaSeconds: numberOf(sigma) };
  const disappearance = edge(draft.from, draft.fromSigma);
  const reappearance = edge(draft.to, draft.toSigma);
  const candidate =
    draft.type === 'positive'
      ? {
          station: draft.station,
          type: draft.type,
          ...(disappearance === undefined ? {} : { disappearance }),
          ...(reappearance === undefined ? {} : { reappearance }),
          timeOffsetSeconds: numberOf(draft.offset),
        }
      : {
          station: draft.station,
          type: draft.type,
          start: draft.from.trim(),
          end: draft.to.trim(),
          timeOffsetSeconds: numberOf(draft.offset),
        };
  const parsed = chordInputSchema.safeParse(candidate);
  if (parsed.success) return { ok: true, input: parsed.data };
  const errors: Partial<Record<DraftField, string>> = {};
  for (const issue of parsed.error.issues) {
    const field = FIELD_OF_PATH[issue.path.join('.')] ?? 'station';
    errors[field] ??= issue.message;
  }
  return { ok: false, errors };
}
