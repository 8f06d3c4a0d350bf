import { knownMe } from '../../local/me';
import { phoneOwner } from '../../local/phoneOwner';
import { afterFirstScreen, opensOnPad } from '../../local/firstScreen';
import { newPadMemory, readPad, type PadData, type PadKey, type PadMemory } from './padRead';

/**
 * The pad's first read, when the app opens on the pad (a reload, the phone's home-screen link):
 * started as soon as the pad's code has loaded, and the app's first drawing waits for it
 * (firstDrawing in router.tsx), so the pad is drawn whole at once. Read by the pad itself, it came
 * after the pad's first (empty) drawing and the effects after it, on a slow phone ~0.35 s later.
 */
type Ahead = { key: PadKey; memory: PadMemory; read: Promise<void>; data?: PadData | null };

/** The longest the pad's first drawing waits for the read: past it, the pad opens as usual. */
const WAIT_MS = 1_500;

let ahead: Ahead | undefined;
let tried = false;

/** The pad this page was opened on (the route's parameters, read from the address). */
function openedPad(): PadKey | undefined {
  const match = /^\/pad\/(\d+)\/(\d+)\/?$/.exec(location.pathname);
  if (!match) return undefined;
  // As the pad chooses its person: the one signed in, else the phone's owner (PadScreen).
  const userId = knownMe()?.user.id ?? phoneOwner();
  return { sessionId: Number(match[1]), targetNumber: Number(match[2]), userId };
}

/** Starts the opened pad's first read (once; nothing on other pages). */
function readPadAhead(): void {
  if (!opensOnPad || tried) return;
  tried = true;
  const key = openedPad();
  if (!key) return;
  const memory = newPadMemory();
  const started: Ahead = { key, memory, read: Promise.resolve() };
  started.read = readPad(key, memory).then(
    (data) => {
      started.data = data;
    },
    // A failed read is the pad's own to show: its live read runs again.
    () => undefined,
  );
  ahead = started;
  // Only the opening drawing uses it: a pad opened later reads afresh.
  afterFirstScreen(() => {
    ahead = undefined;
  });
}

/** Waits (at most WAIT_MS) for the read started ahead, if any. */
export async function readAheadSettled(): Promise<void> {
  readPadAhead();
  if (!ahead) return;
  let timer: ReturnType<typeof setTimeout> | undefined;
  await Promise.race([ahead.read, new Promise<void>((resolve) => (timer = setTimeout(resolve, WAIT_MS)))]);
  clearTimeout(timer);
}

/** The read done ahead for this pad, if one finished (same session, target and person). */
export function readAheadFor(key: PadKey): { data: PadData | null; memory: PadMemory } | undefined {
  if (!ahead || ahead.data === undefined) return undefined;
  const same =
    ahead.key.sessionId === key.sessionId &&
    ahead.key.targetNumber === key.targetNumber &&
    ahead.key.userId === key.userId;
  return same ? { data: ahead.data, memory: ahead.memory } : undefined;
}
