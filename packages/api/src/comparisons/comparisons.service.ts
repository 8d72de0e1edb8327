import { randomUUID } from 'node:crypto';
import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable } from '@nestjs/common';
import { validateEventFile } from '@limbus/schema';
import type { Queue } from 'bullmq';
import type { AuthUser } from '../auth/auth-user';
import { NotFoundError, ValidationError } from '../common/domain-errors';
import { FitRun } from '../fits/entities/fit-run.entity';
import type { ComparisonQuery, JointPolePayload } from './comparison-schemas';
import { comparisonFit, type ComparisonView } from './comparison-view';
import type { JointPoleDocument } from './joint-pole';
import { JOINT_QUEUE, JOINT_RESULT_KEEP_SECONDS, type JointJobData } from './joint-queue';
import type { JointJobResult } from './joint-poles.processor';

export interface JointPoleView {
  id: string;
  state: 'queued' | 'running' | 'solved' | 'failed';
  fitIds: string[];
  ring: string | null;
  result: JointPoleDocument | null;
  /** Problems a person can fix, each naming the fit; or one line when the job itself broke. */
  issues: Array<{ path: string; message: string }>;
  createdAt: string;
}

@Injectable()
export class ComparisonsService {
  constructor(
    private readonly em: EntityManager,
    @InjectQueue(JOINT_QUEUE) private readonly queue: Queue<JointJobData, JointJobResult>,
  ) {}

  async comparison(teamId: string, query: ComparisonQuery): Promise<ComparisonView> {
    const fits = await this.em.find(
      FitRun,
      {
        state: 'solved',
        ...(query.fits === 'approved' ? { reviewState: 'approved' as const } : {}),
        event: {
          team: teamId,
          state: 'active',
          ...(query.events === null ? {} : { id: { $in: query.events } }),
        },
      },
      { populate: ['event', 'solution', 'input'], orderBy: { createdAt: 'asc', id: 'asc' } },
    );
    const rows = fits.flatMap((f) => {
      const v = validateEventFile(JSON.parse(f.input));
      if (!v.ok || f.solution === null) return [];
      return [comparisonFit(f, f.event, v.event, f.solution)];
    });
    rows.sort((a, b) => (a.eventDateUtc ?? '').localeCompare(b.eventDateUtc ?? ''));
    return {
      teamId,
      selection: query.fits,
      ringLabels: [...new Set(rows.flatMap((r) => r.rings.map((g) => g.ring)))],
      fits: rows,
    };
  }

  /** Checks that every fit is this team's and solved, then queues the joint fit. */
  async submitJoint(user: AuthUser, teamId: string, body: JointPolePayload): Promise<{ id: string }> {
    const found = await this.em.find(
      FitRun,
      { id: { $in: body.fitIds }, event: { team: teamId, state: 'active' } },
      { fields: ['id', 'state'] },
    );
    const byId = new Map(found.map((f) => [f.id, f]));
    const issues = body.fitIds.flatMap((id, k) => {
      const f = byId.get(id);
      if (f === undefined) return [{ path: `fitIds.${k}`, message: 'no such fit in this team' }];
      if (f.state !== 'solved') return [{ path: `fitIds.${k}`, message: `fit is ${f.state}, not solved` }];
      return [];
    });
    if (new Set(body.fitIds).size !== body.fitIds.length)
      issues.push({ path: 'fitIds', message: 'a fit is listed twice' });
    if (issues.length > 0) throw new ValidationError(issues);
    const id = randomUUID();
    await this.queue.add(
      'joint',
      { teamId, fitIds: body.fitIds, ring: body.ring ?? null, requestedBy: user.id },
      {
        jobId: id,
        // A joint fit is deterministic: a failure would fail again, so there is nothing to retry.
        attempts: 1,
        removeOnComplete: { age: JOINT_RESULT_KEEP_SECONDS },
        removeOnFail: { age: JOINT_RESULT_KEEP_SECONDS },
      },
    );
    return { id };
  }

  async getJoint(jointId: string): Promise<JointPoleView> {
    // State first, then the job: read the other way round, a job finishing in between would be seen
    // as completed without its return value.
    const state = await this.queue.getJobState(jointId);
    const job = await this.queue.getJob(jointId);
    if (!job || state === 'unknown') throw new NotFoundError();
    const view: JointPoleView = {
      id: jointId,
      state: 'queued',
      fitIds: job.data.fitIds,
      ring: job.data.ring,
      result: null,
      issues: [],
      createdAt: new Date(job.timestamp).toISOString(),
    };
    if (state === 'active') view.state = 'running';
    else if (state === 'failed') {
      view.state = 'failed';
      view.issues = [{ path: '(job)', message: job.failedReason || 'the joint fit stopped' }];
    } else if (state === 'completed') {
      const r = job.returnvalue;
      if (r === null || r === undefined) view.state = 'running';
      else if (r.ok) {
        view.state = 'solved';
        view.result = r.result;
      } else {
        view.state = 'failed';
        view.issues = r.issues;
      }
    }
    return view;
  }

  async teamOfJoint(jointId: string): Promise<string | null> {
    const job = await this.queue.getJob(jointId);
    return job?.data.teamId ?? null;
  }
}
