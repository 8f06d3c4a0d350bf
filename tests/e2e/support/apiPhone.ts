import { expect, type APIRequestContext } from '@playwright/test';
import { DEMO_PASSWORD } from '../../../server/demo/demoPeople';

/** A demo person's access token, signed in through the API. */
export async function token(request: APIRequestContext, email: string): Promise<string> {
  const res = await request.post('/api/auth/sign-in', { data: { email, password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
  return ((await res.json()) as { accessToken: string }).accessToken;
}

/** A phone simulated through the API, for the changes a test does not tap by hand. */
export function apiPhone(request: APIRequestContext, bearer: string, name: string) {
  const clientId = `e2e-${name}-${Date.now()}`;
  let seq = 0;
  const headers = { Authorization: `Bearer ${bearer}` };
  return {
    join: async (code: string, task: string) =>
      expect((await request.post('/api/join', { headers, data: { code, task } })).status()).toBe(200),
    push: async (changes: { kind: string; args: unknown }[]) => {
      const mutations = changes.map((c) => ({
        id: crypto.randomUUID(),
        seq: ++seq,
        at: new Date().toISOString(),
        ...c,
      }));
      const res = await request.post('/api/sync/push', { headers, data: { clientId, mutations } });
      expect(res.status()).toBe(200);
      const body = (await res.json()) as { results: { status: string; reason?: string }[] };
      expect(body.results.filter((r) => r.status === 'rejected')).toEqual([]);
    },
  };
}
