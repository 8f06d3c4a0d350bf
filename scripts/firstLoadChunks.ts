/**
 * How the build groups the phone's first-load modules into chunks. Left alone, the bundler makes a
 * chunk for every set of screens sharing modules: the pad's first load was ~29 files, each
 * compressed on its own (~6 KiB more on the wire than one file) and each compiled in its own task.
 * Three groups, so the pad's first load is the entry and React, these three and the screen's own:
 * - 'layout': what the app layout brings (the phone's database, the outbox), and what the pad
 *   shares with the practice log or the home screen (keypad, buttons). Every app screen loads the
 *   layout anyway; the shared parts cost the screens that do not use them a little.
 * - 'pad': what only the pad adds (the practice log and home have first-load goals of their own
 *   and must not load it). Screens sharing a few of these modules with the pad (the judge desk,
 *   cards, matches) load the group whole.
 * - 'common': what the pad's first load shares with the public results pages or the query cache
 *   (the fetch wrapper, the core's rules): one chunk for both, and never in 'layout', so those
 *   pages still load without Dexie.
 * Apart, each of the ~16 small shared chunks cost ~2.4 KiB gzip more than together.
 */
import { resolve } from 'node:path';
import type { Rolldown } from 'vite';

type Lookup = (id: string) => Pick<Rolldown.ModuleInfo, 'importedIds'> | null;

const src = (path: string) => resolve(import.meta.dirname, '..', 'src', path);
const ENTRY = src('main.tsx');
const LAYOUT = src('app/AppLayout.tsx');
const PAD = src('features/pad/PadScreen.tsx');
/** Screens with goals of their own, which must not load the pad's group. */
const KEPT_APART = [src('features/practice/PracticeArea.tsx'), src('features/home/HomeScreen.tsx')];
/** What a spectator's page loads (keep in step with PUBLIC_SCREENS in scripts/report-route-sizes.ts). */
const PUBLIC = [
  src('features/results/ResultsScreen.tsx'),
  src('features/results/FieldResultsScreen.tsx'),
  src('app/ServerData.tsx'),
];

function staticClosure(roots: string[], lookup: Lookup): Set<string> {
  const seen = new Set<string>();
  const stack = [...roots];
  while (stack.length > 0) {
    const id = stack.pop()!;
    if (seen.has(id)) continue;
    seen.add(id);
    stack.push(...(lookup(id)?.importedIds ?? []));
  }
  return seen;
}

/** The `name` of a code-splitting group: a module's chunk ('layout', 'pad', 'common') or null (the bundler's own). */
export function firstLoadChunkOf(): (id: string, ctx: { getModuleInfo: Lookup }) => string | null {
  let sets: Record<'entry' | 'public' | 'layout' | 'pad' | 'apart', Set<string>> | undefined;
  return (id, ctx) => {
    if (!sets) {
      const lookup: Lookup = (m) => ctx.getModuleInfo(m);
      sets = {
        entry: staticClosure([ENTRY], lookup),
        public: staticClosure(PUBLIC, lookup),
        layout: staticClosure([LAYOUT], lookup),
        pad: staticClosure([PAD], lookup),
        apart: staticClosure(KEPT_APART, lookup),
      };
    }
    // The screens themselves stay chunks of their own, named in the manifest (route preloads).
    if (sets.entry.has(id) || id === LAYOUT || id === PAD) return null;
    const firstLoad = sets.layout.has(id) || sets.pad.has(id);
    if (!firstLoad) return null;
    // Also on a spectator's page: one chunk of what both load, without the phone's database.
    if (sets.public.has(id)) return 'common';
    // What the pad shares with the practice log or home goes with the layout, which they load anyway.
    if (sets.layout.has(id) || sets.apart.has(id)) return 'layout';
    return 'pad';
  };
}
