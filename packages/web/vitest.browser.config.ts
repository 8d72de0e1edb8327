import { defineConfig } from 'vitest/config';

// Browser tests drive the real built app in Debian's chromium against a running stack (LIMBUS_BASE_URL).
// They share one server and its sign-in rate limits, so files run one at a time.
export default defineConfig({
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.ts'],
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
});
