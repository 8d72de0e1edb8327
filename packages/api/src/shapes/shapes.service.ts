import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable } from '@nestjs/common';
import { fitShape, GeometryInputError, type ShapeEventInput, type ShapeFitResult } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import type { Queue } from 'bullmq';
import { type FieldIssue, ValidationError } from '../common/domain-errors';
import { JOINT_QUEUE, type JointJobData } from '../comparisons/joint-queue';
import type { JointJobResult } from '../comparisons/joint-poles.processor';
import { Body } from '../bodies/entities/body.entity';
import { bodyScope, type FitScope } from '../bodies/body-scope';
import { oneBodyIssues } from '../bodies/one-body';
import { FitRun } from '../fits/entities/fit-run.entity';
import type { ShapePayload } from './shape-schemas';
import { shapeEventOf } from './shape-input';
import { shapeTable } from './shape-table';
import type { TableQuery } from '../exports/export-query';

export interface ShapeView {
  /** The pole used, and where it came from. */
  pole: { raDeg: number; decDeg: number; source: 'entered' | 'joint ring pole'; jointPoleId: string | null };
  fits: Array<{ fitId: string; eventTitle: string; seenUtc: string; emittedUtc: string }>;
  result: ShapeFitResult;
  /** Assumptions a reader must see beside the numbers (the equilibrium caution is in result.equilibrium). */
  cautions: string[];
}

const RING_POLE_CAUTION =
  'The spin pole is taken as the joint ring pole: this assumes the ring lies in the equatorial plane.';

@Injectable()
export class ShapesService {
  constructor(
    private readonly em: EntityManager,
    @InjectQueue(JOINT_QUEUE) private readonly joint: Queue<JointJobData, JointJobResult>,
  ) {}

  private async pole(teamId: string, pole: ShapePayload['pole']): Promise<ShapeView['pole']> {
    if ('raDeg' in pole) return { ...pole, source: 'entered', jointPoleId: null };
    const id = pole.fromJointPoleId;
    const state = await this.joint.getJobState(id);
    const job = await this.joint.getJob(id);
    // Another team's job is answered as a missing one, as the joint-pole route does.
    if (!job || state === 'unknown' || job.data.teamId !== teamId)
      throw new ValidationError([
        { path: 'pole.fromJointPoleId', message: 'no such joint pole in this team' },
      ]);
    const r = state === 'completed' ? job.returnvalue : null;
    if (r === null || r === undefined || !r.ok)
      throw new ValidationError([{ path: 'pole.fromJointPoleId', message: 'joint pole is not solved' }]);
    return { ...r.result.pole, source: 'joint ring pole', jointPoleId: id };
  }

  scopeOfBody(bodyId: string): Promise<FitScope & { bodyId: string }> {
    return bodyScope(this.em, bodyId);
  }

  async fit(scope: FitScope, body: ShapePayload): Promise<ShapeView> {
    const teamId = scope.teamId;
    const issues: FieldIssue[] = [];
    if (new Set(body.fitIds).size !== body.fitIds.length)
      issues.push({ path: 'fitIds', message: 'a fit is listed twice' });
    const found = await this.em.find(
      FitRun,
      { id: { $in: body.fitIds }, event: { team: teamId, state: 'active' } },
      { populate: ['event', 'event.body', 'solution', 'input'] },
    );
    const byId = new Map(found.map((f) => [f.id, f]));
    const expected =
      scope.bodyId === undefined
        ? undefined
        : await this.em.findOneOrFail(Body, { id: scope.bodyId }, { fields: ['name'] });
    const mixed = oneBodyIssues(
      body.fitIds.flatMap((id, k) => {
        const f = byId.get(id);
        return f === undefined ? [] : [{ path: `fitIds.${k}`, body: f.event.body }];
      }),
      expected,
    );
    if (mixed.length > 0) throw new ValidationError([...issues, ...mixed]);
    const events: ShapeEventInput[] = [];
    const fits: ShapeView['fits'] = [];
    body.fitIds.forEach((id, k) => {
      const path = `fitIds.${k}`;
      const f = byId.get(id);
      if (f === undefined) return void issues.push({ path, message: 'no such fit in this team' });
      if (f.state !== 'solved' || f.solution === null)
        return void issues.push({ path, message: `fit is ${f.state}, not solved` });
      const v = validateEventFile(JSON.parse(f.input), { stored: true });
      if (!v.ok) throw new Error(`stored input of fit ${id} no longer validates`);
      const made = shapeEventOf(
        { fitId: id, eventTitle: f.event.title, event: v.event, solution: f.solution },
        path,
      );
      if (!made.ok) return void issues.push(made.issue);
      events.push(made.input);
      fits.push({
        fitId: id,
        eventTitle: f.event.title,
        seenUtc: f.solution.astrometry?.referenceTimeUtc ?? made.input.timeUtc,
        emittedUtc: made.input.timeUtc,
      });
    });
    // The pole is checked before refusing, so one answer names every problem of the request.
    let pole: ShapeView['pole'] | null = null;
    try {
      pole = await this.pole(teamId, body.pole);
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      issues.push(...error.issues);
    }
    if (issues.length > 0 || pole === null) throw new ValidationError(issues);
    let result: ShapeFitResult;
    try {
      result = fitShape({
        events,
        pole: { raDeg: pole.raDeg, decDeg: pole.decDeg },
        rotation: {
          periodHours: body.periodHours,
          ...(body.periodHoursSigma === undefined ? {} : { periodHoursSigma: body.periodHoursSigma }),
          referenceEpochUtc: body.epochUtc,
          ...(body.phaseDeg === undefined ? {} : { phaseDeg: body.phaseDeg }),
        },
        model: body.model,
      });
    } catch (error) {
      if (error instanceof GeometryInputError)
        throw new ValidationError([{ path: payloadPath(error.path), message: error.detail }]);
      throw error;
    }
    // The fit's own cautions (χ²/dof above 3, an axis order that had to be held) go beside the pole's.
    const cautions = [...(pole.source === 'joint ring pole' ? [RING_POLE_CAUTION] : []), ...result.cautions];
    return { pole, fits, result, cautions };
  }

  /** The same fit as a table for a paper, with the fits' hashes and approval states as provenance. */
  async table(scope: FitScope, body: ShapePayload, format: TableQuery['format']): Promise<string> {
    const view = await this.fit(scope, body);
    const runs = await this.em.fork().find(FitRun, { id: { $in: body.fitIds } });
    return shapeTable(view, new Map(runs.map((run) => [run.id, run])), format);
  }
}

/** The geometry names its own input ("events[2]", "rotation.periodHours"); the caller sent the payload. */
function payloadPath(geometryPath: string): string {
  return geometryPath
    .replace(/^events\[(\d+)\]/, 'fitIds.$1')
    .replace(/^rotation\.referenceEpochUtc$/, 'epochUtc')
    .replace(/^rotation\./, '');
}
