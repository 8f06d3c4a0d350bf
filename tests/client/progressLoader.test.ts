import { describe, expect, it } from 'vitest';
import { loadProgressScreen, progressScreenLoader } from '../../src/features/practice/progress/loadProgress';

/*
 * The progress screen's lazy loader: once its chunk came (the log warms it while idle), it answers
 * at once, so React draws the screen on the tap without suspending and drawing twice.
 */
describe('progressScreenLoader', () => {
  it('answers in the same turn once the chunk came, and by a promise before', async () => {
    let early: unknown;
    const first = progressScreenLoader().then((m) => (early = m.default));
    expect(early).toBeUndefined();
    await first;

    const { ProgressScreen } = await loadProgressScreen();
    let now: unknown;
    void progressScreenLoader().then((m) => (now = m.default));
    expect(now).toBe(ProgressScreen);
  });
});
