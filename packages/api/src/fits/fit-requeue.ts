import { CreateRequestContext, EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import type { Queue } from 'bullmq';
import { FITS_QUEUE } from '../queue/queue.module';
import { FitRun } from './entities/fit-run.entity';
import { enqueueFit, type FitJobData } from './fit-queue';
import { fitWorkerOptions } from './fit-worker-options';

/** A submit is given this long to queue its own job before a sweep steps in. */
const SUBMIT_GRACE_MS = 5_000;
const BATCH = 200;

/**
 * The row is the truth, the queue only a delivery: a fit stored as queued whose job never reached
 * Redis (Redis was down at submit, or the API died between the two) is queued again by the worker.
 * Any number of workers may sweep at once; the fit id as job id keeps it one job.
 */
@Injectable()
export class FitRequeue implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(FitRequeue.name);
  private readonly intervalMs = fitWorkerOptions(process.env).requeueIntervalMs;
  private timer: NodeJS.Timeout | undefined;
  private running = false;

  constructor(
    // CreateRequestContext looks for a property named `orm`.
    private readonly orm: MikroORM,
    private readonly em: EntityManager,
    @InjectQueue(FITS_QUEUE) private readonly queue: Queue<FitJobData>,
  ) {}

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
  @CreateRequestContext()
  async sweep(): Promise<string[]> {
    const stale = await this.em.find(
      FitRun,
      { state: 'queued', createdAt: { $lt: new Date(Date.now() - SUBMIT_GRACE_MS) } },
      { fields: ['id'], orderBy: { createdAt: 'asc' }, limit: BATCH },
    );
    const requeued: string[] = [];
    for (const fit of stale) {
      if (await this.queue.getJob(fit.id)) continue;
      await enqueueFit(this.queue, fit.id);
      requeued.push(fit.id);
    }
    if (requeued.length > 0)
      this.logger.warn(`queued again ${requeued.length} fit(s) that had no job: ${requeued.join(', ')}`);
    return requeued;
  }
}
