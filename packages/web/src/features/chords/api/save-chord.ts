import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { chordsQueryKey } from './get-chords';
import { apiRequest } from '@/lib/api-client';

const UTC_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
const utcTime = z.string().trim().regex(UTC_TIME, 'expected a UTC time such as "2028-03-14T02:11:04.25Z"');
const sigma = z
  .number({ error: 'σ must be a number of seconds' })
  .positive('σ must be greater than zero (a 1-σ timing uncertainty)');
const offset = z.number({ error: 'the time offset must be a number of seconds' });
const station = z.string().trim().min(1, 'choose the station');

const later = (a: string, b: string) => Date.parse(b) > Date.parse(a);

/** A chord as the event file states it (docs/file-formats.md, "Event file"), the server's payload too. */
export const chordInputSchema = z.discriminatedUnion('type', [
  // One edge alone is a single-edge chord (a camera started late, a cloud); neither is refused.
  z
    .object({
      station,
      type: z.literal('positive'),
      disappearance: z.object({ time: utcTime, sigmaSeconds: sigma }).optional(),
      reappearance: z.object({ time: utcTime, sigmaSeconds: sigma }).optional(),
      timeOffsetSeconds: offset,
    })
    .refine((c) => c.disappearance !== undefined || c.reappearance !== undefined, {
      path: [],
      message: 'a positive chord needs a disappearance, a reappearance or both',
    })
    .refine(
      (c) =>
        c.disappearance === undefined ||
        c.reappearance === undefined ||
        later(c.disappearance.time, c.reappearance.time),
      { path: ['reappearance', 'time'], message: 'reappearance must come after disappearance' },
    ),
  z
    .object({ station, type: z.literal('negative'), start: utcTime, end: utcTime, timeOffsetSeconds: offset })
    .refine((c) => later(c.start, c.end), { path: ['end'], message: 'end must come after start' }),
]);

export type ChordInput = z.infer<typeof chordInputSchema>;

export function saveChord(eventId: string, chordId: string | null, input: ChordInput): Promise<void> {
  if (chordId === null)
    return apiRequest(`/api/events/${encodeURIComponent(eventId)}/chords`, { method: 'POST', body: input });
  // PATCH keeps a field the body leaves out; an edge the chord no longer gives is sent as null to drop it.
  const body = input.type === 'positive' ? { disappearance: null, reappearance: null, ...input } : input;
  return apiRequest(`/api/chords/${encodeURIComponent(chordId)}`, { method: 'PATCH', body });
}

export function useSaveChord(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ chordId, input }: { chordId: string | null; input: ChordInput }) =>
      saveChord(eventId, chordId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: chordsQueryKey(eventId) }),
  });
}
