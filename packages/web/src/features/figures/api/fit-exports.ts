import { type FigureSpec, figureQuery } from '@/components/figure-download';
import type { TableFormat } from '@/components/table-download';
import { apiBlob } from '@/lib/api-client';

/** The server's sky-plane figure of one fit (GET /api/fits/:fitId/figure); dpi only for PNG. */
export function fitFigureUrl(fitId: string, spec: FigureSpec): string {
  return `/api/fits/${encodeURIComponent(fitId)}/figure?${figureQuery(spec).toString()}`;
}

export function fitFigureFileName(fileStem: string, spec: FigureSpec): string {
  return `${fileStem}-sky-plane-${spec.widthMm}mm${spec.format === 'png' ? `-${spec.dpi}dpi` : ''}.${spec.format}`;
}

/** Every parameter of the fit with 1σ and units (GET /api/fits/:fitId/table). */
export function fetchFitTable(fitId: string, format: TableFormat): Promise<Blob> {
  return apiBlob(`/api/fits/${encodeURIComponent(fitId)}/table?format=${format}`);
}
