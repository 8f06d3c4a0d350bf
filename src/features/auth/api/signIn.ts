import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../api/request';
import { serverFetch } from '../../../api/serverFetch';
import type {
  AuthSession,
  ResetPasswordInput,
  SignInInput,
  SignUpInput,
  SignUpPending,
} from '../../../contract/auth';
import { setSession } from '../session';
import { checkMe, setMe } from './me';

/** A sign-up under an unconfirmed account's address: nothing happens until the mailed link is used. */
export const isPending = (answer: AuthSession | SignUpPending): answer is SignUpPending =>
  'confirmByMail' in answer;

async function startSession<A>(path: string, body: unknown): Promise<A> {
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
  return json as A;
}

function useSessionMutation<T, A extends AuthSession | SignUpPending = AuthSession>(path: string) {
  return useMutation({
    mutationFn: (input: T) => startSession<A>(path, input),
    onSuccess: async (answer) => {
      if (isPending(answer)) return;
      setSession(answer);
      await checkMe();
    },
  });
}

export const useSignIn = () => useSessionMutation<SignInInput>('/api/auth/sign-in');
export const useSignUp = () =>
  useSessionMutation<SignUpInput, AuthSession | SignUpPending>('/api/auth/sign-up');
/** Sets a new password from a mailed link, and signs this phone in (every other one is signed out). */
export const useResetPassword = () => useSessionMutation<ResetPasswordInput>('/api/auth/reset-password');

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
