/**
 * Writes a brotli (`.br`) and a gzip (`.gz`) copy beside every text file of the built client, once
 * at build time at the highest levels, so the server sends them as they are (express-static-gzip)
 * instead of compressing on every request or sending the raw bytes. The gzip copy (what Chromium
 * gets over plain HTTP, where it offers no brotli: a field server on the local network) is
 * Zopfli's: standard gzip that any browser reads, ~3 % smaller than zlib's best, slower to write.
 */
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { brotliCompressSync, constants } from 'node:zlib';
import { gzipAsync } from '@gfx/zopfli';
import type { Plugin } from 'vite';

/** Text files only: images and woff2 fonts are compressed already. */
const COMPRESSIBLE = /\.(js|mjs|css|html|svg|json|webmanifest|txt)$/;
/** Below this a compressed copy saves less than the headers it needs. */
const MIN_BYTES = 512;

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    // Vite's manifest (.vite/) is for the build scripts, never served.
    if (name.startsWith('.')) return [];
    return statSync(path).isDirectory() ? filesUnder(path) : [path];
  });
}

/**
 * Zopfli's passes over each file: more than a few gain under 0.1 % on these files and cost
 * seconds of every build.
 */
const ZOPFLI_ITERATIONS = 5;

export async function precompressDir(dir: string): Promise<void> {
  for (const path of filesUnder(dir)) {
    if (!COMPRESSIBLE.test(path)) continue;
    const raw = readFileSync(path);
    if (raw.length < MIN_BYTES) continue;
    const br = brotliCompressSync(raw, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY,
        [constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
      },
    });
    const gz = await gzipAsync(raw, { numiterations: ZOPFLI_ITERATIONS });
    if (br.length < raw.length) writeFileSync(`${path}.br`, br);
    if (gz.length < raw.length) writeFileSync(`${path}.gz`, gz);
  }
}

/** Runs after every other plugin has written its files (the service worker included). */
export function precompress(): Plugin {
  let outDir = 'dist';
  return {
    name: 'ringcall-precompress',
    apply: 'build',
    configResolved(config) {
      outDir = resolve(config.root, config.build.outDir);
    },
    closeBundle: {
      sequential: true,
      order: 'post',
      handler: () => precompressDir(outDir),
    },
  };
}
