import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { resetPasswordSchema } from '../../contract/auth';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import { Notice } from '../../ui/Notice';
import { useResetPassword } from '../../account/signIn';
import { PASSWORD_HINT, tapLinkClass } from '../../account/AccountFields';

/** Opened from the mailed link: choose the new password; this phone is then signed in, every other one out. */
export function ResetPasswordScreen() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [password, setPassword] = useState('');
  const [problem, setProblem] = useState<string>();
  const reset = useResetPassword();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = resetPasswordSchema.safeParse({ token, password });
    setProblem(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (parsed.success) reset.mutate(parsed.data);
  };

  if (!token) return <Notice tone="error">This link is incomplete. Open it again from the mail.</Notice>;
  return (
    <form onSubmit={submit} className="mx-auto max-w-md space-y-5" noValidate>
      <h1 className="text-3xl font-bold">Choose your password</h1>
      {reset.data ? (
        <>
          <Notice tone="success">
            Your password is set and you are signed in as {reset.data.user.displayName}. Every other phone
            signed in to this account has been signed out.
          </Notice>
          <Link
            to="/"
            className="inline-flex min-h-14 items-center rounded-lg bg-moss px-5 font-bold text-white"
          >
            Go to start
          </Link>
        </>
      ) : (
        <>
          <Field
            label="New password"
            type="password"
            autoComplete="new-password"
            hint={PASSWORD_HINT}
            value={password}
            onChange={(e) => setPassword(e.target.value)}
            error={problem}
          />
          {reset.error && <Notice tone="error">{reset.error.message}</Notice>}
          <Button type="submit" className="w-full" disabled={reset.isPending}>
            {reset.isPending ? 'Saving…' : 'Save my password'}
          </Button>
          <p>
            <Link className={tapLinkClass} to="/forgot-password">
              Ask for a new link
            </Link>
          </p>
        </>
      )}
    </form>
  );
}
