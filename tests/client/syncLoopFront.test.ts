import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

/**
 * The sync loop loads after the first paint (src/local/syncLoop.ts). What the app asks before it
 * is there (the signed-in person, a tap's "send soon") must reach it once it has loaded.
 */
const calls: string[] = [];
let status = { phase: 'idle' };
const listeners = new Set<() => void>();

vi.mock('../../src/local/syncLoopRunner', () => ({
  startSyncLoop: () => ({
    setUser: (id: number | undefined) => calls.push(`setUser ${id}`),
    kick: () => calls.push('kick'),
    afterChange: () => calls.push('afterChange'),
    getStatus: () => status,
    subscribe: (l: () => void) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
  }),
}));

beforeEach(() => {
  vi.resetModules();
  vi.useFakeTimers();
  calls.length = 0;
  status = { phase: 'idle' };
});
afterEach(() => vi.useRealTimers());

/** Past the next paint (afterNextPaint's fallback when no frame comes) and the module's import. */
async function afterLoad() {
  await vi.advanceTimersByTimeAsync(200);
  await vi.dynamicImportSettled();
  await vi.advanceTimersByTimeAsync(0);
}

describe('the sync loop before and after it loads', () => {
  it('is idle, and has loaded nothing, until asked', async () => {
    const { syncLoop } = await import('../../src/local/syncLoop');
    expect(syncLoop().getStatus()).toEqual({ phase: 'idle' });
    await afterLoad();
    expect(calls).toEqual([]);
  });

  it('hands what was asked before it loaded to the loop, in order, once loaded', async () => {
    const { syncLoop } = await import('../../src/local/syncLoop');
    syncLoop().setUser(7);
    // A tap stored before the loop is there still asks for its sync.
    syncLoop().afterChange();
    expect(calls).toEqual([]);
    await afterLoad();
    expect(calls).toEqual(['setUser 7', 'afterChange']);
    syncLoop().kick();
    expect(calls).toEqual(['setUser 7', 'afterChange', 'kick']);
  });

  it("passes on the loop's status once loaded, and tells the screens of changes", async () => {
    const { syncLoop } = await import('../../src/local/syncLoop');
    const heard = vi.fn();
    syncLoop().subscribe(heard);
    syncLoop().kick();
    await afterLoad();
    expect(heard).toHaveBeenCalled();
    status = { phase: 'syncing' };
    listeners.forEach((l) => l());
    expect(syncLoop().getStatus()).toEqual({ phase: 'syncing' });
    expect(heard.mock.calls.length).toBeGreaterThanOrEqual(2);
  });
});
