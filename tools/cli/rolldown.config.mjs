// Bundles the compiled CLI (dist/*.js from tsc) with its workspace packages and npm dependencies into
// dist/bundle/: a command then loads a few files instead of a few hundred modules, which is most of its
// start-up time (docs/performance.md). Each command stays its own chunk, loaded when asked for: the
// chunks follow the literal `import()` of each command in src/main.ts (solve, predict, time, joint, context).
import { defineConfig } from 'rolldown';

export default defineConfig({
  input: 'dist/main.js',
  platform: 'node',
  output: { dir: 'dist/bundle', format: 'esm', entryFileNames: '[name].js' },
});
