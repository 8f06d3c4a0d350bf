import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { AuthSession } from '../../src/contract/auth';

/** What the server answers each path, in turn; an Error is no answer at all (no signal). */
const answers: Record<string, (Response | Error)[]> = {};
vi.mock('../../src/api/serverFetch', () => ({
  serverFetch: vi.fn(async (path: string) => {
    const answer = answers[path]!.shift()!;
    if (answer instanceof Error) throw answer;
    return answer;
  }),
}));

const { serverFetch } = await import('../../src/api/serverFetch');
const { apiRequest, isSignedOutError } = await import('../../src/api/request');
const { setSession } = await import('../../src/api/session');

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
const signedOut = () =>
  json(401, { error: { code: 'unauthorized', message: 'Please sign in to continue.' } });
const session = (token: string): AuthSession => ({
  accessToken: token,
  expiresAt: new Date(Date.now() + 600_000).toISOString(),
  user: { id: 1, email: 'archer@example.test', displayName: 'Archer', emailVerified: true },
});
const paths = () => vi.mocked(serverFetch).mock.calls.map((c) => c[0]);

beforeEach(() => {
  vi.mocked(serverFetch).mockClear();
  setSession(undefined);
});

describe('requests of a phone that is not signed in', () => {
  it('ask the server for a refresh once, not again after the request it made without a token', async () => {
    answers['/api/auth/refresh'] = [signedOut(), signedOut()];
    answers['/api/me'] = [signedOut()];
    const failure = await apiRequest('/api/me').catch((e: unknown) => e);
    expect(isSignedOutError(failure)).toBe(true);
    expect(paths()).toEqual(['/api/auth/refresh', '/api/me']);
  });

  it('still refresh a token the server no longer takes, and send the request again with the new one', async () => {
    setSession(session('old'));
    answers['/api/me'] = [signedOut(), json(200, { id: 1 })];
    answers['/api/auth/refresh'] = [json(200, session('new'))];
    expect(await apiRequest('/api/me')).toEqual({ id: 1 });
    expect(paths()).toEqual(['/api/me', '/api/auth/refresh', '/api/me']);
    const sent = vi.mocked(serverFetch).mock.calls[2]![1]!.headers as Headers;
    expect(sent.get('Authorization')).toBe('Bearer new');
  });

  it('ask again when the refresh before a request found no signal and the request found it back', async () => {
    // A phone whose signal returns between the two: the request's 401 says nothing of the sign-in.
    answers['/api/auth/refresh'] = [new TypeError('Failed to fetch'), json(200, session('new'))];
    answers['/api/sync/push'] = [signedOut(), json(200, { lastSeq: 3 })];
    expect(await apiRequest('/api/sync/push', { method: 'POST', body: '{}' })).toEqual({ lastSeq: 3 });
    expect(paths()).toEqual(['/api/auth/refresh', '/api/sync/push', '/api/auth/refresh', '/api/sync/push']);
    const sent = vi.mocked(serverFetch).mock.calls[3]![1]!.headers as Headers;
    expect(sent.get('Authorization')).toBe('Bearer new');
  });
});
