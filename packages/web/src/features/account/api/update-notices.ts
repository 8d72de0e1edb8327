import type { NoticeSettingsPayload } from '@limbus/schema/team';
import { meViewSchema, type MeView } from '@limbus/schema/views';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** Stores which e-mail notices the signed-in user does not want; answers with their account. */
export function updateNotices(payload: NoticeSettingsPayload): Promise<MeView> {
  return apiRequest('/api/me/notices', { method: 'PUT', body: payload, schema: meViewSchema });
}

export function useUpdateNotices(onSaved: (me: MeView) => void) {
  return useMutation({ mutationFn: updateNotices, onSuccess: onSaved });
}
