import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const timingDefaultsSchema = z.object({
  speedKmPerS: z.number(),
  distanceKm: z.number(),
  exposureSeconds: z.number().nullable(),
  atUtc: z.string(),
  atFrom: z.enum(['report', 'chords', 'ephemeris']),
});

export type TimingDefaults = z.infer<typeof timingDefaultsSchema>;

/** The station's sky-plane speed, the body's distance and the station's exposure, from the event. */
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
