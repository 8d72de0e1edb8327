import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { EventInput, Solution } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import { ConflictError } from '../common/domain-errors';
import type { FitRun } from '../fits/entities/fit-run.entity';
import { FitsService } from '../fits/fits.service';
import { type RingFitAgainstContext, ringFitsAgainst } from '../dynamics/dynamics-view';
import { DynamicsContext } from '../dynamics/entities/dynamics-context.entity';
import { captionDraft } from './caption';
import { dynamicsCaption, dynamicsRows } from './dynamics-context';
import { type FigureQuery, TABLE_TYPES, type TableQuery } from './export-query';
import { renderFitFigureSvg } from './figure-svg';
import { type Provenance, provenanceOf } from './provenance';
import { renderPdf, renderPng } from './raster';
import { samplerRows } from './sampler-rows';
import { parameterRows, tableCsv, tableJson, tableTex } from './table';

export interface ExportFile {
  body: Buffer;
  contentType: string;
  fileName: string;
}

interface SolvedFit {
  event: EventInput;
  solution: Solution;
  provenance: Provenance;
  /** The fit's rings against the event's stored body context; empty when none is stored. */
  dynamics: RingFitAgainstContext[];
}

/** Figures and tables of one stored fit: everything comes from the fit row, so repeats give equal bytes. */
@Injectable()
export class ExportsService {
  constructor(
    private readonly fits: FitsService,
    private readonly em: EntityManager,
  ) {}

  private async solved(fitId: string): Promise<SolvedFit> {
    const fit: FitRun = await this.fits.find(fitId, true);
    if (fit.state !== 'solved' || fit.solution === null)
      throw new ConflictError(`fit ${fitId} is ${fit.state}; only a solved fit has figures and tables`);
    const validation = validateEventFile(JSON.parse(fit.input), { stored: true });
    if (!validation.ok) throw new Error(`stored input of fit ${fitId} no longer validates`);
    const context = await this.em.findOne(DynamicsContext, { body: fit.event.body.id });
    const dynamics =
      context === null ? [] : ringFitsAgainst(context.document, { id: fit.id, rings: fit.solution.rings });
    return { event: validation.event, solution: fit.solution, provenance: provenanceOf(fit), dynamics };
  }

  async figure(fitId: string, query: FigureQuery): Promise<ExportFile> {
    const { event, solution, provenance, dynamics } = await this.solved(fitId);
    const caption = [captionDraft(event.title, solution, event.fit), dynamicsCaption(dynamics)]
      .filter((text) => text !== '')
      .join(' ');
    const base = `limbus-fit-${fitId}-${query.widthMm}mm`;
    const input = { solution, caption, provenance, widthMm: query.widthMm };
    if (query.format === 'svg') {
      const { svg } = renderFitFigureSvg({ ...input, embedFont: true, sizeUnit: 'mm' });
      return { body: Buffer.from(svg, 'utf8'), contentType: 'image/svg+xml', fileName: `${base}.svg` };
    }
    if (query.format === 'png') {
      const { svg } = renderFitFigureSvg({ ...input, embedFont: false, sizeUnit: 'mm' });
      return {
        body: renderPng(svg, query.widthMm, query.dpi, provenance),
        contentType: 'image/png',
        fileName: `${base}-${query.dpi}dpi.png`,
      };
    }
    const fig = renderFitFigureSvg({ ...input, embedFont: false, sizeUnit: 'pt' });
    return {
      body: await renderPdf(fig.svg, fig.widthPt, fig.heightPt, provenance),
      contentType: 'application/pdf',
      fileName: `${base}.pdf`,
    };
  }

  async table(fitId: string, query: TableQuery): Promise<ExportFile> {
    const { event, solution, provenance, dynamics } = await this.solved(fitId);
    const rows = [...parameterRows(solution, event.fit), ...samplerRows(solution), ...dynamicsRows(dynamics)];
    const text =
      query.format === 'csv'
        ? tableCsv(rows, provenance)
        : query.format === 'json'
          ? tableJson(rows, provenance)
          : tableTex(rows, provenance);
    return {
      body: Buffer.from(text, 'utf8'),
      contentType: TABLE_TYPES[query.format],
      fileName: `limbus-fit-${fitId}.${query.format}`,
    };
  }
}
