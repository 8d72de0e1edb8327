import type { createStationPayloadSchema } from '@limbus/schema';
import type { PlacementSite } from '@limbus/schema/planning';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export interface PlannedStationInput {
  code: string;
  site: PlacementSite;
}

/**
 * A placement suggestion made into a station of status `planned`, at the suggested ground point (height 0
 * m on the ellipsoid, as the prediction places it) and without an observer yet
 * (POST /api/events/:eventId/stations).
 */
export function createPlannedStation(eventId: string, input: PlannedStationInput): Promise<void> {
  // Checked against the server's own schema at compile time, without loading it (it pulls geometry).
  const body: z.input<typeof createStationPayloadSchema> = {
    code: input.code.trim(),
    latDeg: input.site.latDeg,
    lonDeg: input.site.lonDeg,
    heightM: 0,
    status: 'planned',
    observerId: null,
  };
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/stations`, { method: 'POST', body });
}

export function useCreatePlannedStation(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlannedStationInput) => createPlannedStation(eventId, input),
    // The event answer carries its stations; the map, the coverage and the briefing hang under its key.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['events', eventId] }),
  });
}
