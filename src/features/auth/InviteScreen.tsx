import { useEffect, useRef } from 'react';
import { useMutation } from '@tanstack/react-query';
import { Link, useLocation, useSearchParams } from 'react-router-dom';
import { apiRequest } from '../../api/request';
import type { AcceptedInvitation } from '../../contract/auth';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { checkMe, useMe } from '../../local/me';
import { signInThenBack } from '../../account/nextPath';

/** Opened from an invitation mail: accept the role, signing in or creating an account first. */
export function InviteScreen() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const me = useMe();
  const location = useLocation();
  const accept = useMutation({
    mutationFn: () =>
      apiRequest<AcceptedInvitation>('/api/invitations/accept', {
        method: 'POST',
        body: JSON.stringify({ token }),
      }),
    onSuccess: () => checkMe(),
  });
  // Back from creating the account with this link: sign-up took the invitation up already, so
  // ask once more for its event without another tap, and say what the person now is.
  const fromSignUp = (location.state as { accept?: boolean } | null)?.accept === true;
  const asked = useRef(false);
  const { mutate } = accept;
  useEffect(() => {
    if (fromSignUp && token && me.data && !asked.current) {
      asked.current = true;
      mutate();
    }
  }, [fromSignUp, token, me.data, mutate]);
  const back = encodeURIComponent(`/invite?token=${token}`);

  if (!token)
    return <Notice tone="error">This invitation link is incomplete. Open it again from the mail.</Notice>;
  return (
    <div className="mx-auto max-w-md space-y-5">
      <h1 className="text-3xl font-bold">Your invitation</h1>
      {accept.data ? (
        <>
          <Notice tone="success">
            You are now {accept.data.role === 'organizer' ? 'an' : 'a'} {accept.data.role} of{' '}
            {accept.data.eventName}.
          </Notice>
          <Link
            to={
              accept.data.role === 'judge' ? `/desk/${accept.data.eventId}` : `/events/${accept.data.eventId}`
            }
            className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 font-bold text-white"
          >
            {accept.data.role === 'judge' ? 'Open the judge desk' : 'Open the event'}
          </Link>
        </>
      ) : me.data ? (
        <>
          <p>
            Signed in as <strong>{me.data.user.email}</strong>. Accept to take up the role you were invited
            to.
          </p>
          {accept.error && <Notice tone="error">{accept.error.message}</Notice>}
          <Button className="w-full" onClick={() => accept.mutate()} disabled={accept.isPending}>
            Accept invitation
          </Button>
        </>
      ) : (
        <>
          <p>Sign in, or create an account with the address the invitation was sent to.</p>
          <div className="flex flex-col gap-3">
            <Link
              to={`/sign-up?invite=${encodeURIComponent(token)}&next=${back}`}
              className="flex min-h-14 items-center justify-center rounded-lg bg-moss px-5 font-bold text-white"
            >
              Create an account
            </Link>
            <Link
              to={signInThenBack(`/invite?token=${token}`)}
              className="flex min-h-14 items-center justify-center rounded-lg border-2 border-ink px-5 font-bold"
            >
              I have an account
            </Link>
          </div>
        </>
      )}
    </div>
  );
}
