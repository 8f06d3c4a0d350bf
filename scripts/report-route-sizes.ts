/**
 * Prints, for each route, the JavaScript a phone downloads on first load of that route, as the
 * gzip bytes served: the entry chunk and its static imports, the app's layout (sync loop, phone
 * database) for every route but the public results pages, the route's lazy chunk and its static
 * imports, and the query cache's chunk for screens that read server data.
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
/** The frame with the sync loop; src/app/router.tsx loads it for every route but PUBLIC_SCREENS. */
const APP_LAYOUT = 'src/app/AppLayout.tsx';
/** Screens under the light frame, without the app layout (keep in step with src/app/router.tsx). */
const PUBLIC_SCREENS = [
  'src/features/results/ResultsScreen.tsx',
  'src/features/results/FieldResultsScreen.tsx',
];
/** Goals for a route's first load, KiB gzip. */
const GOALS: Record<string, number> = {
  'features/pad/PadScreen': 130,
  'features/results/ResultsScreen': 110,
};
const layout = closure([APP_LAYOUT], new Set(shell));
// What only the query cache brings: not in the shell, nor in the layout every app screen has.
const queryLibrary = [...closure([SERVER_DATA], new Set(shell))].filter(
  (k) => !shell.has(k) && !layout.has(k) && k !== SERVER_DATA,
);

export function routeSizes(): { route: string; kib: number }[] {
  const rows = [{ route: '(app shell)', kib: gzipKiB(shell) }];
  const screens = (manifest[entryKey!]!.dynamicImports ?? []).filter(
    (k) => k.startsWith('src/') && k !== SERVER_DATA && k !== APP_LAYOUT,
  );
  for (const key of screens) {
    const files = closure([key], new Set(PUBLIC_SCREENS.includes(key) ? shell : layout));
    // A screen that uses the query library is one lazyScreen opens with the query cache.
    if (queryLibrary.some((k) => files.has(k))) closure([SERVER_DATA], files);
    const name = key.replace(/^src\//, '').replace(/\.tsx?$/, '');
    rows.push({ route: name, kib: gzipKiB(files) });
  }
  return rows;
}

console.log('\nFirst-load JavaScript per route (gzip, shell included):');
for (const row of routeSizes()) {
  const goal = GOALS[row.route];
  const verdict = goal === undefined ? '' : `  (goal ≤ ${goal} KiB ${row.kib <= goal ? 'met' : 'NOT met'})`;
  console.log(`  ${row.kib.toFixed(1).padStart(7)} KiB  ${row.route}${verdict}`);
}
