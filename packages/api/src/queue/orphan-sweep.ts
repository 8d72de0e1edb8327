import type { Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import type { Queue } from 'bullmq';

/** How often each worker sweeps: REQUEUE_INTERVAL_MS, default 30 s. */
export function requeueIntervalMs(env: NodeJS.ProcessEnv): number {
  const raw = env.REQUEUE_INTERVAL_MS;
  if (raw === undefined || raw === '') return 30_000;
  const ms = Number(raw);
  if (!Number.isInteger(ms) || ms < 100)
    throw new Error(`Invalid environment: REQUEUE_INTERVAL_MS: must be a whole number of milliseconds ≥ 100`);
  return ms;
}

/** A submit is given this long to queue its own job before a sweep steps in. */
const SUBMIT_GRACE_MS = 5_000;
const BATCH = 200;

/**
 * The row is the truth, the queue only a delivery: rows stored as queued whose job never reached Redis
 * (Redis was down at submit, or the API died between the two) are queued again by the worker, every
 * REQUEUE_INTERVAL_MS. Any number of workers may sweep at once; a row's id as job id keeps it one job.
 */
export abstract class OrphanSweep implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly intervalMs = requeueIntervalMs(process.env);
  private timer: NodeJS.Timeout | undefined;
  private running = false;

  protected abstract readonly logger: Logger;
  protected abstract readonly queue: Queue;
  /** Ids of rows still queued and created before `before`, oldest first, at most `limit`. */
  protected abstract queuedIds(before: Date, limit: number): Promise<string[]>;
  protected abstract enqueue(id: string): Promise<unknown>;

  onApplicationBootstrap(): void {
    const tick = () => {
      if (this.running) return;
      this.running = true;
      this.sweep()
        .catch((error: unknown) =>
          this.logger.warn(
            `re-queue sweep failed: ${error instanceof Error ? error.message : String(error)}`,
          ),
        )
        .finally(() => (this.running = false));
    };
    tick();
    this.timer = setInterval(tick, this.intervalMs);
  }

  onApplicationShutdown(): void {
    if (this.timer) clearInterval(this.timer);
  }

  /** Returns the ids it queued again. */
  async sweep(): Promise<string[]> {
    const requeued: string[] = [];
    for (const id of await this.queuedIds(new Date(Date.now() - SUBMIT_GRACE_MS), BATCH)) {
      if (await this.queue.getJob(id)) continue;
      await this.enqueue(id);
      requeued.push(id);
    }
    if (requeued.length > 0)
      this.logger.warn(
        `queued again ${requeued.length} job(s) that Redis did not have: ${requeued.join(', ')}`,
      );
    return requeued;
  }
}
