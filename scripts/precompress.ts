/**
 * Writes a brotli (`.br`) and a gzip (`.gz`) copy beside every text file of the built client, once
 * at build time at the highest levels, so the server sends them as they are (express-static-gzip)
 * instead of compressing on every request or sending the raw bytes.
 */
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
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

export function precompressDir(dir: string): void {
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
    const gz = gzipSync(raw, { level: constants.Z_BEST_COMPRESSION });
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
      handler() {
        precompressDir(outDir);
      },
    },
  };
}
