import { useEffect, useRef } from 'react';
import { useMutation } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router-dom';
import { apiRequest } from '../../api/request';
import { Notice } from '../../ui/Notice';
import { checkMe } from '../../local/me';

export function VerifyEmailScreen() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const verify = useMutation({
    mutationFn: () =>
      apiRequest<unknown>('/api/auth/verify-email', { method: 'POST', body: JSON.stringify({ token }) }),
    onSuccess: () => checkMe(),
  });
  const started = useRef(false);
  const { mutate } = verify;
  useEffect(() => {
    // Links are single-use: send once even under StrictMode's double effects.
    if (token && !started.current) {
      started.current = true;
      mutate();
    }
  }, [token, mutate]);

  return (
    <div className="mx-auto max-w-md space-y-5">
      <h1 className="text-3xl font-bold">Confirming your e-mail</h1>
      {!token && <Notice tone="error">This link is incomplete. Open it again from the mail.</Notice>}
      {verify.isPending && <p>Confirming…</p>}
      {verify.isSuccess && (
        <Notice tone="success">
          Thank you. Your address is confirmed, and your entries are linked to you.
        </Notice>
      )}
      {verify.error && <Notice tone="error">{verify.error.message}</Notice>}
      <Link
        to="/"
        className="inline-flex min-h-14 items-center rounded-lg border-2 border-ink px-5 font-bold"
      >
        Go to start
      </Link>
    </div>
  );
}
