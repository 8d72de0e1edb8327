import { FluentProvider } from '@fluentui/react-components';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, type RenderResult } from '@testing-library/react';
import type { ReactElement } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';
import { limbusTheme } from '@/app/theme';

/** `initialEntries` opens the router at a URL, for components that read their state from it. */
export function renderWithProviders(
  ui: ReactElement,
  options: { initialEntries?: string[] } = {},
): RenderResult & { queryClient: QueryClient } {
  // No retries: a test must see the first failure, not wait for backoff.
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  const result = render(
    <FluentProvider theme={limbusTheme}>
      <QueryClientProvider client={queryClient}>
        <MemoryRouter initialEntries={options.initialEntries}>{ui}</MemoryRouter>
      </QueryClientProvider>
    </FluentProvider>,
  );
  return { ...result, queryClient };
}

export function jsonResponse(status: number, body: unknown): Response {
  return new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}

export interface RecordedCall {
  url: string;
  method: string;
  authorization: string | null;
  body: unknown;
}

/** Replaces fetch with a function of the request; returns the calls seen, in order. */
export function stubFetch(handler: (call: RecordedCall) => Response | Promise<Response>): RecordedCall[] {
  const calls: RecordedCall[] = [];
  vi.stubGlobal('fetch', async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const headers = new Headers(init.headers);
    const call: RecordedCall = {
      url: typeof input === 'string' ? input : input.toString(),
      method: init.method ?? 'GET',
      authorization: headers.get('Authorization'),
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
    };
    calls.push(call);
    return handler(call);
  });
  return calls;
}
