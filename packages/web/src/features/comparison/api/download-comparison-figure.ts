import { figureQuery } from '@/components/figure-download';
import { z } from 'zod';
import { FIT_SELECTIONS } from './get-comparison';

export const comparisonFigureInputSchema = z.object({
  format: z.enum(['svg', 'pdf', 'png']),
  widthMm: z.number().min(40).max(300),
  dpi: z.union([z.literal(300), z.literal(600)]),
  selection: z.enum(FIT_SELECTIONS),
  jointId: z.string().nullable(),
});
export type ComparisonFigureInput = z.infer<typeof comparisonFigureInputSchema>;

export function comparisonFigureUrl(bodyId: string, input: ComparisonFigureInput): string {
  const v = comparisonFigureInputSchema.parse(input);
  const q = figureQuery(v, { fits: v.selection });
  if (v.jointId !== null) q.set('jointId', v.jointId);
  return `/api/bodies/${encodeURIComponent(bodyId)}/comparison/figure?${q.toString()}`;
}

export function comparisonFigureFileName(input: ComparisonFigureInput): string {
  return `limbus-comparison-${input.widthMm}mm${input.format === 'png' ? `-${input.dpi}dpi` : ''}.${input.format}`;
}
