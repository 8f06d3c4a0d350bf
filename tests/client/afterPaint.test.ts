import 'fake-indexeddb/auto';
import { Dexie, type ObservabilitySet } from 'dexie';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { afterNextPaint } from '../../src/local/afterPaint';
import { LocalDb } from '../../src/local/db';
import { writeAtOnce } from '../../src/local/writeAtOnce';

/*
 * A tap paints its value first; what it only sets going (screens re-reading the database, a sync)
 * waits for the next frame. These tests hold the frame back and let it come.
 */

/** Timers the test moves on; the frames stay the test's own (fake timers would fake them too). */
const useTimers = () => vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });

/** The browser's frames, held until a test lets one come. */
let frames: (() => void)[] = [];
const paintFrame = () => frames.splice(0).forEach((callback) => callback());

beforeEach(() => {
  frames = [];
  vi.stubGlobal('requestAnimationFrame', (callback: () => void) => frames.push(callback));
});
afterEach(() => {
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('afterNextPaint', () => {
  it('runs the work once, in a task after the next frame, not before it', () => {
    useTimers();
    const work = vi.fn();
    afterNextPaint(work);
    vi.advanceTimersByTime(50);
    expect(work).not.toHaveBeenCalled();
    paintFrame();
    // Not inside the frame's own callbacks: the paint comes first.
    expect(work).not.toHaveBeenCalled();
    vi.advanceTimersByTime(0);
    expect(work).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(1_000);
    expect(work).toHaveBeenCalledTimes(1);
  });

  it('still runs the work when no frame comes (a page in the background paints none)', () => {
    useTimers();
    const work = vi.fn();
    afterNextPaint(work);
    vi.advanceTimersByTime(100);
    expect(work).toHaveBeenCalledTimes(1);
    paintFrame();
    vi.advanceTimersByTime(1_000);
    expect(work).toHaveBeenCalledTimes(1);
  });
});

describe("a tap's write", () => {
  const dbs: LocalDb[] = [];
  afterEach(async () => {
    for (const db of dbs.splice(0)) await db.delete();
  });

  it('tells live queries of the stored row only after the next frame, so their re-reads never delay it', async () => {
    const db = new LocalDb('after-paint-test-1');
    dbs.push(db);
    await db.open();
    const heard: ObservabilitySet[] = [];
    const listen = (parts: ObservabilitySet) => void heard.push(parts);
    Dexie.on('storagemutated', listen);
    try {
      await writeAtOnce(db, [{ table: db.meta, type: 'put', value: { key: 'nextSeq:x', value: 2 } }]);
      // Committed, and a few tasks later still nothing told while the frame has not come.
      await new Promise((r) => setTimeout(r, 20));
      expect(await db.meta.get('nextSeq:x')).toEqual({ key: 'nextSeq:x', value: 2 });
      const mine = () => heard.filter((p) => Object.keys(p).some((k) => k.includes(db.name)));
      expect(mine()).toHaveLength(0);
      paintFrame();
      await new Promise((r) => setTimeout(r, 5));
      expect(mine()).toHaveLength(1);
    } finally {
      Dexie.on('storagemutated').unsubscribe(listen);
    }
  });
});
