import type { Logger } from '@nestjs/common';

/** How long a submit waits for Redis to take a job (with Redis away an add waits, retrying forever). */
export const ENQUEUE_WAIT_MS = 2_000;

/** 'timeout' when `work` has not settled within `ms`; its own result or rejection otherwise. */
export async function settlesWithin<T>(work: Promise<T>, ms: number): Promise<T | 'timeout'> {
  let timer: NodeJS.Timeout | undefined;
  const gaveUp = new Promise<'timeout'>((resolve) => {
    timer = setTimeout(() => resolve('timeout'), ms);
  });
  try {
    return await Promise.race([work, gaveUp]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * For a submit whose row is already stored: waits up to ENQUEUE_WAIT_MS for the queue to take the job,
 * then answers anyway and says so in the log; the row stays queued and OrphanSweep (orphan-sweep.ts) queues it once Redis
 * is back.
 */
export async function enqueueOrLeaveToSweep(
  added: Promise<unknown>,
  what: string,
  logger: Logger,
): Promise<void> {
  added.catch(() => undefined); // a failure after the wait is the sweep's business
  try {
    if ((await settlesWithin(added, ENQUEUE_WAIT_MS)) === 'timeout')
      logger.warn(`${what} stored; the queue did not answer, a worker's sweep will queue it`);
  } catch (error) {
    logger.warn(
      `${what} stored; queueing failed (${error instanceof Error ? error.message : String(error)}), a worker's sweep will queue it`,
    );
  }
}
