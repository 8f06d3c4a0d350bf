import { useMutation } from '@tanstack/react-query';
import { ApiError, apiRequest } from '../../../api/request';
import { serverFetch } from '../../../api/serverFetch';
import type { AuthSession, SignInInput, SignUpInput } from '../../../contract/auth';
import { setSession } from '../session';
import { releasePhone } from '../../../local/phoneOwner';
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

/**
 * Signs out and takes the person's data off the phone. Needs signal: the server must end the
 * sign-in, or its cookie would sign the next person on this phone in as this one.
 */
export function useSignOut() {
  return useMutation({
    mutationFn: async () => {
      await apiRequest<void>('/api/auth/sign-out', { method: 'POST' }).catch((error: unknown) => {
        if (error instanceof ApiError && error.status === 0)
          throw new Error(
            'Signing out needs a connection to the event server, so that this phone cannot sign you in again by itself. Stay signed in and try again with signal.',
          );
        throw error;
      });
      setSession(undefined);
      const cleared = releasePhone();
      setMe(null);
      await cleared;
    },
  });
}
