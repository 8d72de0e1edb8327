/** Queue that carries light-curve timing jobs; apart from `fits` so that a long solve never delays a timing. */
export const TIMINGS_QUEUE = 'timings';

export interface TimingJobData {
  timingId: string;
}
