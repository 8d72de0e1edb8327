import { CreateRequestContext, EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Processor, WorkerHost } from '@nestjs/bullmq';
import { Logger } from '@nestjs/common';
import { type Chi2Map, chi2MapSteps, GeometryInputError } from '@limbus/geometry';
import type { Job } from 'bullmq';
import { AuditService } from '../audit/audit.service';
import { solvedFitInput } from './chi2-maps.service';
import { CHI2_MAPS_QUEUE, type Chi2MapJobData } from './chi2-maps-queue';
import { Chi2MapRun } from './entities/chi2-map-run.entity';

/** How long the map computes before it lets the event loop run (lock renewal, progress writes). */
const SLICE_MS = 50;
/** Progress is written when it has grown by this many percent. */
const PROGRESS_STEP = 5;

function failureMessage(error: unknown): string {
  if (error instanceof GeometryInputError) return `${error.path}: ${error.detail}`;
  return `the map stopped: ${error instanceof Error ? error.message : String(error)}`;
}

/**
 * Runs in the worker. The map is computed a cell at a time (chi2MapSteps), giving the event loop back every
 * SLICE_MS so that BullMQ keeps renewing the job's lock through a map of tens of seconds; every write is
 * conditional on the row still being unfinished, as for fits.
 */
@Processor(CHI2_MAPS_QUEUE, { concurrency: 1 })
export class Chi2MapsProcessor extends WorkerHost {
  private readonly logger = new Logger(Chi2MapsProcessor.name);

  constructor(
    // CreateRequestContext looks for a property named `orm`.
    private readonly orm: MikroORM,
    private readonly em: EntityManager,
    private readonly audit: AuditService,
  ) {
    super();
  }

  @CreateRequestContext()
  async process(job: Job<Chi2MapJobData>): Promise<string> {
    const mapId = job.data.mapId;
    const row = await this.em.findOne(
      Chi2MapRun,
      { id: mapId },
      { populate: ['fit', 'fit.solution', 'fit.event'] },
    );
    if (!row) return 'gone';
    if (row.state === 'solved' || row.state === 'failed') return row.state;
    const unfinished = { id: mapId, state: { $in: ['queued' as const, 'running' as const] } };
    await this.em.nativeUpdate(Chi2MapRun, unfinished, {
      state: 'running',
      progress: 0,
      startedAt: new Date(),
    });

    let result: Chi2Map | null = null;
    let error: string | null = null;
    try {
      const { event, solution } = solvedFitInput(row.fit);
      const steps = chi2MapSteps(event, solution, row.request);
      let written = 0;
      let slice = Date.now();
      for (;;) {
        const step = steps.next();
        if (step.done) {
          result = step.value;
          break;
        }
        if (Date.now() - slice < SLICE_MS) continue;
        const percent = Math.floor((100 * step.value.done) / step.value.total);
        if (percent >= written + PROGRESS_STEP) {
          written = percent;
          await this.em.nativeUpdate(Chi2MapRun, unfinished, { progress: percent });
          await job.updateProgress(percent);
        } else {
          await new Promise((resolve) => setImmediate(resolve));
        }
        slice = Date.now();
      }
    } catch (caught) {
      error = failureMessage(caught);
    }
    const finishedAt = new Date();
    const written = await this.em.nativeUpdate(
      Chi2MapRun,
      unfinished,
      result
        ? { state: 'solved', progress: 100, result, error: null, finishedAt }
        : { state: 'failed', progress: 100, error, finishedAt },
    );
    if (written === 0) return 'already finished elsewhere';
    const state = result ? 'solved' : 'failed';
    this.audit.record(this.em, {
      teamId: row.fit.event.team.id,
      eventId: row.fit.event.id,
      actorId: null,
      action: `chi2-map.${state}`,
      objectType: 'chi2-map',
      objectId: row.id,
      detail: error ? { error } : { minChi2: result?.minChi2 ?? null },
    });
    await this.em.flush();
    this.logger.log(`χ² map ${row.id} ${state}`);
    return state;
  }
}
