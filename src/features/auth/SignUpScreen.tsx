import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { isPending, useSignUp } from '../../account/signIn';
import {
  AccountFields,
  checkAccount,
  emptyAccount,
  tapLinkClass,
  type AccountProblems,
} from '../../account/AccountFields';
import { CheckYourMail } from '../../account/CheckYourMail';
import { nextPath } from '../../account/nextPath';

export function SignUpScreen() {
  const [params] = useSearchParams();
  const next = nextPath(params.get('next'));
  const inviteToken = params.get('invite') ?? undefined;
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [form, setForm] = useState(emptyAccount);
  const [problems, setProblems] = useState<AccountProblems>({});

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const checked = checkAccount(form, inviteToken);
    setProblems(checked.problems ?? {});
    if (!checked.input) return;
    signUp.mutate(checked.input, {
      onSuccess: (answer) => {
        // Sign-up with an invitation took it up: the invitation screen says so, for which event.
        if (!isPending(answer))
          navigate(next, { replace: true, state: inviteToken ? { accept: true } : null });
      },
    });
  };

  if (signUp.data && isPending(signUp.data)) return <CheckYourMail email={signUp.data.email} />;
  return (
    <form onSubmit={submit} className="mx-auto max-w-md space-y-5" noValidate>
      <h1 className="text-3xl font-bold">Create your account</h1>
      {inviteToken && (
        <Notice tone="info">
          You were invited to an event. Use the e-mail address the invitation was sent to.
        </Notice>
      )}
      <AccountFields form={form} onChange={setForm} problems={problems} />
      {signUp.error && <Notice tone="error">{signUp.error.message}</Notice>}
      <Button type="submit" className="w-full" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating your account…' : 'Create account'}
      </Button>
      <p>
        Already have an account?{' '}
        <Link className={tapLinkClass} to={`/sign-in${params.size ? `?${params}` : ''}`}>
          Sign in
        </Link>
      </p>
    </form>
  );
}
