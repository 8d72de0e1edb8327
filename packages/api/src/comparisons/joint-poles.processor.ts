import { CreateRequestContext, EntityManager, MikroORM } from '@mikro-orm/mariadb';
import { Processor, WorkerHost } from '@nestjs/bullmq';
import { Logger } from '@nestjs/common';
import type { Job } from 'bullmq';
import type { FieldIssue } from '../common/domain-errors';
import { FitRun } from '../fits/entities/fit-run.entity';
import { JointInputProblems, jointPole, type JointPoleDocument } from './joint-pole';
import { JOINT_QUEUE, type JointJobData } from './joint-queue';

export type JointJobResult = { ok: true; result: JointPoleDocument } | { ok: false; issues: FieldIssue[] };

/** Runs in the worker process. Input problems are a result, not a crash: the view shows them per fit. */
@Processor(JOINT_QUEUE)
export class JointPolesProcessor extends WorkerHost {
  private readonly logger = new Logger(JointPolesProcessor.name);

  constructor(
    // CreateRequestContext looks for a property named `orm`.
    private readonly orm: MikroORM,
    private readonly em: EntityManager,
  ) {
    super();
  }

  @CreateRequestContext()
  async process(job: Job<JointJobData>): Promise<JointJobResult> {
    const { teamId, fitIds, ring } = job.data;
    const rows = await this.em.find(
      FitRun,
      { id: { $in: fitIds }, event: { team: teamId } },
      { fields: ['id', 'input'] },
    );
    const byId = new Map(rows.map((r) => [r.id, r]));
    const missing = fitIds.filter((id) => !byId.has(id));
    if (missing.length > 0)
      return { ok: false, issues: missing.map((id) => ({ path: `fit ${id}`, message: 'no longer exists' })) };
    try {
      const result = jointPole(
        fitIds.map((id) => ({ fitId: id, input: (byId.get(id) as FitRun).input })),
        ring,
      );
      this.logger.log(`joint pole ${job.id} solved over ${fitIds.length} fits`);
      return { ok: true, result };
    } catch (error) {
      if (error instanceof JointInputProblems) return { ok: false, issues: error.issues };
      throw error;
    }
  }
}
