import { CHORD_SOURCE_VALUES, type ChordSourceValue } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const timedMarkSchema = z.object({ time: z.string(), sigmaSeconds: z.number() });

// As the server's chord view sends it: the station by its id in the event, times in UTC.
const chordResponseSchema = z.object({
  id: z.string(),
  station: z.string(),
  type: z.enum(['positive', 'negative']),
  disappearance: timedMarkSchema.nullable(),
  reappearance: timedMarkSchema.nullable(),
  start: z.string().nullable(),
  end: z.string().nullable(),
  timeOffsetSeconds: z.number(),
  source: z.enum(CHORD_SOURCE_VALUES).nullable(),
});

export interface TimedMark {
  time: string;
  sigmaSeconds: number;
}

export interface ChordRow {
  id: string;
  station: string;
  type: 'positive' | 'negative';
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
  start: string | null;
  end: string | null;
  timeOffsetSeconds: number;
  /** Where the chord's times came from (an import, a report, a timing, a hand edit, a CSV file). */
  source: ChordSourceValue | null;
}

export const chordsQueryKey = (eventId: string) => ['events', eventId, 'chords'] as const;

export function getChords(eventId: string, signal?: AbortSignal): Promise<ChordRow[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/chords`, {
    schema: z.array(chordResponseSchema),
    signal,
  });
}

export function chordsQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: chordsQueryKey(eventId),
    queryFn: ({ signal }) => getChords(eventId, signal),
  });
}

export function useChords(eventId: string) {
  return useQuery(chordsQueryOptions(eventId));
}
