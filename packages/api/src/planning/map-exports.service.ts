import { Injectable } from '@nestjs/common';
import { ENGINE_VERSION } from '@limbus/geometry';
import { z } from 'zod';
import { sha256Hex } from '../common/tokens';
import { canonicalJson } from '../events/event-data';
import { FIGURE_FORMATS } from '../exports/export-query';
import { type FigureMeta, renderPdf, renderPng } from '../exports/raster';
import { renderPathMapSvg } from './map-svg';
import { pathGeoJson, pathKml } from './path-exports';
import type { PlanningSnapshot } from './prediction-cache';
import { predictionMapOf } from './prediction-map';
import { PredictionService } from './prediction.service';

/** A map is wider than a column of a paper: a full page width unless asked (common practice, no source). */
export const mapFigureQuerySchema = z.strictObject({
  format: z.enum(FIGURE_FORMATS),
  widthMm: z.coerce.number().min(40).max(300).default(180),
  dpi: z.enum(['300', '600']).transform(Number).default(300),
});
export type MapFigureQuery = z.infer<typeof mapFigureQuerySchema>;

export interface MapFile {
  body: Buffer;
  contentType: string;
  fileName: string;
}

/**
 * Where a map or path file came from: the event, the engine, and the SHA-256 of the event file it was
 * predicted from (prediction section included), so the CLI can reproduce it. The date is the closest
 * approach, so the same prediction gives the same bytes.
 */
export function mapMeta(snapshot: PlanningSnapshot): FigureMeta {
  const inputSha256 = sha256Hex(canonicalJson(snapshot.file));
  const entries: Array<[string, string]> = [
    ['eventId', snapshot.eventId],
    ['inputSha256', inputSha256],
    ['engineVersion', ENGINE_VERSION],
    ['closestApproachUtc', snapshot.prediction.closestApproach.timeUtc],
  ];
  return {
    title: 'Shadow path map',
    line: `Limbus prediction of event ${snapshot.eventId} · input SHA-256 ${inputSha256} · engine ${ENGINE_VERSION}`,
    entries,
    date: snapshot.prediction.closestApproach.timeUtc,
  };
}

@Injectable()
export class MapExportsService {
  constructor(private readonly predictions: PredictionService) {}

  async geoJson(eventId: string): Promise<MapFile> {
    const snapshot = await this.predictions.current(eventId);
    return {
      body: Buffer.from(pathGeoJson(predictionMapOf(snapshot), snapshot.settings.stepSeconds), 'utf8'),
      contentType: 'application/geo+json; charset=utf-8',
      fileName: `limbus-prediction-${eventId}.geojson`,
    };
  }

  async kml(eventId: string): Promise<MapFile> {
    const snapshot = await this.predictions.current(eventId);
    return {
      body: Buffer.from(pathKml(predictionMapOf(snapshot), snapshot.settings.stepSeconds), 'utf8'),
      contentType: 'application/vnd.google-earth.kml+xml; charset=utf-8',
      fileName: `limbus-prediction-${eventId}.kml`,
    };
  }

  async figure(eventId: string, query: MapFigureQuery): Promise<MapFile> {
    const snapshot = await this.predictions.current(eventId);
    const meta = mapMeta(snapshot);
    const base = `limbus-shadow-path-${eventId}-${query.widthMm}mm`;
    const input = {
      map: predictionMapOf(snapshot),
      stepSeconds: snapshot.settings.stepSeconds,
      widthMm: query.widthMm,
      meta,
    };
    if (query.format === 'svg') {
      const { svg } = renderPathMapSvg({ ...input, embedFont: true, sizeUnit: 'mm' });
      return { body: Buffer.from(svg, 'utf8'), contentType: 'image/svg+xml', fileName: `${base}.svg` };
    }
    if (query.format === 'png') {
      const { svg } = renderPathMapSvg({ ...input, embedFont: false, sizeUnit: 'mm' });
      return {
        body: renderPng(svg, query.widthMm, query.dpi, meta),
        contentType: 'image/png',
        fileName: `${base}-${query.dpi}dpi.png`,
      };
    }
    const figure = renderPathMapSvg({ ...input, embedFont: false, sizeUnit: 'pt' });
    return {
      body: await renderPdf(figure.svg, figure.widthPt, figure.heightPt, meta),
      contentType: 'application/pdf',
      fileName: `${base}.pdf`,
    };
  }
}
