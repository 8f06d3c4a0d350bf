import { describe, expect, it, vi } from 'vitest';
import { loadOnce } from '../../src/app/loadOnce';

describe('a load run once', () => {
  it('runs its load the first time only, and hands back the same promise after', async () => {
    const load = vi.fn(() => Promise.resolve('screen'));
    const loaded = loadOnce(load);
    expect(load).not.toHaveBeenCalled();
    const first = loaded();
    expect(loaded()).toBe(first);
    await first;
    expect(loaded()).toBe(first);
    expect(load).toHaveBeenCalledTimes(1);
  });

  it('says once settled how it ended, in the fields React reads (`use` then waits no turn)', async () => {
    const loaded = loadOnce(() => Promise.resolve('screen'));
    const promise = loaded();
    expect(promise.status).toBeUndefined();
    await promise;
    expect(promise).toMatchObject({ status: 'fulfilled', value: 'screen' });

    const failure = new Error('chunk not found');
    const failing = loadOnce(() => Promise.reject(failure))();
    await expect(failing).rejects.toBe(failure);
    expect(failing).toMatchObject({ status: 'rejected', reason: failure });
  });
});
