import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { z } from 'zod';
import { FIT_STATES, fitQueryKey, type FitState } from './get-fit';
import { currentAccessToken } from '@/lib/api-client';

const progressSchema = z.union([z.number(), z.object({ progress: z.number() }).transform((p) => p.progress)]);
const stateSchema = z.union([
  z.enum(FIT_STATES),
  z.object({ state: z.enum(FIT_STATES) }).transform((s) => s.state),
]);

function parseData<T>(schema: z.ZodType<T>, data: string): T | null {
  let json: unknown = data;
  try {
    json = JSON.parse(data);
  } catch {
    // A bare word ("solved") is also a valid state message.
  }
  const parsed = schema.safeParse(json);
  return parsed.success ? parsed.data : null;
}

export interface FitStream {
  progress: number | null;
  state: FitState | null;
}

/**
 * Follows a running fit's server-sent events (`progress`, `state`). EventSource cannot send headers, so
 * the access token travels in the query string, as the server expects. A final state refreshes the fit.
 */
export function useFitEvents(fitId: string | null, active: boolean): FitStream {
  const queryClient = useQueryClient();
  const [stream, setStream] = useState<FitStream>({ progress: null, state: null });

  useEffect(() => {
    setStream({ progress: null, state: null });
    if (fitId === null || !active || typeof EventSource === 'undefined') return;
    const token = currentAccessToken();
    const query = token === null ? '' : `?access_token=${encodeURIComponent(token)}`;
    const source = new EventSource(`/api/fits/${encodeURIComponent(fitId)}/events${query}`);
    source.addEventListener('progress', (event) => {
      const progress = parseData(progressSchema, (event as MessageEvent<string>).data);
      if (progress !== null) setStream((s) => ({ ...s, progress }));
    });
    source.addEventListener('state', (event) => {
      const state = parseData(stateSchema, (event as MessageEvent<string>).data);
      if (state === null) return;
      setStream((s) => ({ ...s, state }));
      if (state === 'solved' || state === 'failed') {
        source.close();
        void queryClient.invalidateQueries({ queryKey: fitQueryKey(fitId) });
        void queryClient.invalidateQueries({ queryKey: ['events'] });
      }
    });
    return () => source.close();
  }, [fitId, active, queryClient]);

  return stream;
}
