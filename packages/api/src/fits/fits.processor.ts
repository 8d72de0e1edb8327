import { CreateRequestContext, EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Processor, WorkerHost } from '@nestjs/bullmq';
import { Logger } from '@nestjs/common';
import { GeometryInputError, solveEvent, type Solution } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import type { Job } from 'bullmq';
import { AuditService } from '../audit/audit.service';
import { FITS_QUEUE } from '../queue/queue.module';
import { FitRun } from './entities/fit-run.entity';
import { NoticesService } from '../mail/notices.service';
import { fitLinkPath } from './fit-link';
import { fitWorkerOptions } from './fit-worker-options';
import type { FitJobData } from './fit-queue';
import { sha256Hex } from '../common/tokens';

const options = fitWorkerOptions(process.env);

/** What a person can act on: the geometry's own path and message, or what went wrong in general. */
export function failureMessage(error: unknown): string {
  if (error instanceof GeometryInputError) return `${error.path}: ${error.detail}`;
  if (error instanceof Error) return `the solve stopped: ${error.message}`;
  return `the solve stopped: ${String(error)}`;
}

/**
 * Runs in the worker process. Safe with several workers on several machines: everything it knows
 * comes from the row and the job, and every write is conditional on the fit still being unfinished,
 * so a job that BullMQ hands to a second worker after a stall cannot overwrite a finished result.
 */
@Processor(FITS_QUEUE, {
  concurrency: options.concurrency,
  stalledInterval: options.stalledIntervalMs,
  lockDuration: options.lockDurationMs,
  maxStalledCount: 5,
})
export class FitsProcessor extends WorkerHost {
  private readonly logger = new Logger(FitsProcessor.name);

  constructor(
    // CreateRequestContext looks for a property named `orm`.
    private readonly orm: MikroORM,
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly notices: NoticesService,
  ) {
    super();
  }

  @CreateRequestContext()
  async process(job: Job<FitJobData>): Promise<string> {
    const fitId = job.data.fitId;
    const fit = await this.em.findOne(FitRun, { id: fitId }, { populate: ['createdBy', 'event'] });
    if (!fit) return 'gone';
    if (fit.state === 'solved' || fit.state === 'failed') return fit.state;
    const unfinished = { id: fitId, state: { $in: ['queued' as const, 'running' as const] } };
    await this.em.nativeUpdate(FitRun, unfinished, {
      state: 'running',
      progress: 5,
      startedAt: new Date(),
      attempts: fit.attempts + 1,
    });
    await job.updateProgress(5);
    if (options.testDelayMs > 0) await new Promise((resolve) => setTimeout(resolve, options.testDelayMs));

    let solution: Solution | null = null;
    let error: string | null = null;
    try {
      if (sha256Hex(fit.input) !== fit.inputSha256)
        throw new Error('the stored input does not match its SHA-256');
      const validation = validateEventFile(JSON.parse(fit.input));
      if (!validation.ok)
        throw new Error(validation.problems.map((p) => `${p.path}: ${p.message}`).join('; '));
      await this.em.nativeUpdate(FitRun, unfinished, { progress: 20 });
      await job.updateProgress(20);
      solution = solveEvent(validation.event, { inputSha256: fit.inputSha256 });
    } catch (caught) {
      error = failureMessage(caught);
    }
    await job.updateProgress(90);
    const finishedAt = new Date();
    const state = solution ? 'solved' : 'failed';
    // The result and its audit entry are one transaction: a worker killed or a database lost between the
    // two would otherwise leave a finished fit that the audit never saw (and a retry would not add it).
    const written = await this.em.transactional(async (em) => {
      const updated = await em.nativeUpdate(
        FitRun,
        unfinished,
        solution
          ? { state: 'solved', progress: 100, solution, error: null, finishedAt }
          : { state: 'failed', progress: 100, error, finishedAt },
      );
      if (updated === 0) return 0;
      this.audit.record(em, {
        teamId: fit.event.team.id,
        eventId: fit.event.id,
        actorId: null,
        action: `fit.${state}`,
        objectType: 'fit',
        objectId: fit.id,
        detail: error ? { error } : { engineVersion: solution?.engine.version ?? null },
      });
      return updated;
    });
    if (written === 0) return 'already finished elsewhere';
    this.logger.log(`fit ${fit.id} ${state}`);
    await this.notices.deliver({
      kind: 'fit-finished',
      to: [fit.createdBy.id],
      subject: solution ? `Fit solved: ${fit.event.title}` : `Fit failed: ${fit.event.title}`,
      lines: solution
        ? [`Your fit of "${fit.event.title}" is solved.`]
        : [`Your fit of "${fit.event.title}" failed.`, `Reason: ${error ?? 'unknown'}`],
      link: { path: fitLinkPath(fit.event.id, fit.id), label: 'Open the fit' },
    });
    return state;
  }
}
