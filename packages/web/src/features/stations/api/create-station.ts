import { lineText, TEXT_LIMITS } from '@limbus/schema/text';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const numberIn = (min: number, max: number, message: string) =>
  z.number({ error: message }).min(min, message).max(max, message);

const positiveOrNone = (what: string, unit: string) =>
  z
    .number({ error: `${what} must be a number (${unit})` })
    .positive(`${what} must be greater than zero`)
    .nullable();

const detailOrNone = (what: string) => lineText(TEXT_LIMITS.stationDetail, what).nullable();

// The event file's station limits (docs/file-formats.md, "Event file"); longitudes are east-positive.
// The observer is a member of the team (`observerId`) or, for someone without an account, a name.
export const stationInputSchema = z.object({
  code: lineText(TEXT_LIMITS.stationCode, 'station id'),
  latDeg: numberIn(-90, 90, 'latitude must be within ±90°'),
  lonDeg: numberIn(-180, 180, 'longitude must be within ±180° (east positive)'),
  heightM: z.number({ error: 'height must be a number (metres above the ellipsoid)' }),
  observerId: z.string().min(1).nullable(),
  observerName: detailOrNone('observer name'),
  apertureMm: positiveOrNone('aperture', 'millimetres'),
  camera: detailOrNone('camera'),
  exposureSeconds: positiveOrNone('exposure', 'seconds'),
  timeSource: detailOrNone('time source'),
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
