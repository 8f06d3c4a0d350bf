import { useState, type FormEvent } from 'react';
import { useMutation } from '@tanstack/react-query';
import { apiRequest } from '../../api/request';
import { forgotPasswordSchema } from '../../contract/auth';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import { Notice } from '../../ui/Notice';

/** Asks for a link to set a new password. The answer never says whether the address has an account. */
export function ForgotPasswordScreen() {
  const [email, setEmail] = useState('');
  const [problem, setProblem] = useState<string>();
  const send = useMutation({
    mutationFn: (body: { email: string }) =>
      apiRequest<{ sent: true }>('/api/auth/forgot-password', { method: 'POST', body: JSON.stringify(body) }),
  });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = forgotPasswordSchema.safeParse({ email });
    setProblem(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (parsed.success) send.mutate(parsed.data);
  };

  return (
    <form onSubmit={submit} className="mx-auto max-w-md space-y-5" noValidate>
      <h1 className="text-3xl font-bold">Forgot your password?</h1>
      {send.isSuccess ? (
        <Notice tone="success">
          If {send.variables.email} has a Ringcall account, a link to set a new password is on its way there.
          It works once, for one hour.
        </Notice>
      ) : (
        <>
          <p>
            We mail you a link to choose a new one. Using it signs out every other phone signed in to your
            account.
          </p>
          <Field
            label="E-mail"
            type="email"
            autoComplete="username"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            error={problem}
          />
          {send.error && <Notice tone="error">{send.error.message}</Notice>}
          <Button type="submit" className="w-full" disabled={send.isPending}>
            {send.isPending ? 'Sending…' : 'Send me a link'}
          </Button>
        </>
      )}
    </form>
  );
}
