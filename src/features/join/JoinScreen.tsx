import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { TASKS, joinRequestSchema, type JoinRequest, type Task } from '../../contract/sync';
import { useMe } from '../../local/me';
import { isPending, useSignUp } from '../../account/signIn';
import { AccountFields, checkAccount, emptyAccount, type AccountProblems } from '../../account/AccountFields';
import { CheckYourMail } from '../../account/CheckYourMail';
import { JoinCodeField } from '../../ui/JoinCodeField';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { useOnline } from '../../local/online';
import { TASK_HINTS, TASK_LABELS } from '../../ui/scorecard/taskNames';
import { useJoinTarget } from './api/joinTarget';
import { signInThenBack } from '../../account/nextPath';

/**
 * Joining a target with its code (typed, or from the sheet's QR code). Someone without an account
 * joins on this one screen too: name, e-mail and password above the task, one button, then the
 * pad; "I have an account" leads to sign-in and back.
 */
function JoinForm({ userId }: { userId: number | undefined }) {
  const [params] = useSearchParams();
  const [code, setCode] = useState(params.get('code') ?? '');
  const [task, setTask] = useState<Task | undefined>();
  const [problem, setProblem] = useState<string>();
  const [account, setAccount] = useState(emptyAccount);
  const [accountProblems, setAccountProblems] = useState<AccountProblems>({});
  const signUp = useSignUp();
  const join = useJoinTarget();
  const navigate = useNavigate();
  const online = useOnline();
  const newcomer = userId === undefined;

  const joinAs = (input: JoinRequest, id: number) =>
    join.mutate(
      { input, userId: id },
      { onSuccess: (target) => navigate(`/pad/${target.session.id}/${target.targetNumber}`) },
    );

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = joinRequestSchema.safeParse({ code, task });
    const checked = newcomer ? checkAccount(account) : undefined;
    setAccountProblems(checked?.problems ?? {});
    setProblem(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (!parsed.success || checked?.problems) return;
    if (!checked) return joinAs(parsed.data, userId!);
    signUp.mutate(checked.input, {
      onSuccess: (answer) => {
        if (!isPending(answer)) joinAs(parsed.data, answer.user.id);
      },
    });
  };

  if (signUp.data && isPending(signUp.data)) return <CheckYourMail email={signUp.data.email} />;
  const busy = signUp.isPending || join.isPending;
  const failure = problem ?? signUp.error?.message ?? join.error?.message;
  const back = `/join${code ? `?code=${encodeURIComponent(code)}` : ''}`;
  return (
    <form onSubmit={submit} className="space-y-5" noValidate>
      <JoinCodeField
        label="Join code"
        hint="Printed on your target sheet, or scan its QR code."
        code={code}
        setCode={setCode}
      />
      {newcomer && (
        <fieldset className="space-y-4">
          <legend className="font-bold">New to Ringcall? Your account</legend>
          <AccountFields form={account} onChange={setAccount} problems={accountProblems} />
        </fieldset>
      )}
      <fieldset className="space-y-2">
        <legend className="font-bold">Your task on this target</legend>
        {TASKS.map((t) => (
          <label
            key={t}
            className={`surface flex min-h-16 cursor-pointer items-center gap-3 rounded-lg border-2 bg-card p-3 ${task === t ? 'border-ink' : 'border-line'}`}
          >
            <input
              type="radio"
              name="task"
              value={t}
              checked={task === t}
              onChange={() => setTask(t)}
              className="h-11 w-11 shrink-0 accent-ink"
            />
            <span>
              <span className="block text-lg font-bold">{TASK_LABELS[t]}</span>
              <span className="block text-base">{TASK_HINTS[t]}</span>
            </span>
          </label>
        ))}
      </fieldset>
      {!online && (
        <Notice tone="info">Joining needs signal once. After that, scoring works without it.</Notice>
      )}
      {failure && <Notice tone="error">{failure}</Notice>}
      <Button type="submit" className="w-full" disabled={busy}>
        {busy ? 'Joining…' : newcomer ? 'Create account and join' : 'Join target'}
      </Button>
      {newcomer && (
        <Link
          to={signInThenBack(back)}
          className="flex min-h-14 items-center justify-center rounded-lg border-2 border-ink px-5 font-bold"
        >
          I already have an account
        </Link>
      )}
    </form>
  );
}

export function JoinScreen() {
  const me = useMe();
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Join your target</h1>
      {/* One element whatever the answer, so signing up on this screen keeps the form (and its join) going. */}
      {me.data !== undefined ? (
        <JoinForm userId={me.data?.user.id} />
      ) : me.error ? (
        <Notice tone="error">
          {me.error.message} Joining needs signal once; try again when you have it.
        </Notice>
      ) : (
        <p>Checking your sign-in…</p>
      )}
      <Link to="/join/match" className="flex min-h-12 items-center font-bold underline">
        Scoring an elimination match? Join it with the match’s code
      </Link>
    </div>
  );
}
