import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

/** One chunk of Vite's build manifest (`dist/.vite/manifest.json`), keyed by its source path. */
export type ManifestChunk = {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
};
export type ViteManifest = Record<string, ManifestChunk>;

/** The client's build manifest, or undefined for a build without one. */
export function readViteManifest(clientDir: string): ViteManifest | undefined {
  const path = join(clientDir, '.vite', 'manifest.json');
  return existsSync(path) ? (JSON.parse(readFileSync(path, 'utf8')) as ViteManifest) : undefined;
}

/** The entry chunk of index.html. */
export function entryKeyOf(manifest: ViteManifest): string | undefined {
  return Object.keys(manifest).find((k) => manifest[k]!.isEntry && k.endsWith('index.html'));
}

/** The chunks `keys` load before they run: themselves and their static imports, transitively. */
export function staticClosure(manifest: ViteManifest, keys: string[], seen = new Set<string>()): Set<string> {
  for (const key of keys) {
    if (seen.has(key)) continue;
    seen.add(key);
    staticClosure(manifest, manifest[key]?.imports ?? [], seen);
  }
  return seen;
}
