import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const timingDefaultsSchema = z.object({
  speedKmPerS: z.number(),
  distanceKm: z.number(),
  exposureSeconds: z.number().nullable(),
  atUtc: z.string(),
  atFrom: z.enum(['report', 'chords', 'ephemeris']),
  /** Each edge's limb-normal speed: from the latest solved fit, the prediction's circle, or the full speed. */
  edgeSpeeds: z.object({
    disappearanceKmPerS: z.number(),
    reappearanceKmPerS: z.number(),
    from: z.enum(['fit', 'prediction', 'full']),
    fitId: z.string().nullable(),
    note: z.string(),
  }),
  /** The latest solved fit's rings, whose opening angle turns a dip's optical depth normal. */
  rings: z.array(
    z.object({
      ring: z.string(),
      openingAngleDeg: z.number(),
      openingAngleSigmaDeg: z.number(),
      fitId: z.string(),
    }),
  ),
});

export type TimingDefaults = z.infer<typeof timingDefaultsSchema>;

/** The station's sky-plane speed, each edge's, the body's distance and the station's exposure, from the event. */
export function useTimingDefaults(eventId: string, reportId: string) {
  return useQuery({
    queryKey: ['events', eventId, 'reports', reportId, 'timing-defaults'],
    queryFn: ({ signal }) =>
      apiRequest(
        `/api/events/${encodeURIComponent(eventId)}/reports/${encodeURIComponent(reportId)}/timing-defaults`,
        { schema: timingDefaultsSchema, signal },
      ),
  });
}
