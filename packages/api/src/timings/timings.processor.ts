import { createHash } from 'node:crypto';
import { CreateRequestContext, EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Processor, WorkerHost } from '@nestjs/bullmq';
import { Logger } from '@nestjs/common';
import type { Job } from 'bullmq';
import { AuditService } from '../audit/audit.service';
import { StorageService } from '../storage/storage.service';
import { LightCurveTiming } from './entities/light-curve-timing.entity';
import { runTiming, TimingInputError } from './run-timing';
import type { TimingView } from './timing-result';
import { TIMINGS_QUEUE, type TimingJobData } from './timings-queue';

/** Runs in the worker. Every write is conditional on the row still being unfinished, as for fits. */
@Processor(TIMINGS_QUEUE, { concurrency: 1 })
export class TimingsProcessor extends WorkerHost {
  private readonly logger = new Logger(TimingsProcessor.name);

  constructor(
    // CreateRequestContext looks for a property named `orm`.
    private readonly orm: MikroORM,
    private readonly em: EntityManager,
    private readonly storage: StorageService,
    private readonly audit: AuditService,
  ) {
    super();
  }

  @CreateRequestContext()
  async process(job: Job<TimingJobData>): Promise<string> {
    const timingId = job.data.timingId;
    const timing = await this.em.findOne(
      LightCurveTiming,
      { id: timingId },
      { populate: ['report', 'report.lightCurve', 'event'] },
    );
    if (!timing) return 'gone';
    if (timing.state === 'solved' || timing.state === 'failed') return timing.state;
    const unfinished = { id: timingId, state: { $in: ['queued' as const, 'running' as const] } };
    await this.em.nativeUpdate(LightCurveTiming, unfinished, { state: 'running' });

    let result: TimingView | null = null;
    let error: string | null = null;
    try {
      const upload = timing.report.lightCurve;
      if (!upload) throw new TimingInputError('the report no longer has a light curve');
      const bytes = await this.storage.get(upload.storageKey);
      if (createHash('sha256').update(bytes).digest('hex') !== timing.uploadSha256) {
        throw new TimingInputError('the light curve changed after the timing was asked for');
      }
      result = runTiming(bytes.toString('utf8'), timing.options);
    } catch (caught) {
      error =
        caught instanceof TimingInputError
          ? caught.message
          : `the timing stopped: ${caught instanceof Error ? caught.message : String(caught)}`;
    }
    const finishedAt = new Date();
    const written = await this.em.nativeUpdate(
      LightCurveTiming,
      unfinished,
      result ? { state: 'solved', result, error: null, finishedAt } : { state: 'failed', error, finishedAt },
    );
    if (written === 0) return 'already finished elsewhere';
    const state = result ? 'solved' : 'failed';
    this.audit.record(this.em, {
      teamId: timing.event.team.id,
      eventId: timing.event.id,
      actorId: null,
      action: `timing.${state}`,
      objectType: 'timing',
      objectId: timing.id,
      detail: error ? { error } : { dips: result?.dips.length ?? 0 },
    });
    await this.em.flush();
    this.logger.log(`timing ${timing.id} ${state}`);
    return state;
  }
}
