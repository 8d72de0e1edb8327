import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FALLBACK_POLL_MS, useFitEvents } from './fit-events';
import { useFit } from './get-fit';
import { jsonResponse, stubFetch } from '@/testing/test-utils';

/** jsdom has no EventSource; this one records what was opened and lets the test play the server. */
class FakeEventSource {
  static opened: FakeEventSource[] = [];
  readonly listeners = new Map<string, Array<(event: Event) => void>>();
  closed = false;
  constructor(readonly url: string) {
    FakeEventSource.opened.push(this);
  }
  addEventListener(type: string, listener: (event: Event) => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }
  close(): void {
    this.closed = true;
  }
  emit(type: string, data?: string): void {
    const event = data === undefined ? new Event(type) : new MessageEvent(type, { data });
    for (const listener of this.listeners.get(type) ?? []) listener(event);
  }
}

function fit(state: string) {
  return {
    id: 'f1',
    state,
    reviewState: 'none',
    progress: 10,
    createdBy: { id: 'u1', name: 'Noor Calder' },
    createdAt: '2029-09-07T21:38:00.000Z',
    inputMatchesEvent: true,
    dataSha256: 'a'.repeat(64),
  };
}

function wrapper({ children }: { children: ReactNode }) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}

afterEach(() => {
  vi.unstubAllGlobals();
  FakeEventSource.opened = [];
});

describe('useFitEvents', () => {
  it('useFitEvents() opens the stream with a one-time ticket and no token in the URL', async () => {
    vi.stubGlobal('EventSource', FakeEventSource);
    const calls = stubFetch(() => jsonResponse(200, { ticket: 'one-time ticket', expiresInSeconds: 60 }));
    const { result } = renderHook(() => useFitEvents('f1', true), { wrapper });
    await waitFor(() => expect(FakeEventSource.opened).toHaveLength(1));
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual(['POST /api/fits/f1/stream-ticket']);
    expect(FakeEventSource.opened[0]?.url).toBe('/api/fits/f1/events?ticket=one-time%20ticket');
    act(() => FakeEventSource.opened[0]?.emit('progress', '{"progress":42}'));
    expect(result.current.progress).toBe(42);
  });

  it('useFitEvents() on a stream error closes it and fetches the fit every 2 s until it is solved', async () => {
    vi.stubGlobal('EventSource', FakeEventSource);
    let fitRequests = 0;
    const calls = stubFetch(({ url }) => {
      if (url === '/api/fits/f1/stream-ticket')
        return jsonResponse(200, { ticket: 't1', expiresInSeconds: 60 });
      fitRequests += 1;
      return jsonResponse(200, fit(fitRequests < 2 ? 'running' : 'solved'));
    });
    const { result } = renderHook(
      () => {
        const query = useFit('f1');
        useFitEvents('f1', true);
        return query;
      },
      { wrapper },
    );
    await waitFor(() => expect(FakeEventSource.opened).toHaveLength(1));
    await waitFor(() => expect(result.current.data?.state).toBe('running'));
    act(() => FakeEventSource.opened[0]?.emit('error'));
    expect(FakeEventSource.opened[0]?.closed).toBe(true);
    await waitFor(() => expect(result.current.data?.state).toBe('solved'), {
      timeout: 2 * FALLBACK_POLL_MS,
    });
    // One more period: the polling has stopped, and the stream was never reopened with the spent ticket.
    await new Promise((resolve) => setTimeout(resolve, FALLBACK_POLL_MS + 500));
    expect(calls.filter((c) => c.url === '/api/fits/f1')).toHaveLength(2);
    expect(FakeEventSource.opened).toHaveLength(1);
  });
});
