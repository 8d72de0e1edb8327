import type { Solution } from '@limbus/geometry';
import type { FitRun, FitState, ReviewState } from './entities/fit-run.entity';

export interface FitView {
  id: string;
  eventId: string;
  state: FitState;
  reviewState: ReviewState;
  progress: number;
  error: string | null;
  solution: Solution | null;
  options: Record<string, unknown>;
  inputSha256: string;
  /** SHA-256 of the event data the fit ran on (eventDataSha256). */
  dataSha256: string;
  /** False when the event's data changed since: the fit is based on older data. */
  inputMatchesEvent: boolean;
  engineVersion: string;
  seed: number;
  createdBy: { id: string; name: string };
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export type FitSummaryView = Omit<FitView, 'solution'>;

/** `currentDataSha256` is the event's data hash now (EventsService.detail(...).dataSha256). */
export function fitSummaryView(f: FitRun, currentDataSha256: string): FitSummaryView {
  return {
    id: f.id,
    eventId: f.event.id,
    state: f.state,
    reviewState: f.reviewState,
    progress: f.progress,
    error: f.error,
    options: f.options,
    inputSha256: f.inputSha256,
    dataSha256: f.dataSha256,
    inputMatchesEvent: f.dataSha256 === currentDataSha256,
    engineVersion: f.engineVersion,
    seed: f.seed,
    createdBy: { id: f.createdBy.id, name: f.createdBy.name },
    createdAt: f.createdAt.toISOString(),
    startedAt: f.startedAt?.toISOString() ?? null,
    finishedAt: f.finishedAt?.toISOString() ?? null,
  };
}

export function fitView(f: FitRun, currentDataSha256: string): FitView {
  return { ...fitSummaryView(f, currentDataSha256), solution: f.solution };
}
