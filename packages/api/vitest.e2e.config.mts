import { defineConfig } from 'vitest/config';

// End-to-end tests share one MariaDB and one Redis, started by tools/test; run files one at a time.
export default defineConfig({
  test: {
    include: ['e2e/**/*.e2e-spec.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
