/**
 * For each route, the bytes on the wire a phone downloads on first load of that route: the entry
 * chunk and its static imports, the app's layout (sync loop, phone database) for every route but
 * the public results pages, the route's lazy chunk and its static imports, the query cache's chunk
 * for screens that read server data, and their CSS. Each file counts as the server sends it: its
 * brotli copy (what Chromium gets over HTTPS), beside it the gzip copy (browsers without brotli,
 * Chromium over plain HTTP), or the file itself when the build wrote no copy (scripts/precompress.ts).
 */
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { entryKeyOf, readViteManifest, staticClosure } from '../server/http/viteManifest';

/** Loaded by `lazyScreen` together with every screen that reads server data (the query cache). */
const SERVER_DATA = 'src/app/ServerData.tsx';
/** The new-version prompt, loaded after the first paint of every page (src/app/Frame.tsx). */
const UPDATE_PROMPT = 'src/app/pwa/UpdatePrompt.tsx';
/** The frame with the sync loop; src/app/router.tsx loads it for every route but PUBLIC_SCREENS. */
const APP_LAYOUT = 'src/app/AppLayout.tsx';
/** Screens under the light frame, without the app layout (keep in step with src/app/router.tsx). */
const PUBLIC_SCREENS = [
  'src/features/results/ResultsScreen.tsx',
  'src/features/results/FieldResultsScreen.tsx',
];
/**
 * Goals for a route's first load, KiB gzip (the font and icons come after the first paint): the
 * pad's and the practice log's are of JavaScript (issue 17: "first-load JavaScript"), the public
 * results page's of everything it loads, CSS included.
 */
export const GOALS: Record<string, { kib: number; of: 'js' | 'all' }> = {
  'features/pad/PadScreen': { kib: 130, of: 'js' },
  'features/practice/PracticeArea': { kib: 150, of: 'js' },
  'features/results/ResultsScreen': { kib: 110, of: 'all' },
};

/** Whether a route's first load is within its goal (true when it has none). */
export function meetsGoal(row: RouteSize): boolean {
  const goal = GOALS[row.route];
  return goal === undefined || (goal.of === 'js' ? row.jsGz : row.gz) <= goal.kib * 1024;
}

/** Bytes on the wire: everything (`br`, `gz`), and the JavaScript alone (`jsBr`, `jsGz`). */
export type RouteSize = { route: string; br: number; gz: number; jsBr: number; jsGz: number };

/** The first load of every route of the build in `dist` (throws when there is no build). */
export function routeSizes(dist = 'dist'): RouteSize[] {
  const manifest = readViteManifest(dist);
  if (!manifest) throw new Error(`No Vite manifest in ${dist}/: run \`npx vite build\` first.`);
  const entryKey = entryKeyOf(manifest);
  if (!entryKey) throw new Error('No entry chunk in the Vite manifest.');
  const closure = (keys: string[], seen?: Set<string>) => staticClosure(manifest, keys, seen);

  const servedBytes = (file: string, copy: 'br' | 'gz') => {
    const path = join(dist, file);
    return statSync(existsSync(`${path}.${copy}`) ? `${path}.${copy}` : path).size;
  };
  const wire = (keys: Set<string>) => {
    const files = [...keys].flatMap((key) => [manifest[key]!.file, ...(manifest[key]!.css ?? [])]);
    const unique = [...new Set(files)];
    const sum = (list: string[], copy: 'br' | 'gz') => list.reduce((n, f) => n + servedBytes(f, copy), 0);
    const scripts = unique.filter((f) => f.endsWith('.js'));
    return {
      br: sum(unique, 'br'),
      gz: sum(unique, 'gz'),
      jsBr: sum(scripts, 'br'),
      jsGz: sum(scripts, 'gz'),
    };
  };

  const shell = closure([entryKey]);
  const layout = closure([APP_LAYOUT], new Set(shell));
  // What only the query cache brings: not in the shell, nor in the layout every app screen has.
  const queryLibrary = [...closure([SERVER_DATA], new Set(shell))].filter(
    (k) => !shell.has(k) && !layout.has(k) && k !== SERVER_DATA,
  );
  const rows: RouteSize[] = [{ route: '(app shell)', ...wire(shell) }];
  const screens = (manifest[entryKey]!.dynamicImports ?? []).filter(
    (k) => k.startsWith('src/') && ![SERVER_DATA, APP_LAYOUT, UPDATE_PROMPT].includes(k),
  );
  for (const key of screens) {
    const files = closure([key], new Set(PUBLIC_SCREENS.includes(key) ? shell : layout));
    // A screen that uses the query library is one lazyScreen opens with the query cache.
    if (queryLibrary.some((k) => files.has(k))) closure([SERVER_DATA], files);
    const name = key.replace(/^src\//, '').replace(/\.tsx?$/, '');
    rows.push({ route: name, ...wire(files) });
  }
  return rows;
}
