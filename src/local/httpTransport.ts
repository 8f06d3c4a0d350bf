import { apiRequest } from '../api/request';
import type { PullResponse, PushRequest, PushResponse } from '../contract/sync';
import type { SyncTransport } from './syncEngine';

/** The only code that talks to /api/sync. */
export const httpTransport: SyncTransport = {
  push: (body: PushRequest) =>
    apiRequest<PushResponse>('/api/sync/push', { method: 'POST', body: JSON.stringify(body) }),
  pull: (cursor: number) => apiRequest<PullResponse>(`/api/sync/pull?cursor=${cursor}`),
};
