import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { signUpSchema } from '../../contract/auth';
import { Field } from '../../ui/Field';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { useSignUp } from './api/signIn';

export function SignUpScreen() {
  const [params] = useSearchParams();
  const next = params.get('next') ?? '/';
  const inviteToken = params.get('invite') ?? undefined;
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [form, setForm] = useState({ displayName: '', email: '', password: '' });
  const [problems, setProblems] = useState<Record<string, string>>({});

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = signUpSchema.safeParse({ ...form, ...(inviteToken ? { inviteToken } : {}) });
    if (!parsed.success) {
      setProblems(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setProblems({});
    signUp.mutate(parsed.data, { onSuccess: () => navigate(next, { replace: true }) });
  };
  const set = (key: keyof typeof form) => (e: { target: { value: string } }) =>
    setForm((f) => ({ ...f, [key]: e.target.value }));

  return (
    <form onSubmit={submit} className="mx-auto max-w-md space-y-5" noValidate>
      <h1 className="text-3xl font-bold">Create your account</h1>
      {inviteToken && (
        <Notice tone="info">
          You were invited to an event. Use the e-mail address the invitation was sent to.
        </Notice>
      )}
      <Field
        label="Your name"
        hint="As it should appear on scorecards."
        autoComplete="name"
        value={form.displayName}
        onChange={set('displayName')}
        error={problems.displayName}
      />
      <Field
        label="E-mail"
        type="email"
        autoComplete="email"
        value={form.email}
        onChange={set('email')}
        error={problems.email}
      />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 8 characters. A short sentence works well."
        value={form.password}
        onChange={set('password')}
        error={problems.password}
      />
      {signUp.error && <Notice tone="error">{signUp.error.message}</Notice>}
      <Button type="submit" className="w-full" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating your account…' : 'Create account'}
      </Button>
      <p>
        Already have an account?{' '}
        <Link className="font-bold underline" to={`/sign-in${params.size ? `?${params}` : ''}`}>
          Sign in
        </Link>
      </p>
    </form>
  );
}
