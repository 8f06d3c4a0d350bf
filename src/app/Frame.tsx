import { Suspense, lazy, type ReactNode } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { ThemeToggle } from '../ui/ThemeToggle';
import { RingMark } from '../ui/RingMark';
import { NARROW_WHILE_WAITING } from '../ui/frameRoom';
import { useFirstScreenShown } from '../local/firstScreen';

// Nothing to show before a new version has downloaded: its code (and the service worker's
// registration) comes after the first paint, out of every page's first load.
const UpdatePrompt = lazy(async () => ({ default: (await import('./pwa/UpdatePrompt')).UpdatePrompt }));

/** Ringcall's page frame: the header with the mark and the theme, the update prompt, the screen. */
export function Frame({ status }: { status?: ReactNode }) {
  // Opened on the pad, the prompt (and the service worker's registration) waits until it has drawn.
  const shown = useFirstScreenShown();
  return (
    <div className="flex min-h-dvh flex-col">
      {/* On a phone, while the badge says what is waiting, the name beside the mark and the theme's
          word give way to it (frameRoom.ts). */}
      <header className="group/frame sticky top-0 z-40 bg-ink text-white shadow">
        <div className="mx-auto flex max-w-3xl flex-wrap items-center gap-x-2 gap-y-2 min-[480px]:gap-x-3 px-4 py-3">
          <Link
            to="/"
            className="flex min-h-12 min-w-12 items-center gap-2 text-2xl font-bold tracking-tight"
          >
            <RingMark className="h-9 w-9" />
            <span className={NARROW_WHILE_WAITING}>Ringcall</span>
          </Link>
          <div className="ml-auto flex flex-wrap items-center justify-end gap-2">
            <ThemeToggle />
            {status}
          </div>
        </div>
      </header>
      {shown && (
        <Suspense fallback={null}>
          <UpdatePrompt />
        </Suspense>
      )}
      <main className="mx-auto w-full max-w-3xl flex-1 px-4 py-5">
        <Outlet />
      </main>
    </div>
  );
}
