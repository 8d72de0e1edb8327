import { EntityManager } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger } from '@nestjs/common';
import {
  chi2MapParameters,
  type EventInput,
  GeometryInputError,
  planChi2Map,
  type Solution,
} from '@limbus/geometry';
import {
  type Chi2MapList,
  type Chi2MapRequestPayload,
  type Chi2MapView,
  validateEventFile,
} from '@limbus/schema';
import type { Queue } from 'bullmq';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import type { ExportFile } from '../exports/exports.service';
import { renderChi2MapSvg } from '../exports/chi2-map-figure-svg';
import type { FigureQuery, TableQuery } from '../exports/export-query';
import { TABLE_TYPES } from '../exports/export-query';
import { provenanceEntries, provenanceLine, provenanceOf } from '../exports/provenance';
import { type FigureMeta, renderPdf, renderPng } from '../exports/raster';
import type { FitRun } from '../fits/entities/fit-run.entity';
import { FitsService } from '../fits/fits.service';
import { enqueueOrLeaveToSweep } from '../queue/bounded-enqueue';
import { User } from '../users/entities/user.entity';
import { chi2MapCaption } from './chi2-map-caption';
import { chi2MapCsv, chi2MapJson, chi2MapSummary, chi2MapView, mapEntries } from './chi2-map-view';
import { CHI2_MAPS_QUEUE, type Chi2MapJobData, enqueueChi2Map } from './chi2-maps-queue';
import { Chi2MapRun } from './entities/chi2-map-run.entity';

/** The stored event file and solution of a solved fit: what a map is computed from. */
export function solvedFitInput(fit: FitRun): { event: EventInput; solution: Solution } {
  if (fit.state !== 'solved' || fit.solution === null)
    throw new ConflictError(`fit ${fit.id} is ${fit.state}; only a solved fit has χ² maps`);
  const validation = validateEventFile(JSON.parse(fit.input), { stored: true });
  if (!validation.ok) throw new Error(`stored input of fit ${fit.id} no longer validates`);
  return { event: validation.event, solution: fit.solution };
}

/** χ² maps of solved fits: asked for here, computed by the worker (Chi2MapsProcessor), read and downloaded here. */
@Injectable()
export class Chi2MapsService {
  private readonly logger = new Logger(Chi2MapsService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly fits: FitsService,
    private readonly audit: AuditService,
    @InjectQueue(CHI2_MAPS_QUEUE) private readonly queue: Queue<Chi2MapJobData>,
  ) {}

  /**
   * Checks the two parameters, ranges and steps against the fit (400 naming the field, as the geometry
   * words it), stores the row and queues its job. A fit that is not solved answers 409.
   */
  async submit(user: AuthUser, fitId: string, body: Chi2MapRequestPayload): Promise<{ id: string }> {
    const fit = await this.fits.find(fitId, true);
    const { event, solution } = solvedFitInput(fit);
    try {
      planChi2Map(solution, event, body);
    } catch (error) {
      if (error instanceof GeometryInputError)
        throw new ValidationError([{ path: error.path, message: error.detail }]);
      throw error;
    }
    const row = new Chi2MapRun(fit, this.em.getReference(User, user.id), body);
    await this.em.transactional(async (em) => {
      em.persist(row);
      this.audit.record(em, {
        teamId: fit.event.team.id,
        eventId: fit.event.id,
        actorId: user.id,
        action: 'chi2-map.submit',
        objectType: 'chi2-map',
        objectId: row.id,
        detail: { fitId, request: body },
      });
      await em.flush();
    });
    await enqueueOrLeaveToSweep(enqueueChi2Map(this.queue, row.id), `χ² map ${row.id}`, this.logger);
    return { id: row.id };
  }

  /** The parameters a map of this fit can take (none before it is solved) and its maps, newest first. */
  async list(fitId: string): Promise<Chi2MapList> {
    const fit = await this.fits.find(fitId, true);
    const parameters =
      fit.state === 'solved' && fit.solution !== null
        ? chi2MapParameters(fit.solution, solvedFitInput(fit).event)
        : [];
    const rows = await this.em.find(
      Chi2MapRun,
      { fit },
      { populate: ['createdBy'], orderBy: { createdAt: 'desc', id: 'desc' } },
    );
    return { parameters, maps: rows.map(chi2MapSummary) };
  }

  private async row(fitId: string, mapId: string): Promise<Chi2MapRun> {
    const fit = await this.fits.find(fitId);
    const row = await this.em.findOne(
      Chi2MapRun,
      { id: mapId, fit },
      { populate: ['createdBy', 'result', 'fit'] },
    );
    if (!row) throw new NotFoundError('No such χ² map of this fit');
    return row;
  }

  async get(fitId: string, mapId: string): Promise<Chi2MapView> {
    return chi2MapView(await this.row(fitId, mapId));
  }

  /** A solved map with everything its downloads say about where it came from. */
  private async solved(fitId: string, mapId: string) {
    const row = await this.row(fitId, mapId);
    if (row.state !== 'solved' || row.result === null)
      throw new ConflictError(`χ² map ${mapId} is ${row.state}; only a solved map can be downloaded`);
    const fit = await this.fits.find(fitId);
    const provenance = provenanceOf(fit);
    const entries = [...provenanceEntries(provenance), ...mapEntries(row.id, row.result)];
    const meta: FigureMeta = {
      title: `Profile χ² of ${row.result.x.parameter} and ${row.result.y.parameter}`,
      line: `${provenanceLine(provenance)} · χ² map ${row.id}`,
      entries,
      date: (row.finishedAt ?? row.createdAt).toISOString(),
    };
    return { row, map: row.result, entries, meta, title: fit.event.title };
  }

  async table(fitId: string, mapId: string, query: TableQuery): Promise<ExportFile> {
    if (query.format === 'tex')
      throw new ValidationError([{ path: 'format', message: 'a map is csv or json' }]);
    const { map, entries } = await this.solved(fitId, mapId);
    const text = query.format === 'csv' ? chi2MapCsv(map, entries) : chi2MapJson(map, entries);
    return {
      body: Buffer.from(text, 'utf8'),
      contentType: TABLE_TYPES[query.format],
      fileName: `limbus-chi2-map-${mapId}.${query.format}`,
    };
  }

  async figure(fitId: string, mapId: string, query: FigureQuery): Promise<ExportFile> {
    const { map, meta, title } = await this.solved(fitId, mapId);
    const base = `limbus-chi2-map-${mapId}-${query.widthMm}mm`;
    const input = { map, meta, caption: chi2MapCaption(title, map), widthMm: query.widthMm };
    if (query.format === 'svg') {
      const { svg } = renderChi2MapSvg({ ...input, embedFont: true, sizeUnit: 'mm' });
      return { body: Buffer.from(svg, 'utf8'), contentType: 'image/svg+xml', fileName: `${base}.svg` };
    }
    if (query.format === 'png') {
      const { svg } = renderChi2MapSvg({ ...input, embedFont: false, sizeUnit: 'mm' });
      return {
        body: renderPng(svg, query.widthMm, query.dpi, meta),
        contentType: 'image/png',
        fileName: `${base}-${query.dpi}dpi.png`,
      };
    }
    const fig = renderChi2MapSvg({ ...input, embedFont: false, sizeUnit: 'pt' });
    return {
      body: await renderPdf(fig.svg, fig.widthPt, fig.heightPt, meta),
      contentType: 'application/pdf',
      fileName: `${base}.pdf`,
    };
  }
}
