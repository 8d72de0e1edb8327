// What every export says about where it came from, so a figure or table found in a draft months later can
// be traced to the stored fit run and reproduced from its input.
import type { FitRun } from '../fits/entities/fit-run.entity';

export interface Provenance {
  fitId: string;
  inputSha256: string;
  engineVersion: string;
  seed: number;
  /** When the fit finished (ISO 8601 UTC): the fit's date, not the download's, so exports repeat byte for byte. */
  date: string;
  approvalState: string;
}

export function provenanceOf(
  run: Pick<
    FitRun,
    'id' | 'inputSha256' | 'engineVersion' | 'seed' | 'finishedAt' | 'createdAt' | 'reviewState'
  >,
): Provenance {
  return {
    fitId: run.id,
    inputSha256: run.inputSha256,
    engineVersion: run.engineVersion,
    seed: run.seed,
    date: (run.finishedAt ?? run.createdAt).toISOString(),
    approvalState: run.reviewState,
  };
}

export function provenanceLine(p: Provenance): string {
  return (
    `Limbus fit ${p.fitId} · input SHA-256 ${p.inputSha256} · engine ${p.engineVersion} · ` +
    `seed ${p.seed} · ${p.date} · ${p.approvalState}`
  );
}

/** Key/value pairs in a fixed order, for the formats that store provenance as separate fields. */
export function provenanceEntries(p: Provenance): Array<[string, string]> {
  return [
    ['fitId', p.fitId],
    ['inputSha256', p.inputSha256],
    ['engineVersion', p.engineVersion],
    ['seed', String(p.seed)],
    ['date', p.date],
    ['approvalState', p.approvalState],
  ];
}
