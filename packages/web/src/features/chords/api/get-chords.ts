import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const timedMarkSchema = z.object({ time: z.string(), sigmaSeconds: z.number() });

// The server may name the station by its id in the event ("station", as in the event file) or by code.
const chordResponseSchema = z
  .object({
    id: z.string(),
    station: z.string().optional(),
    stationCode: z.string().optional(),
    type: z.enum(['positive', 'negative']),
    disappearance: timedMarkSchema.nullable().optional(),
    reappearance: timedMarkSchema.nullable().optional(),
    start: z.string().nullable().optional(),
    end: z.string().nullable().optional(),
    startUtc: z.string().nullable().optional(),
    endUtc: z.string().nullable().optional(),
    timeOffsetSeconds: z.number().default(0),
    source: z.string().optional(),
  })
  .transform((raw): ChordRow => ({
    id: raw.id,
    station: raw.station ?? raw.stationCode ?? '',
    type: raw.type,
    disappearance: raw.disappearance ?? null,
    reappearance: raw.reappearance ?? null,
    start: raw.start ?? raw.startUtc ?? null,
    end: raw.end ?? raw.endUtc ?? null,
    timeOffsetSeconds: raw.timeOffsetSeconds,
    source: raw.source ?? null,
  }));

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
  source: string | null;
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
