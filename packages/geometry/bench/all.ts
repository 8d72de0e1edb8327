// Runs every benchmark in this folder (files named *.bench.ts, each exporting a default async function
// that prints its own figures), one after another so they do not compete for the two cores.
import { readdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv[2];
for (const file of readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .sort()) {
  if (only && !file.includes(only)) continue;
  const bench = (await import(pathToFileURL(`${here}/${file}`).href)) as { default: () => Promise<void> };
  console.log(`\n## ${file}`);
  await bench.default();
}
