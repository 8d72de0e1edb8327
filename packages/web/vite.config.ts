import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      // The geometry package exports only its edge types; the plots reuse its pure ellipse model from source
      // so the drawn outline is the very one the fit uses.
      '@limbus/geometry/ellipse': fileURLToPath(new URL('../geometry/src/fit/ellipse.ts', import.meta.url)),
      // The client checks received solutions with the schema's own definition, without the package index
      // (which would pull geometry's runtime into the bundle).
      '@limbus/schema/solution-file': fileURLToPath(
        new URL('../schema/src/solution-file.ts', import.meta.url),
      ),
    },
  },
  server: { proxy: { '/api': 'http://127.0.0.1:8080' } },
  build: { outDir: 'dist', sourcemap: true },
  test: {
    environment: 'jsdom',
    setupFiles: ['./vitest.setup.ts'],
    include: ['src/**/*.test.{ts,tsx}'],
    // Fluent UI components render slowly under jsdom on a loaded 2-core CI machine; 5 s is too tight there.
    testTimeout: 30_000,
    benchmark: { include: ['bench/**/*.bench.{ts,tsx}'] },
  },
});
