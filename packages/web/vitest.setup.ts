import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach, beforeEach } from 'vitest';
import { setAccessToken } from './src/lib/api-client';

// Fluent UI's tabster keeps DOM references between tests; without cleanup it throws "NodeFilter is not defined".
afterEach(cleanup);

// Components under test act for a signed-in user. Without a token in memory (and jsdom has no session
// cookie) the API client would refuse to send anything; tests of the signed-out paths clear it.
beforeEach(() => setAccessToken('test-access-token'));
afterEach(() => setAccessToken(null));

// jsdom has no layout, hence no ResizeObserver; Fluent's MessageBar measures itself with one. An observer
// that never fires is what a layout-free DOM would report anyway.
class NoLayoutResizeObserver implements ResizeObserver {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
}
globalThis.ResizeObserver ??= NoLayoutResizeObserver;
