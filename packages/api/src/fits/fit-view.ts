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
  engineVersion: string;
  seed: number;
  createdBy: { id: string; name: string };
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export type FitSummaryView = Omit<FitView, 'solution'>;

export function fitSummaryView(f: FitRun): FitSummaryView {
  return {
    id: f.id,
    eventId: f.event.id,
    state: f.state,
    reviewState: f.reviewState,
    progress: f.progress,
    error: f.error,
    options: f.options,
    inputSha256: f.inputSha256,
    engineVersion: f.engineVersion,
    seed: f.seed,
    createdBy: { id: f.createdBy.id, name: f.createdBy.name },
    createdAt: f.createdAt.toISOString(),
    startedAt: f.startedAt?.toISOString() ?? null,
    finishedAt: f.finishedAt?.toISOString() ?? null,
  };
}

export function fitView(f: FitRun): FitView {
  return { ...fitSummaryView(f), solution: f.solution };
}
