import { predictionOffsetSourceSchema, STATION_STATUSES } from '@limbus/schema/planning';
import { predictionSettingsSchema } from '@limbus/schema/prediction';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const TIME_SCALES = ['UTC', 'TT', 'TDB'] as const;

const ephemerisRowSchema = z.object({
  time: z.string(),
  raDeg: z.number(),
  decDeg: z.number(),
  distanceKm: z.number(),
});

export const stationSchema = z.object({
  id: z.string(),
  code: z.string(),
  latDeg: z.number(),
  lonDeg: z.number(),
  heightM: z.number(),
  observerId: z.string().nullable().optional(),
  observerName: z.string().nullable().optional(),
  apertureMm: z.number().nullable().optional(),
  camera: z.string().nullable().optional(),
  exposureSeconds: z.number().nullable().optional(),
  timeSource: z.string().nullable().optional(),
  /** Planned ahead or proposed by an observer; stations from before planning are observing. */
  status: z.enum(STATION_STATUSES).default('observing'),
  /** What an observer wrote with a proposed site. */
  notes: z.string().nullable().optional(),
});

export const eventDetailSchema = z.object({
  id: z.string(),
  title: z.string(),
  teamId: z.string(),
  bodyId: z.string(),
  bodyName: z.string(),
  bodyDesignation: z.string().nullable(),
  /** "YYYY-MM-DDThh:mm:ssZ": the moment the event is filed under (its date in lists). */
  eventTimeUtc: z.string(),
  /** SHA-256 of the event's data now; a fit whose own hash differs ran on older data. */
  dataSha256: z.string(),
  star: z.object({
    raDeg: z.number(),
    decDeg: z.number(),
    catalogEpochJyear: z.number().default(2016),
    pmRaCosDecMasPerYear: z.number().default(0),
    pmDecMasPerYear: z.number().default(0),
    parallaxMas: z.number().default(0),
    angularDiameterMas: z.number().nullable().optional(),
  }),
  ephemeris: z.object({ timeScale: z.enum(TIME_SCALES), rows: z.array(ephemerisRowSchema) }),
  earthRotation: z.object({ dut1Seconds: z.number() }).default({ dut1Seconds: 0 }),
  // The event answer may or may not embed its stations; a missing list is an event without stations.
  stations: z.array(stationSchema).default([]),
  /** The prediction settings (the event file's `prediction` section); absent or null while none are set. */
  prediction: predictionSettingsSchema.nullable().optional(),
  /** Which earlier fit the offset and its σ came from, when a coordinator took them from one. */
  predictionOffsetSource: predictionOffsetSourceSchema.nullable().optional(),
});

export type EventDetail = z.infer<typeof eventDetailSchema>;
export type EventStation = z.infer<typeof stationSchema>;
export type EphemerisRow = z.infer<typeof ephemerisRowSchema>;

export const eventQueryKey = (eventId: string) => ['events', eventId] as const;

export function getEvent(eventId: string, signal?: AbortSignal): Promise<EventDetail> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}`, { schema: eventDetailSchema, signal });
}

export function eventQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: eventQueryKey(eventId),
    queryFn: ({ signal }) => getEvent(eventId, signal),
  });
}

export function useEvent(eventId: string) {
  return useQuery(eventQueryOptions(eventId));
}
