import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

// Fluent UI's tabster keeps DOM references between tests; without cleanup it throws "NodeFilter is not defined".
afterEach(cleanup);

// jsdom has no layout, hence no ResizeObserver; Fluent's MessageBar measures itself with one. An observer
// that never fires is what a layout-free DOM would report anyway.
class NoLayoutResizeObserver implements ResizeObserver {
  observe(): void {}
  unobserve(): void {}
  disconnect(): void {}
}
globalThis.ResizeObserver ??= NoLayoutResizeObserver;
