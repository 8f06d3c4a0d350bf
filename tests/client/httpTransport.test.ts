import { describe, expect, it, vi } from 'vitest';

vi.mock('../../src/api/request', () => ({
  ApiError: class extends Error {},
  apiRequest: vi.fn(async () => ({ changes: [], cursor: 7, hasMore: false })),
}));

const { apiRequest } = await import('../../src/api/request');
const { httpTransport } = await import('../../src/local/httpTransport');
const { PULL_LIMIT_MAX, pullQuerySchema } = await import('../../src/contract/sync');

describe("the phone's pull over HTTP", () => {
  it('asks for as many changes as one pull answers: a phone catching up waits for fewer round trips', async () => {
    await httpTransport.pull(7);
    const path = vi.mocked(apiRequest).mock.calls[0]![0];
    expect(path).toBe(`/api/sync/pull?cursor=7&limit=${PULL_LIMIT_MAX}`);
    // The server's own reading of that query.
    const query = Object.fromEntries(new URL(path, 'http://phone.test').searchParams);
    expect(pullQuerySchema.parse(query)).toEqual({ cursor: 7, limit: 2000 });
  });
});
