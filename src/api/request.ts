import type { ApiErrorBody } from '../contract/apiError';
import { serverFetch } from './serverFetch';
import { accessToken, forgetAccessToken, lastRefreshUnanswered, refreshSession } from './session';

/** A failed API call, carrying the server's readable message. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** The readable message of any failure (a thrown value need not be an Error). */
export const messageOf = (error: unknown): string => (error instanceof Error ? error.message : String(error));

export const isSignedOutError = (error: unknown) => error instanceof ApiError && error.status === 401;

async function send(path: string, init: RequestInit, token: string | undefined): Promise<Response> {
  const headers = new Headers(init.headers);
  headers.set('Accept', 'application/json');
  if (init.body && !(init.body instanceof FormData) && !headers.has('Content-Type'))
    headers.set('Content-Type', 'application/json');
  if (token) headers.set('Authorization', `Bearer ${token}`);
  try {
    return await serverFetch(path, { ...init, headers, credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'network', 'No connection to the Ringcall server right now.');
  }
}

/**
 * Sends with the access token; on a 401 refreshes the sign-in once and tries again. Sent with no
 * token because the refresh just said "signed out", it is not asked again: a phone never signed in
 * asks once, not twice. Sent with none because the refresh found no signal, and the request found
 * it back (a phone whose signal returns), the refresh is asked again.
 */
async function authorizedFetch(path: string, init: RequestInit): Promise<Response> {
  const token = await accessToken();
  let response = await send(path, init, token);
  if (response.status === 401 && (token || lastRefreshUnanswered())) {
    forgetAccessToken();
    const session = await refreshSession();
    if (session) response = await send(path, init, session.accessToken);
  }
  if (!response.ok) throw await errorFrom(response);
  return response;
}

/** The ApiError of a failed answer, with the server's readable message. */
export async function errorFrom(response: Response): Promise<ApiError> {
  const text = await response.text();
  const body = safeJson(text);
  if (isApiErrorBody(body)) return new ApiError(response.status, body.error.code, body.error.message);
  return new ApiError(
    response.status,
    'http',
    `The server answered ${response.status} without an explanation.`,
  );
}

/** JSON request to Ringcall's own API; every failure becomes an ApiError with a message to show. */
export async function apiRequest<T>(path: string, init: RequestInit = {}): Promise<T> {
  const response = await authorizedFetch(path, init);
  const text = await response.text();
  return (text ? safeJson(text) : undefined) as T;
}

/** Downloads a file (a PDF, a CSV) from the API with the person's sign-in. */
export async function apiDownload(path: string): Promise<Blob> {
  const response = await authorizedFetch(path, { method: 'GET' });
  return response.blob();
}

/** A plain check rather than the zod schema, so the app shell does not carry zod. */
function isApiErrorBody(body: unknown): body is ApiErrorBody {
  const error = (body as { error?: { code?: unknown; message?: unknown } } | undefined)?.error;
  return typeof error?.code === 'string' && typeof error.message === 'string';
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
