import { briefingsSentSchema, type BriefingsSent } from '@limbus/schema/planning';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** E-mails every observer with a station their own briefing (POST /api/events/:eventId/briefings). */
export function sendBriefings(eventId: string): Promise<BriefingsSent> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/briefings`, {
    method: 'POST',
    schema: briefingsSentSchema,
  });
}

export function useSendBriefings(eventId: string) {
  return useMutation({ mutationFn: () => sendBriefings(eventId) });
}
