import { z } from 'zod';

/**
 * Worker tuning from the environment. Read when the processor class is decorated, because BullMQ's
 * worker options are fixed there. FIT_TEST_DELAY_MS holds every job that long before solving, so the
 * worker-kill test can kill a worker in the middle of a job; it is 0 unless set.
 */
const schema = z.object({
  FIT_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
  FIT_STALLED_INTERVAL_MS: z.coerce.number().int().min(100).default(30_000),
  FIT_LOCK_DURATION_MS: z.coerce.number().int().min(100).optional(),
  FIT_TEST_DELAY_MS: z.coerce.number().int().min(0).default(0),
});

export interface FitWorkerOptions {
  concurrency: number;
  stalledIntervalMs: number;
  lockDurationMs: number;
  testDelayMs: number;
}

export function fitWorkerOptions(env: NodeJS.ProcessEnv): FitWorkerOptions {
  const given = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ''));
  const parsed = schema.safeParse(given);
  if (!parsed.success)
    throw new Error(
      `Invalid environment: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`,
    );
  const e = parsed.data;
  return {
    concurrency: e.FIT_CONCURRENCY,
    stalledIntervalMs: e.FIT_STALLED_INTERVAL_MS,
    // A lock shorter than the stalled check would let a healthy worker's job be taken from it.
    lockDurationMs: e.FIT_LOCK_DURATION_MS ?? e.FIT_STALLED_INTERVAL_MS,
    testDelayMs: e.FIT_TEST_DELAY_MS,
  };
}
