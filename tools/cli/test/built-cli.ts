// Runs the built CLI as a user would (`./tools/limbus …` runs the bundle `tools/cli/dist/bundle/main.js`),
// rebuilding the packages it depends on first when their sources are newer than their dist.

import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');
const MAIN_JS = join(REPO_ROOT, 'tools/cli/dist/bundle/main.js');
const PACKAGES = ['packages/schema', 'packages/geometry', 'tools/cli'];

function newestMtimeMs(dir: string): number {
  let newest = 0;
  let entries: string[];
  try {
    entries = readdirSync(dir);
  } catch {
    return 0;
  }
  for (const name of entries) {
    const path = join(dir, name);
    const stat = statSync(path);
    newest = Math.max(newest, stat.isDirectory() ? newestMtimeMs(path) : stat.mtimeMs);
  }
  return newest;
}

function isStale(): boolean {
  return PACKAGES.some(
    (pkg) => newestMtimeMs(join(REPO_ROOT, pkg, 'src')) > newestMtimeMs(join(REPO_ROOT, pkg, 'dist')),
  );
}

const BUILD_LOCK = join(tmpdir(), 'limbus-cli-test-build.lock');
const LOCK_WAIT_MS = 240_000;

/**
 * Builds schema, geometry and cli when any of their src trees is newer than its dist tree. Test files
 * run in parallel workers, so the build is serialised by a lock directory (mkdir is atomic) and the
 * staleness is checked again once the lock is held.
 */
export function buildCliIfStale(): void {
  if (!isStale()) return;
  const deadline = Date.now() + LOCK_WAIT_MS;
  for (;;) {
    try {
      mkdirSync(BUILD_LOCK);
      break;
    } catch {
      if (Date.now() > deadline)
        throw new Error(`waited too long for ${BUILD_LOCK}; remove it if no build runs`);
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 500);
    }
  }
  try {
    if (!isStale()) return;
    const filters = ['@limbus/schema', '@limbus/geometry', '@limbus/cli'].flatMap((name) => [
      '--filter',
      name,
    ]);
    const build = spawnSync('pnpm', [...filters, 'run', 'build'], { cwd: REPO_ROOT, encoding: 'utf8' });
    if (build.status !== 0) throw new Error(`build failed:\n${build.stdout}\n${build.stderr}`);
  } finally {
    rmSync(BUILD_LOCK, { recursive: true, force: true });
  }
}

export interface CliResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: string[]): CliResult {
  const result = spawnSync('node', [MAIN_JS, ...args], { cwd: REPO_ROOT, encoding: 'utf8', timeout: 60_000 });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

const scratch = mkdtempSync(join(tmpdir(), 'limbus-cli-test-'));
let counter = 0;

/** Writes text (or a value as JSON) to a fresh file and returns its path. */
export function writeScratchFile(content: unknown, name = `input-${++counter}.json`): string {
  const path = join(scratch, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content, null, 2));
  return path;
}
