import { useSyncExternalStore } from 'react';
import { afterNextPaint } from './afterPaint';

/**
 * Work that must not compete with the pad's first drawing when the app opens on it (the sync's
 * first round, the new-version check): on a slow phone the pad is drawn from the phone's own
 * database, and its read would queue behind theirs. The pad says when it has drawn
 * (`screenShown`); other pages never wait, and the pad waits at most FALLBACK_MS.
 */
const FALLBACK_MS = 3_000;

/** The app was opened on the pad (a reload, or the phone's home-screen link to it). */
export const opensOnPad = typeof location !== 'undefined' && /^\/pad\/\d+\/\d+\/?$/.test(location.pathname);
let shown = !opensOnPad;
const waiting = new Set<() => void>();

function release() {
  if (shown) return;
  shown = true;
  for (const work of [...waiting]) work();
  waiting.clear();
}

if (!shown) setTimeout(release, FALLBACK_MS);

/** The first screen has drawn what it came for: the waiting work runs after that frame. */
export function screenShown(): void {
  if (!shown) afterNextPaint(release);
}

/** Runs `work` now, or once the first screen has drawn. Returns a cancel for work not run yet. */
export function afterFirstScreen(work: () => void): () => void {
  if (shown) {
    work();
    return () => undefined;
  }
  waiting.add(work);
  return () => waiting.delete(work);
}

const subscribe = (listener: () => void) => afterFirstScreen(listener);

/** Whether the first screen has drawn (always true on pages that do not wait for it). */
export function useFirstScreenShown(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => shown,
    () => shown,
  );
}
