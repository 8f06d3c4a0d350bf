/**
 * Prints, for each route, the bytes on the wire a phone downloads on first load of that route:
 * the entry chunk and its static imports, plus the route's lazy chunk and its static imports, plus
 * the query cache's chunk for screens that read server data, plus their CSS. Each file counts as
 * the server sends it: its brotli copy (what Chromium gets), beside it the gzip copy (for
 * browsers without brotli), or the file itself when the build wrote no copy (scripts/precompress.ts).
 */
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { entryKeyOf, readViteManifest, staticClosure } from '../server/http/viteManifest';

const dist = 'dist';
const built = readViteManifest(dist);
if (!built) throw new Error('No Vite manifest in dist/: run `npx vite build` first.');
const manifest = built;

/** The pad's first load on the wire with brotli (the font and icons come after the first paint). */
const PAD_BUDGET_BYTES = 130 * 1024;

const closure = (keys: string[], seen?: Set<string>) => staticClosure(manifest, keys, seen);

function servedBytes(file: string, copy: 'br' | 'gz'): number {
  const path = join(dist, file);
  return statSync(existsSync(`${path}.${copy}`) ? `${path}.${copy}` : path).size;
}

function wire(keys: Set<string>): { br: number; gz: number } {
  const files = [...keys].flatMap((key) => [manifest[key]!.file, ...(manifest[key]!.css ?? [])]);
  const unique = [...new Set(files)];
  return {
    br: unique.reduce((sum, f) => sum + servedBytes(f, 'br'), 0),
    gz: unique.reduce((sum, f) => sum + servedBytes(f, 'gz'), 0),
  };
}

const entryKey = entryKeyOf(manifest);
if (!entryKey) throw new Error('No entry chunk in the Vite manifest.');
const shell = closure([entryKey]);

/** Loaded by `lazyScreen` together with every screen that reads server data (the query cache). */
const SERVER_DATA = 'src/app/ServerData.tsx';
const queryLibrary = [...closure([SERVER_DATA], new Set(shell))].filter(
  (k) => !shell.has(k) && k !== SERVER_DATA,
);

export function routeSizes(): { route: string; br: number; gz: number }[] {
  const rows = [{ route: '(app shell)', ...wire(shell) }];
  const screens = (manifest[entryKey!]!.dynamicImports ?? []).filter(
    (k) => k.startsWith('src/') && k !== SERVER_DATA,
  );
  for (const key of screens) {
    const files = closure([key], new Set(shell));
    // A screen that uses the query library is one lazyScreen opens with the query cache.
    if (queryLibrary.some((k) => files.has(k))) closure([SERVER_DATA], files);
    const name = key.replace(/^src\//, '').replace(/\.tsx?$/, '');
    rows.push({ route: name, ...wire(files) });
  }
  return rows;
}

const kib = (bytes: number) => `${(bytes / 1024).toFixed(1).padStart(6)} KiB`;
console.log('\nFirst load per route, bytes on the wire (JavaScript and CSS, shell included):');
console.log('     brotli        gzip  route');
for (const row of routeSizes()) console.log(`  ${kib(row.br)}  ${kib(row.gz)}  ${row.route}`);
console.log(`(budget: the pad's first load ≤ ${PAD_BUDGET_BYTES.toLocaleString('en')} bytes with brotli)`);
