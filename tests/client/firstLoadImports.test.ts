import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * The public results pages load without the phone's database: a spectator's first load stays
 * small (goal ≤ 110 KiB gzip, `scripts/report-route-sizes.ts`). The bundler puts every module a
 * page imports statically into its first load, so Dexie must not be reachable from these pages
 * through static imports (a dynamic `import()` is fine: it loads only when it runs).
 */
const PUBLIC_FIRST_LOAD = [
  'src/main.tsx',
  'src/features/results/ResultsScreen.tsx',
  'src/features/results/FieldResultsScreen.tsx',
  // The query cache, which lazyScreen opens with every screen that reads server data.
  'src/app/ServerData.tsx',
];

/** Specifiers a file imports as values at load time (not `import type`, not `import()`). */
function staticImports(source: string): string[] {
  const found: string[] = [];
  const statement = /^\s*(?:import|export)\s+(type\s+)?(?:[^'";]*?\s+from\s+)?['"]([^'"]+)['"]/gm;
  for (const [, typeOnly, specifier] of source.matchAll(statement)) {
    if (!typeOnly) found.push(specifier!);
  }
  return found;
}

function resolveFile(from: string, specifier: string): string | undefined {
  const base = join(dirname(from), specifier);
  return [base, `${base}.ts`, `${base}.tsx`, join(base, 'index.ts')].find(
    (f) => existsSync(f) && f.match(/\.tsx?$/),
  );
}

/** The packages reached from `roots` through static imports, each with the chain of files that reaches it. */
function packagesReached(roots: string[], seen = new Set<string>()): Map<string, string[]> {
  const packages = new Map<string, string[]>();
  const visit = (file: string, chain: string[]) => {
    if (seen.has(file)) return;
    seen.add(file);
    for (const specifier of staticImports(readFileSync(file, 'utf8'))) {
      if (specifier.startsWith('.')) {
        const next = resolveFile(file, specifier);
        if (next) visit(next, [...chain, next]);
      } else if (!packages.has(specifier)) packages.set(specifier, chain);
    }
  };
  for (const root of roots) visit(root, [root]);
  return packages;
}

describe('the public results pages', () => {
  it('reach no phone database (Dexie) through static imports', () => {
    const reached = packagesReached(PUBLIC_FIRST_LOAD);
    const dexie = [...reached].filter(([name]) => name.startsWith('dexie'));
    expect(dexie.map(([name, chain]) => `${name} via ${chain.join(' → ')}`)).toEqual([]);
  });

  it('leave the new-version prompt (and the service worker registration) until after the first paint', () => {
    const reached = packagesReached(PUBLIC_FIRST_LOAD);
    expect(reached.get('virtual:pwa-register/react')).toBeUndefined();
  });

  it('are walked far enough to see the packages they do load', () => {
    // A walker that stopped early would pass the check above without looking.
    const reached = packagesReached(PUBLIC_FIRST_LOAD);
    expect(reached.has('react-dom/client')).toBe(true);
    expect(reached.has('@tanstack/react-query')).toBe(true);
  });
});

/**
 * The pad's first load (goal ≤ 130 KiB gzip): the shell, the app layout with the sync loop, the
 * query cache and the pad. The API's zod schemas (`src/contract/*`) are the server's and the
 * forms' business: imported as values by the phone's sync code they once added ~26 KiB gzip here.
 */
const PAD_FIRST_LOAD = [
  'src/main.tsx',
  'src/app/AppLayout.tsx',
  'src/app/ServerData.tsx',
  'src/features/pad/PadScreen.tsx',
];

describe('the pad', () => {
  it('reaches no zod schema through static imports', () => {
    const zod = [...packagesReached(PAD_FIRST_LOAD)].filter(([name]) => name === 'zod');
    expect(zod.map(([name, chain]) => `${name} via ${chain.join(' → ')}`)).toEqual([]);
  });

  it('is walked far enough to see the packages it does load', () => {
    const reached = packagesReached(PAD_FIRST_LOAD);
    expect(reached.has('dexie')).toBe(true);
    expect(reached.has('react-router-dom')).toBe(true);
  });
});

/**
 * The values of ranking and matches come from their own files, not the core's index: through the
 * index every screen reaching the index (the pad too) loaded them (~2 KiB gzip of the pad's first load).
 */
describe("the pad's first load", () => {
  it('reaches no ranking or match rules of the core', () => {
    const files = new Set<string>();
    packagesReached(PAD_FIRST_LOAD, files);
    const rules = [...files].filter((f) => /src\/core\/(matches\/|ranking\.ts)/.test(f));
    expect(rules).toEqual([]);
  });

  it('reaches no sync loop or sync engine: they load after the first paint (src/local/syncLoop.ts)', () => {
    const files = new Set<string>();
    packagesReached(PAD_FIRST_LOAD, files);
    const sync = [...files].filter((f) => /src\/local\/(syncLoopRunner|syncEngine|httpTransport)\.ts/.test(f));
    expect(sync).toEqual([]);
    expect(files.has('src/local/syncLoop.ts')).toBe(true);
  });

  it('is walked into the core', () => {
    const files = new Set<string>();
    packagesReached(PAD_FIRST_LOAD, files);
    expect(files.has('src/core/index.ts')).toBe(true);
    expect(files.has('src/core/rounds.ts')).toBe(true);
  });
});
