import { afterEach, describe, expect, it, vi } from 'vitest';
import { verifiedTokens } from '../../server/auth/verifiedTokens';

/* A token checked once is not checked again until it expires; a token that fails is never kept. */

const now = () => Math.floor(Date.now() / 1000);

function counting(expiresIn = 900) {
  const checked: string[] = [];
  const verify = async (token: string) => {
    checked.push(token);
    if (token.startsWith('bad')) throw new Error('bad token');
    return { userId: 7, expiresAt: now() + expiresIn, sessionVersion: 0 };
  };
  return { checked, verify };
}

afterEach(() => {
  vi.useRealTimers();
});

describe('verified tokens', () => {
  it('checks a token once and answers from memory after that', async () => {
    const { checked, verify } = counting();
    const cached = verifiedTokens(verify);
    expect(await cached('good')).toMatchObject({ userId: 7 });
    expect(await cached('good')).toMatchObject({ userId: 7 });
    expect(checked).toEqual(['good']);
  });

  it('never keeps a token that fails', async () => {
    const { checked, verify } = counting();
    const cached = verifiedTokens(verify);
    await expect(cached('bad')).rejects.toThrow('bad token');
    await expect(cached('bad')).rejects.toThrow('bad token');
    expect(checked).toEqual(['bad', 'bad']);
  });

  it('checks a token again once it has expired', async () => {
    vi.useFakeTimers({ now: new Date('2026-12-12T09:00:00Z') });
    const { checked, verify } = counting(60);
    const cached = verifiedTokens(verify);
    await cached('good');
    vi.setSystemTime(new Date('2026-12-12T09:01:00Z'));
    await cached('good');
    expect(checked).toEqual(['good', 'good']);
  });

  it('forgets the oldest tokens when full', async () => {
    const { checked, verify } = counting();
    const cached = verifiedTokens(verify, 2);
    for (const token of ['t1', 't2', 't3', 't1']) await cached(token);
    expect(checked).toEqual(['t1', 't2', 't3', 't1']);
  });
});
