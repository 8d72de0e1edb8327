import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { patchEventPayloadSchema } from '@limbus/schema';
import { z } from 'zod';
import { TIME_SCALES } from './get-event';
import { apiRequest } from '@/lib/api-client';

// Same limits as the event file (docs/file-formats.md, "Event file"), so the form refuses what the
// server would refuse and says so beside the field.
const degreesIn = (min: number, max: number, what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .min(min, `${what} must be within ${min}–${max}°`)
    .max(max, `${what} must be within ${min}–${max}°`);

const zonelessTime = z
  .string()
  .regex(
    /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?$/,
    'expected e.g. "2028-03-14T02:10:00" (no zone; the scale is chosen above)',
  );

export const updateEventInputSchema = z.object({
  title: z.string().trim().min(1, 'title must not be empty').max(300, 'at most 300 characters'),
  bodyId: z.string().min(1).optional(),
  /** ISO 8601 UTC ending in Z, read from what was typed (parseUtcInput). */
  eventTimeUtc: z.string().optional(),
  star: z.object({
    raDeg: degreesIn(0, 360, 'right ascension'),
    decDeg: degreesIn(-90, 90, 'declination'),
    catalogEpochJyear: z.number({ error: 'epoch must be a number' }),
    pmRaCosDecMasPerYear: z.number({ error: 'proper motion must be a number' }),
    pmDecMasPerYear: z.number({ error: 'proper motion must be a number' }),
    parallaxMas: z.number({ error: 'parallax must be a number' }),
    angularDiameterMas: z
      .number({ error: 'angular diameter must be a number' })
      .min(0, 'angular diameter must not be negative')
      .optional(),
  }),
  ephemeris: z.object({
    timeScale: z.enum(TIME_SCALES),
    rows: z
      .array(
        z.object({
          time: zonelessTime,
          raDeg: degreesIn(0, 360, 'right ascension'),
          decDeg: degreesIn(-90, 90, 'declination'),
          distanceKm: z
            .number({ error: 'distance must be a number' })
            .positive('distance must be greater than zero'),
        }),
      )
      .min(4, 'at least 4 rows are needed (the position is interpolated by a cubic spline)'),
  }),
  earthRotation: z.object({
    dut1Seconds: z
      .number({ error: 'DUT1 must be a number' })
      .min(-0.9, 'DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds')
      .max(0.9, 'DUT1 is UT1 − UTC, kept within ±0.9 s by leap seconds'),
  }),
});

export type UpdateEventInput = z.infer<typeof updateEventInputSchema>;

export function updateEvent(eventId: string, input: UpdateEventInput): Promise<void> {
  // Checked against the server's own schema at compile time, without loading it (it pulls geometry).
  const body: z.input<typeof patchEventPayloadSchema> = input;
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}`, { method: 'PATCH', body });
}

export function useUpdateEvent(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateEventInput) => updateEvent(eventId, input),
    // The event moves between bodies and lists with its body and time; every view of it is refreshed.
    onSuccess: () =>
      queryClient.invalidateQueries({
        predicate: ({ queryKey: [scope] }) => scope === 'events' || scope === 'bodies',
      }),
  });
}
