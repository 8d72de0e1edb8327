import { randomUUID } from 'node:crypto';
import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable } from '@nestjs/common';
import { validateEventFile } from '@limbus/schema';
import type { Queue } from 'bullmq';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, UnavailableError, ValidationError } from '../common/domain-errors';
import { comparisonCaptionDraft, renderComparisonFigureSvg } from '../exports/comparison-figure-svg';
import type { ExportFile } from '../exports/exports.service';
import { type Provenance, provenanceOf } from '../exports/provenance';
import { renderPdf, renderPng } from '../exports/raster';
import { FitRun } from '../fits/entities/fit-run.entity';
import { Team } from '../teams/entities/team.entity';
import type { ComparisonFigureQuery, ComparisonQuery, JointPolePayload } from './comparison-schemas';
import { comparisonFit, type ComparisonView } from './comparison-view';
import type { JointPoleDocument } from './joint-pole';
import { ENQUEUE_WAIT_MS, settlesWithin } from '../queue/bounded-enqueue';
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
    return (await this.load(teamId, query)).view;
  }

  private async load(
    teamId: string,
    query: ComparisonQuery,
  ): Promise<{ view: ComparisonView; provenance: Provenance[] }> {
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
      return [{ row: comparisonFit(f, f.event, v.event, f.solution), provenance: provenanceOf(f) }];
    });
    rows.sort((a, b) => (a.row.eventDateUtc ?? '').localeCompare(b.row.eventDateUtc ?? ''));
    return {
      view: {
        teamId,
        selection: query.fits,
        ringLabels: [...new Set(rows.flatMap((r) => r.row.rings.map((g) => g.ring)))],
        fits: rows.map((r) => r.row),
      },
      provenance: rows.map((r) => r.provenance),
    };
  }

  /** The comparison as a figure; with `jointId`, that solved joint pole (of this team) is drawn too. */
  async figure(teamId: string, query: ComparisonFigureQuery): Promise<ExportFile> {
    const { view, provenance } = await this.load(teamId, query);
    let joint: JointPoleDocument | null = null;
    if (query.jointId !== undefined) {
      if ((await this.teamOfJoint(query.jointId)) !== teamId) throw new NotFoundError();
      const job = await this.getJoint(query.jointId);
      if (job.result === null)
        throw new ConflictError(`joint pole ${query.jointId} is ${job.state}, not solved`);
      joint = job.result;
    }
    const team = await this.em.findOneOrFail(Team, { id: teamId }, { fields: ['name'] });
    const ring = joint?.ring ?? view.ringLabels[0] ?? null;
    const caption = comparisonCaptionDraft(team.name, view.selection, view.fits, ring, joint);
    const input = { fits: view.fits, ring, joint, caption, provenance, widthMm: query.widthMm };
    const base = `limbus-comparison-${teamId}-${query.widthMm}mm`;
    if (query.format === 'svg') {
      const { svg } = renderComparisonFigureSvg({ ...input, embedFont: true, sizeUnit: 'mm' });
      return { body: Buffer.from(svg, 'utf8'), contentType: 'image/svg+xml', fileName: `${base}.svg` };
    }
    if (query.format === 'png') {
      const { svg } = renderComparisonFigureSvg({ ...input, embedFont: false, sizeUnit: 'mm' });
      return {
        body: renderPng(svg, query.widthMm, query.dpi, provenance),
        contentType: 'image/png',
        fileName: `${base}-${query.dpi}dpi.png`,
      };
    }
    const fig = renderComparisonFigureSvg({ ...input, embedFont: false, sizeUnit: 'pt' });
    return {
      body: await renderPdf(fig.svg, fig.widthPt, fig.heightPt, provenance),
      contentType: 'application/pdf',
      fileName: `${base}.pdf`,
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
    const added = this.queue.add(
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
    // Nothing but the job records a joint fit, so without Redis there is nothing to keep: say so at once.
    // Should Redis take the job later after all, it is removed, as the caller was told.
    let outcome;
    try {
      outcome = await settlesWithin(added, ENQUEUE_WAIT_MS);
    } catch (error) {
      throw new UnavailableError(
        `The job queue refused the joint fit (${error instanceof Error ? error.message : String(error)}); nothing was queued, try again shortly`,
      );
    }
    if (outcome === 'timeout') {
      added.then((job) => job.remove()).catch(() => undefined);
      throw new UnavailableError(
        'The job queue (Redis) does not answer; nothing was queued, try again shortly',
      );
    }
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
