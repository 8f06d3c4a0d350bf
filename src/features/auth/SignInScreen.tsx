import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Field } from '../../ui/Field';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { useSignIn } from '../../account/signIn';
import { tapLinkClass } from '../../account/AccountFields';
import { nextPath } from '../../account/nextPath';

/** Sign-in; `?next=` brings the person back where they were sent from. */
export function SignInScreen() {
  const [params] = useSearchParams();
  const next = nextPath(params.get('next'));
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');

  const submit = (e: FormEvent) => {
    e.preventDefault();
    signIn.mutate({ email, password }, { onSuccess: () => navigate(next, { replace: true }) });
  };

  return (
    <form onSubmit={submit} className="mx-auto max-w-md space-y-5" noValidate>
      <h1 className="text-3xl font-bold">Sign in</h1>
      <Field
        label="E-mail"
        type="email"
        autoComplete="username"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        required
      />
      <Field
        label="Password"
        type="password"
        autoComplete="current-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        required
      />
      {signIn.error && <Notice tone="error">{signIn.error.message}</Notice>}
      <Button type="submit" className="w-full" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
      <p>
        <Link className={tapLinkClass} to="/forgot-password">
          Forgot your password?
        </Link>
      </p>
      <p>
        New to Ringcall?{' '}
        <Link className={tapLinkClass} to={`/sign-up${params.size ? `?${params}` : ''}`}>
          Create an account
        </Link>
      </p>
    </form>
  );
}
