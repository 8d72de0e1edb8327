import type { Queue } from 'bullmq';

/** Queue that carries light-curve timing jobs; apart from `fits` so that a long solve never delays a timing. */
export const TIMINGS_QUEUE = 'timings';

export interface TimingJobData {
  timingId: string;
}

/** jobId = timing id: a timing added twice (a retry, two workers' sweeps) is queued once. */
export function enqueueTiming(queue: Queue<TimingJobData>, timingId: string): Promise<unknown> {
  return queue.add('time', { timingId }, { jobId: timingId, removeOnComplete: 1000 });
}
