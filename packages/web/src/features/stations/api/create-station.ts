import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const numberIn = (min: number, max: number, message: string) =>
  z.number({ error: message }).min(min, message).max(max, message);

// The event file's station limits (docs/file-formats.md, "Event file"); longitudes are east-positive.
export const stationInputSchema = z.object({
  code: z.string().trim().min(1, 'station id must not be empty').max(100, 'at most 100 characters'),
  latDeg: numberIn(-90, 90, 'latitude must be within ±90°'),
  lonDeg: numberIn(-180, 180, 'longitude must be within ±180° (east positive)'),
  heightM: z.number({ error: 'height must be a number (metres above the ellipsoid)' }),
  observerName: z.string().trim().max(200, 'at most 200 characters').nullable(),
});

export type StationInput = z.infer<typeof stationInputSchema>;

/** The event answer carries its stations, so a change to them refreshes the event. */
export const eventKey = (eventId: string) => ['events', eventId] as const;

export function createStation(eventId: string, input: StationInput): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/stations`, { method: 'POST', body: input });
}

export function useCreateStation(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: StationInput) => createStation(eventId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: eventKey(eventId) }),
  });
}
