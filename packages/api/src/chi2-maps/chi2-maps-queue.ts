import type { Queue } from 'bullmq';

/** Queue of χ² map jobs; apart from `fits` so that a long map never delays a solve. */
export const CHI2_MAPS_QUEUE = 'chi2-maps';

export interface Chi2MapJobData {
  mapId: string;
}

/** jobId = map id: a map added twice (a retry, two workers' sweeps) is queued once. */
export function enqueueChi2Map(queue: Queue<Chi2MapJobData>, mapId: string): Promise<unknown> {
  return queue.add('map', { mapId }, { jobId: mapId, removeOnComplete: 1000, removeOnFail: 5000 });
}
