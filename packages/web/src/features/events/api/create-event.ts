import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { eventsQueryKey } from './get-events';
import { apiRequest } from '@/lib/api-client';

const ZONELESS = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?$/;

const rowSchema = z.object({
  time: z.string().regex(ZONELESS, 'time must look like 2028-03-14T02:10:00 (no zone; the scale is chosen)'),
  raDeg: z
    .number({ error: 'RA must be a number' })
    .min(0, 'RA must be within 0–360°')
    .max(360, 'RA must be within 0–360°'),
  decDeg: z
    .number({ error: 'Dec must be a number' })
    .min(-90, 'Dec must be within ±90°')
    .max(90, 'Dec must be within ±90°'),
  distanceKm: z.number({ error: 'distance must be a number' }).positive('distance must be greater than zero'),
});

// The event file's limits (docs/file-formats.md, "Event file"); stations and chords are added afterwards.
export const createEventInputSchema = z.object({
  teamId: z.string().min(1).optional(),
  title: z.string().trim().min(1, 'title must not be empty').max(300, 'at most 300 characters'),
  star: z.object({
    raDeg: z
      .number({ error: 'RA must be a number' })
      .min(0, 'RA must be within 0–360°')
      .max(360, 'RA must be within 0–360°'),
    decDeg: z
      .number({ error: 'Dec must be a number' })
      .min(-90, 'Dec must be within ±90°')
      .max(90, 'Dec must be within ±90°'),
  }),
  ephemeris: z.object({
    timeScale: z.enum(['UTC', 'TT', 'TDB']),
    rows: z
      .array(rowSchema)
      .min(4, 'at least 4 rows are needed (the position is interpolated by a cubic spline)'),
  }),
});

export type CreateEventInput = z.infer<typeof createEventInputSchema>;

/** "time, RA, Dec, distance" per line, commas or spaces between; blank lines are skipped. */
export function parseEphemerisLines(
  text: string,
): Array<{ time: string; raDeg: number; decDeg: number; distanceKm: number }> {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line !== '')
    .map((line) => {
      const [time = '', ra = '', dec = '', distance = ''] = line.split(/[\s,;]+/);
      const num = (s: string) => (s === '' ? Number.NaN : Number(s));
      return { time, raDeg: num(ra), decDeg: num(dec), distanceKm: num(distance) };
    });
}

const createdSchema = z.object({ id: z.string() });

export function createEvent(input: CreateEventInput): Promise<{ id: string }> {
  return apiRequest('/api/events', { method: 'POST', body: input, schema: createdSchema });
}

export function useCreateEvent(onCreated: (eventId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createEvent,
    onSuccess: async ({ id }) => {
      await queryClient.invalidateQueries({ queryKey: eventsQueryKey });
      onCreated(id);
    },
  });
}
