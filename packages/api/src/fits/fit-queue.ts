import type { Queue } from 'bullmq';

export interface FitJobData {
  fitId: string;
}

/**
 * Queues the solve of one stored fit. jobId = fit id, so adding a fit that is already waiting or
 * running (a retried submit, two workers' sweeps at once) queues it once.
 */
export function enqueueFit(queue: Queue<FitJobData>, fitId: string): Promise<unknown> {
  return queue.add('solve', { fitId }, { jobId: fitId, removeOnComplete: 1000, removeOnFail: 5000 });
}
