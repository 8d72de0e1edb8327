// Query strings of the export routes. Widths are those journals ask for (a single column is about 88 mm,
// two columns about 180 mm: common practice, no source); any width from 40 to 300 mm is allowed.
import { z } from 'zod';

export const FIGURE_FORMATS = ['svg', 'pdf', 'png'] as const;
export const TABLE_FORMATS = ['csv', 'json', 'tex'] as const;
export const SINGLE_COLUMN_MM = 88;
export const DOUBLE_COLUMN_MM = 180;

export const figureQuerySchema = z.strictObject({
  format: z.enum(FIGURE_FORMATS),
  widthMm: z.coerce.number().min(40).max(300).default(SINGLE_COLUMN_MM),
  dpi: z.enum(['300', '600']).transform(Number).default(300),
});
export type FigureQuery = z.infer<typeof figureQuerySchema>;

export const tableQuerySchema = z.strictObject({ format: z.enum(TABLE_FORMATS) });
export type TableQuery = z.infer<typeof tableQuerySchema>;

/** Content types of the table formats, for every route that serves one. */
export const TABLE_TYPES: Record<TableQuery['format'], string> = {
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
  tex: 'application/x-tex; charset=utf-8',
};
