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

/** Why a sweep queued a row again: its job is not in Redis, or it ended there without finishing the row. */
export type OrphanReason = 'gone' | 'completed' | 'failed';

/**
 * The row is the truth, the queue only a delivery. Every REQUEUE_INTERVAL_MS each worker looks at the
 * rows still queued or running and queues again those whose job cannot finish them:
 *
 * - the job is not in Redis (Redis was down at submit, the API died between row and job, or Redis lost
 *   its data);
 * - the job ended in Redis (completed or failed) while the row is unfinished: the processor was cut off
 *   by an infrastructure error, e.g. the database went away mid-job. Such a job is removed first, since
 *   a job id can be added only once.
 *
 * A job that is waiting, delayed or active is left alone. Whether an active job's worker is alive is
 * told by BullMQ's job lock, a key `<prefix>:<queue>:<jobId>:lock` that the worker renews every half
 * lock duration while it runs the job: when the worker dies, the lock expires and BullMQ's stalled-job
 * check (which every worker runs every stalled interval) puts the job back in the waiting list, or marks
 * it failed after too many stalls, and then this sweep queues it again. Any number of workers may sweep
 * at once; a row's id as job id keeps it one job, and the processors' conditional writes keep a fit from
 * being recorded twice even if two workers end up computing it.
 */
export abstract class OrphanSweep implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly intervalMs = requeueIntervalMs(process.env);
  private timer: NodeJS.Timeout | undefined;
  private running = false;

  protected abstract readonly logger: Logger;
  protected abstract readonly queue: Queue;
  /** Ids of rows still queued or running and created before `before`, oldest first, at most `limit`. */
  protected abstract unfinishedIds(before: Date, limit: number): Promise<string[]>;
  /** Whether the row is still queued or running (read again just before acting). */
  protected abstract isUnfinished(id: string): Promise<boolean>;
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
    const reasons: string[] = [];
    for (const id of await this.unfinishedIds(new Date(Date.now() - SUBMIT_GRACE_MS), BATCH)) {
      const reason = await this.orphaned(id);
      if (reason === null || !(await this.isUnfinished(id))) continue;
      // 0 when the job is locked again: a worker took it after all.
      if (reason !== 'gone' && (await this.queue.remove(id)) === 0) continue;
      await this.enqueue(id);
      requeued.push(id);
      reasons.push(`${id} (${reason === 'gone' ? 'not in Redis' : `job ${reason}`})`);
    }
    if (requeued.length > 0)
      this.logger.warn(`queued again ${requeued.length} job(s): ${reasons.join(', ')}`);
    return requeued;
  }

  /** Null while the job can still finish its row: waiting, delayed, or active under a live lock. */
  private async orphaned(id: string): Promise<OrphanReason | null> {
    const state = await this.queue.getJobState(id);
    if (state === 'unknown') return 'gone';
    if (state === 'completed' || state === 'failed') return state;
    return null;
  }
}
