/**
 * `npm start` builds the client only when there is no build yet or a client source is newer
 * than it, so a fresh clone starts with one command and later starts are quick.
 */
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';

const built = 'dist/index.html';
const sources = ['src', 'public', 'index.html', 'vite.config.ts', 'package.json'];

function newestMtime(path: string): number {
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(path).reduce(
    (newest, name) => Math.max(newest, newestMtime(join(path, name))),
    stat.mtimeMs,
  );
}

const stale =
  !existsSync(built) || sources.some((s) => existsSync(s) && newestMtime(s) > statSync(built).mtimeMs);
if (stale) {
  console.log('Building the Ringcall client (first start or changed sources)…');
  const run = spawnSync('npm', ['run', 'build'], { stdio: 'inherit' });
  process.exit(run.status ?? 1);
}
