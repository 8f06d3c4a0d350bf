/**
 * How the build groups the phone's first-load modules into chunks. Left alone, the bundler makes a
 * chunk for every set of screens sharing modules: the pad's first load was ~29 files, each
 * compressed on its own (~6 KiB more on the wire than one file) and each compiled in its own task.
 * Two groups here:
 * - 'layout': what the app layout brings (the phone's database, the outbox). Every app screen
 *   loads it anyway, so grouping it costs no screen anything.
 * - 'pad': what the pad adds, save what the practice log or the home screen also use (they have
 *   first-load goals of their own and would otherwise load the pad's code). Screens sharing a few
 *   of these modules with the pad (the judge desk, cards, matches) load the group whole.
 * Nothing the public results pages or the query cache reach goes in either, so those pages still
 * load without Dexie.
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

/** The `name` of a code-splitting group: a module's chunk, 'layout' or 'pad', or null (the bundler's own). */
export function firstLoadChunkOf(): (id: string, ctx: { getModuleInfo: Lookup }) => string | null {
  let sets: Record<'elsewhere' | 'layout' | 'pad', Set<string>> | undefined;
  return (id, ctx) => {
    if (!sets) {
      const lookup: Lookup = (m) => ctx.getModuleInfo(m);
      sets = {
        elsewhere: staticClosure([ENTRY, ...PUBLIC], lookup),
        layout: staticClosure([LAYOUT], lookup),
        pad: staticClosure([PAD], lookup),
      };
      for (const id of staticClosure(KEPT_APART, lookup)) sets.pad.delete(id);
    }
    // The screens themselves stay chunks of their own, named in the manifest (route preloads).
    if (sets.elsewhere.has(id) || id === LAYOUT || id === PAD) return null;
    if (sets.layout.has(id)) return 'layout';
    if (sets.pad.has(id)) return 'pad';
    return null;
  };
}
