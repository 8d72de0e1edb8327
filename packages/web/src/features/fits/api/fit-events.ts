import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { z } from 'zod';
import { FIT_STATES, fitQueryKey, type Fit, type FitState } from './get-fit';
import { apiRequest } from '@/lib/api-client';

const progressSchema = z.union([z.number(), z.object({ progress: z.number() }).transform((p) => p.progress)]);
const stateSchema = z.union([
  z.enum(FIT_STATES),
  z.object({ state: z.enum(FIT_STATES) }).transform((s) => s.state),
]);

const streamTicketSchema = z.object({ ticket: z.string().min(1), expiresInSeconds: z.number() });

/**
 * A one-time ticket for the fit's event stream. EventSource cannot send headers, so the stream is
 * opened with this short-lived ticket instead of the access token, which never appears in a URL.
 */
export function requestStreamTicket(fitId: string, signal?: AbortSignal) {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/stream-ticket`, {
    method: 'POST',
    schema: streamTicketSchema,
    signal,
  });
}

/** How often the fit is fetched again once its stream has failed. */
export const FALLBACK_POLL_MS = 2000;

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

function isFinal(state: FitState | undefined): boolean {
  return state === 'solved' || state === 'failed';
}

export interface FitStream {
  progress: number | null;
  state: FitState | null;
}

/**
 * Follows a running fit's server-sent events (`progress`, `state`); a final state refreshes the fit. A
 * ticket serves one connection, so EventSource's own reconnect would be refused: on any error the stream
 * is closed and the fit is fetched every 2 s until it is solved or failed.
 */
export function useFitEvents(fitId: string | null, active: boolean): FitStream {
  const queryClient = useQueryClient();
  const [stream, setStream] = useState<FitStream>({ progress: null, state: null });

  useEffect(() => {
    setStream({ progress: null, state: null });
    if (fitId === null || !active) return;
    const key = fitQueryKey(fitId);
    const controller = new AbortController();
    let source: EventSource | null = null;
    let poll: ReturnType<typeof setInterval> | null = null;

    const stopPolling = () => {
      if (poll !== null) clearInterval(poll);
      poll = null;
    };
    const fallBack = () => {
      source?.close();
      source = null;
      if (poll !== null || controller.signal.aborted) return;
      poll = setInterval(() => {
        if (isFinal(queryClient.getQueryData<Fit>(key)?.state)) stopPolling();
        else void queryClient.invalidateQueries({ queryKey: key });
      }, FALLBACK_POLL_MS);
    };

    requestStreamTicket(fitId, controller.signal).then(
      ({ ticket }) => {
        if (controller.signal.aborted) return;
        if (typeof EventSource === 'undefined') {
          fallBack();
          return;
        }
        const opened = new EventSource(
          `/api/fits/${encodeURIComponent(fitId)}/events?ticket=${encodeURIComponent(ticket)}`,
        );
        source = opened;
        opened.addEventListener('progress', (event) => {
          const progress = parseData(progressSchema, (event as MessageEvent<string>).data);
          if (progress !== null) setStream((s) => ({ ...s, progress }));
        });
        opened.addEventListener('state', (event) => {
          const state = parseData(stateSchema, (event as MessageEvent<string>).data);
          if (state === null) return;
          setStream((s) => ({ ...s, state }));
          if (isFinal(state)) {
            opened.close();
            source = null;
            void queryClient.invalidateQueries({ queryKey: key });
            void queryClient.invalidateQueries({ queryKey: ['events'] });
          }
        });
        opened.addEventListener('error', fallBack);
      },
      () => {
        if (!controller.signal.aborted) fallBack();
      },
    );

    return () => {
      controller.abort();
      source?.close();
      stopPolling();
    };
  }, [fitId, active, queryClient]);

  return stream;
}
