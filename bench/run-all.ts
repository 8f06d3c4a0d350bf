/**
 * Runs every `bench/*.bench.ts` in its own process, one after another, so one benchmark's
 * warm caches and garbage do not colour the next. Figures are printed, never asserted.
 * Usage: npm run bench [-- name-filter]
 */
import { readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const filter = process.argv[2] ?? '';
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts') && f.includes(filter))
  .sort();

if (files.length === 0) {
  console.error(`No benchmark matches "${filter}".`);
  process.exit(1);
}

let failed = 0;
for (const file of files) {
  console.log(`\n=== ${file}`);
  const run = spawnSync(process.execPath, ['--import', 'tsx', join(here, file)], { stdio: 'inherit' });
  if (run.status !== 0) failed += 1;
}
process.exit(failed === 0 ? 0 : 1);
