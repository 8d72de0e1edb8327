// Prints "<name>\t<dir>" for every workspace package with a `test` script, the set that
// `pnpm -r run test` runs; ./tools/test runs them one by one to keep one vitest report each.
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const listing = execFileSync('pnpm', ['-r', 'ls', '--depth', '-1', '--json'], { encoding: 'utf8' });
const packages = JSON.parse(listing);
for (const { name, path } of packages) {
  // `pnpm -r` leaves out the workspace root, whose own `test` script is `pnpm -r run test`.
  if (existsSync(join(path, 'pnpm-workspace.yaml'))) continue;
  const manifest = JSON.parse(readFileSync(join(path, 'package.json'), 'utf8'));
  if (manifest.scripts?.test) console.log(`${name}\t${path}`);
}
