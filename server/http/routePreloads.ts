import { entryKeyOf, readViteManifest, staticClosure } from './viteManifest';

/**
 * The screens worth fetching before the app runs: the pad (the field phone's screen) and home.
 * Without a hint, a screen's chunk is asked for only once the app's entry has downloaded and run,
 * one more round trip on a weak signal after seconds of waiting.
 */
const SCREENS: { path: RegExp; chunks: string[] }[] = [
  { path: /^\/pad\/\d+\/\d+\/?$/, chunks: ['src/features/pad/PadScreen.tsx'] },
  { path: /^\/$/, chunks: ['src/features/home/HomeScreen.tsx', 'src/app/ServerData.tsx'] },
];

/**
 * For a navigation to one of those screens, a `Link` header that has the browser fetch the
 * entry and then the screen's own chunks (`modulepreload`) while the page is still arriving.
 * The entry comes first so it is not slowed by the rest. Built once from Vite's manifest.
 */
export function routePreloads(clientDir: string): (path: string) => string | undefined {
  const manifest = readViteManifest(clientDir);
  const entryKey = manifest && entryKeyOf(manifest);
  if (!manifest || !entryKey) return () => undefined;
  const shell = staticClosure(manifest, [entryKey]);
  const headers = SCREENS.map(({ path, chunks }) => {
    const own = [...staticClosure(manifest, chunks)].filter((k) => !shell.has(k) && manifest[k]);
    const files = [entryKey, ...own].map((k) => `</${manifest[k]!.file}>; rel=modulepreload`);
    return { path, header: files.join(', ') };
  });
  return (path) => headers.find((h) => h.path.test(path))?.header;
}
