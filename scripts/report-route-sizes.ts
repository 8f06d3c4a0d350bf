/**
 * Prints, for each route, the JavaScript a phone downloads on first load of that route (gzip):
 * the entry chunk and its static imports, plus the route's lazy chunk and its static imports, plus
 * the query cache's chunk for screens that read server data.
 */
import { readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { join } from 'node:path';

type Chunk = { file: string; src?: string; isEntry?: boolean; imports?: string[]; dynamicImports?: string[] };
const dist = 'dist';
const manifest = JSON.parse(readFileSync(join(dist, '.vite', 'manifest.json'), 'utf8')) as Record<
  string,
  Chunk
>;

function closure(keys: string[], seen = new Set<string>()): Set<string> {
  for (const key of keys) {
    if (seen.has(key)) continue;
    seen.add(key);
    closure(manifest[key]?.imports ?? [], seen);
  }
  return seen;
}

const gzipKiB = (files: Set<string>) =>
  [...files].reduce((sum, key) => sum + gzipSync(readFileSync(join(dist, manifest[key]!.file))).length, 0) /
  1024;

const entryKey = Object.keys(manifest).find((k) => manifest[k]!.isEntry && k.endsWith('index.html'));
if (!entryKey) throw new Error('No entry chunk in the Vite manifest.');
const shell = closure([entryKey]);

/** Loaded by `lazyScreen` together with every screen that reads server data (the query cache). */
const SERVER_DATA = 'src/app/ServerData.tsx';
const queryLibrary = [...closure([SERVER_DATA], new Set(shell))].filter((k) => !shell.has(k) && k !== SERVER_DATA);

export function routeSizes(): { route: string; kib: number }[] {
  const rows = [{ route: '(app shell)', kib: gzipKiB(shell) }];
  const screens = (manifest[entryKey!]!.dynamicImports ?? []).filter(
    (k) => k.startsWith('src/') && k !== SERVER_DATA,
  );
  for (const key of screens) {
    const files = closure([key], new Set(shell));
    // A screen that uses the query library is one lazyScreen opens with the query cache.
    if (queryLibrary.some((k) => files.has(k))) closure([SERVER_DATA], files);
    const name = key.replace(/^src\//, '').replace(/\.tsx?$/, '');
    rows.push({ route: name, kib: gzipKiB(files) });
  }
  return rows;
}

console.log('\nFirst-load JavaScript per route (gzip, shell included):');
for (const row of routeSizes()) console.log(`  ${row.kib.toFixed(1).padStart(7)} KiB  ${row.route}`);
