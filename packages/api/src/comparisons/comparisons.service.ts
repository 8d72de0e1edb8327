import { randomUUID } from 'node:crypto';
import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable } from '@nestjs/common';
import { validateEventFile } from '@limbus/schema';
import type { Queue } from 'bullmq';
import type { AuthUser } from '../auth/auth-user';
import { Body } from '../bodies/entities/body.entity';
import { bodyScope, type FitScope } from '../bodies/body-scope';
import { oneBodyIssues } from '../bodies/one-body';
import { ConflictError, NotFoundError, UnavailableError, ValidationError } from '../common/domain-errors';
import { comparisonCaptionDraft, renderComparisonFigureSvg } from '../exports/comparison-figure-svg';
import type { ExportFile } from '../exports/exports.service';
import { type Provenance, provenanceOf } from '../exports/provenance';
import { renderPdf, renderPng } from '../exports/raster';
import { EventsService } from '../events/events.service';
import { FitRun } from '../fits/entities/fit-run.entity';
import type { ComparisonFigureQuery, ComparisonQuery, JointPolePayload } from './comparison-schemas';
import { comparisonFit, type ComparisonFit, type ComparisonView } from './comparison-view';
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
    private readonly events: EventsService,
    @InjectQueue(JOINT_QUEUE) private readonly queue: Queue<JointJobData, JointJobResult>,
  ) {}

  scopeOfBody(bodyId: string): Promise<FitScope & { bodyId: string }> {
    return bodyScope(this.em, bodyId);
  }

  async comparison(scope: FitScope, query: ComparisonQuery): Promise<ComparisonView> {
    return (await this.load(scope, query)).view;
  }

  private async load(
    scope: FitScope,
    query: ComparisonQuery,
  ): Promise<{ view: ComparisonView; provenance: Provenance[] }> {
    const bodyId = scope.bodyId ?? query.bodyId;
    if (bodyId !== undefined && (await this.em.count(Body, { id: bodyId, team: scope.teamId })) === 0)
      throw new ValidationError([{ path: 'bodyId', message: 'no such body in this team' }]);
    const fits = await this.em.find(
      FitRun,
      {
        state: 'solved',
        ...(query.fits === 'all' ? {} : { reviewState: 'approved' as const }),
        event: {
          team: scope.teamId,
          state: 'active',
          ...(bodyId === undefined ? {} : { body: bodyId }),
          ...(query.events === null ? {} : { id: { $in: query.events } }),
        },
      },
      {
        populate: ['event', 'event.body', 'createdBy', 'solution', 'input'],
        orderBy: { createdAt: 'desc', id: 'desc' },
      },
    );
    const chosen =
      query.fits === 'latest-approved'
        ? fits.filter((f, i) => fits.findIndex((g) => g.event.id === f.event.id) === i)
        : fits;
    const bodies = new Map(chosen.map((f) => [f.event.body.id, f.event.body.name]));
    if (bodies.size > 1)
      throw new ValidationError([
        {
          path: query.events === null ? 'bodyId' : 'events',
          message: `these fits observe ${bodies.size} bodies (${[...bodies.values()].join(', ')}): compare one body at a time (choose it with bodyId, or open the body's page)`,
        },
      ]);
    const rows: Array<{ row: ComparisonFit; provenance: Provenance }> = [];
    for (const f of chosen) {
      const v = validateEventFile(JSON.parse(f.input), { stored: true });
      if (!v.ok || f.solution === null) continue;
      const current = (await this.events.detail(f.event.id)).dataSha256;
      rows.push({
        row: comparisonFit(f, f.event, v.event, f.solution, f.dataSha256 === current),
        provenance: provenanceOf(f),
      });
    }
    rows.sort(
      (a, b) =>
        (a.row.eventDateUtc ?? '').localeCompare(b.row.eventDateUtc ?? '') ||
        (a.row.finishedAt ?? '').localeCompare(b.row.finishedAt ?? ''),
    );
    const [only] = [...bodies];
    return {
      view: {
        teamId: scope.teamId,
        body: only === undefined ? null : { id: only[0], name: only[1] },
        selection: query.fits,
        ringLabels: [...new Set(rows.flatMap((r) => r.row.rings.map((g) => g.ring)))],
        fits: rows.map((r) => r.row),
      },
      provenance: rows.map((r) => r.provenance),
    };
  }

  /** The comparison as a figure; with `jointId`, that solved joint pole (of this team) is drawn too. */
  async figure(scope: FitScope, query: ComparisonFigureQuery): Promise<ExportFile> {
    const { view, provenance } = await this.load(scope, query);
    let joint: JointPoleDocument | null = null;
    if (query.jointId !== undefined) {
      if ((await this.teamOfJoint(query.jointId)) !== scope.teamId) throw new NotFoundError();
      const job = await this.getJoint(query.jointId);
      if (job.result === null)
        throw new ConflictError(`joint pole ${query.jointId} is ${job.state}, not solved`);
      joint = job.result;
    }
    const ring = joint?.ring ?? view.ringLabels[0] ?? null;
    const caption = comparisonCaptionDraft(
      view.body?.name ?? 'no body',
      view.selection,
      view.fits,
      ring,
      joint,
    );
    const input = { fits: view.fits, ring, joint, caption, provenance, widthMm: query.widthMm };
    const base = `limbus-comparison-${view.body?.id ?? scope.teamId}-${query.widthMm}mm`;
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

  /** Checks that every fit is this team's, solved and of one body, then queues the joint fit. */
  async submitJoint(user: AuthUser, scope: FitScope, body: JointPolePayload): Promise<{ id: string }> {
    const found = await this.em.find(
      FitRun,
      { id: { $in: body.fitIds }, event: { team: scope.teamId, state: 'active' } },
      { fields: ['id', 'state', 'event.body.name'] },
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
    const expected =
      scope.bodyId === undefined
        ? undefined
        : await this.em.findOneOrFail(Body, { id: scope.bodyId }, { fields: ['name'] });
    const ofBodies = body.fitIds.flatMap((id, k) => {
      const f = byId.get(id);
      return f === undefined ? [] : [{ path: `fitIds.${k}`, body: f.event.body }];
    });
    issues.push(...oneBodyIssues(ofBodies, expected));
    if (issues.length > 0) throw new ValidationError(issues);
    const bodyId = ofBodies[0]?.body.id;
    const id = randomUUID();
    const added = this.queue.add(
      'joint',
      {
        teamId: scope.teamId,
        ...(bodyId === undefined ? {} : { bodyId }),
        fitIds: body.fitIds,
        ring: body.ring ?? null,
        requestedBy: user.id,
      },
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
