import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import { serverFetch } from '../../../api/serverFetch';
import type { AuthSession, SignInInput, SignUpInput } from '../../../contract/auth';
import { setSession } from '../session';
import { checkMe, setMe } from './me';

async function startSession(path: string, body: unknown): Promise<AuthSession> {
  const response = await serverFetch(path, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: JSON.stringify(body),
    credentials: 'same-origin',
  }).catch(() => undefined);
  if (!response)
    throw new Error('No connection to the Ringcall server. Signing in needs signal once; scoring does not.');
  const json = (await response.json().catch(() => undefined)) as
    AuthSession | { error?: { message?: string } } | undefined;
  if (!response.ok)
    throw new Error((json as { error?: { message?: string } })?.error?.message ?? 'Signing in failed.');
  return json as AuthSession;
}

function useSessionMutation<T>(path: string) {
  return useMutation({
    mutationFn: (input: T) => startSession(path, input),
    onSuccess: async (session) => {
      setSession(session);
      await checkMe();
    },
  });
}

export const useSignIn = () => useSessionMutation<SignInInput>('/api/auth/sign-in');
export const useSignUp = () => useSessionMutation<SignUpInput>('/api/auth/sign-up');

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest<void>('/api/auth/sign-out', { method: 'POST' }).catch(() => undefined),
    onSuccess: async () => {
      setSession(undefined);
      setMe(null);
      await client.invalidateQueries();
    },
  });
}
