import { type FigureSpec, figureQuery } from '@/components/figure-download';
import { apiBlob } from '@/lib/api-client';

const eventPath = (eventId: string) => `/api/events/${encodeURIComponent(eventId)}`;

/** The path as open-standard files: GeoJSON (RFC 7946) and KML (OGC 07-147r2), from the server. */
export const PATH_FILE_FORMATS = {
  geojson: { label: 'GeoJSON', suffix: 'geojson' },
  kml: { label: 'KML', suffix: 'kml' },
} as const;
export type PathFileFormat = keyof typeof PATH_FILE_FORMATS;

/** GET /api/events/:eventId/prediction.geojson or .kml: the map's lines, bands and stations. */
export function fetchPathFile(eventId: string, format: PathFileFormat): Promise<Blob> {
  return apiBlob(`${eventPath(eventId)}/prediction.${PATH_FILE_FORMATS[format].suffix}`);
}

/** GET /api/events/:eventId/prediction: the limbus-prediction/1 document the CLI prints for the event. */
export function fetchPredictionDocument(eventId: string): Promise<Blob> {
  return apiBlob(`${eventPath(eventId)}/prediction`);
}

/** The server's shadow-path figure (GET …/prediction/figure), drawn from the map description the page draws. */
export function mapFigureUrl(eventId: string, spec: FigureSpec): string {
  return `${eventPath(eventId)}/prediction/figure?${figureQuery(spec).toString()}`;
}

export function mapFigureFileName(fileStem: string, spec: FigureSpec): string {
  return `${fileStem}-shadow-path-${spec.widthMm}mm${spec.format === 'png' ? `-${spec.dpi}dpi` : ''}.${spec.format}`;
}
