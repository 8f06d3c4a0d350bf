import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { TASKS, joinRequestSchema, type Task } from '../../contract/sync';
import { RequireSignIn } from '../auth/RequireSignIn';
import { Field } from '../../ui/Field';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { useOnline } from '../../local/online';
import { TASK_HINTS, TASK_LABELS } from '../pad/taskNames';
import { useJoinTarget } from './api/joinTarget';

function JoinForm({ userId }: { userId: number }) {
  const [params] = useSearchParams();
  const [code, setCode] = useState(params.get('code') ?? '');
  const [task, setTask] = useState<Task | undefined>();
  const [problem, setProblem] = useState<string>();
  const join = useJoinTarget(userId);
  const navigate = useNavigate();
  const online = useOnline();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = joinRequestSchema.safeParse({ code, task });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message);
      return;
    }
    setProblem(undefined);
    join.mutate(parsed.data, {
      onSuccess: (target) => navigate(`/pad/${target.session.id}/${target.targetNumber}`),
    });
  };

  return (
    <form onSubmit={submit} className="space-y-5" noValidate>
      <Field
        label="Join code"
        hint="Printed on your target sheet, or scan its QR code."
        value={code}
        onChange={(e) => setCode(e.target.value.toUpperCase())}
        autoCapitalize="characters"
        autoComplete="off"
        spellCheck={false}
        className="[&_input]:text-3xl [&_input]:tracking-[0.3em]"
      />
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
      {(problem || join.error) && <Notice tone="error">{problem ?? join.error?.message}</Notice>}
      <Button type="submit" className="w-full" disabled={join.isPending}>
        {join.isPending ? 'Joining…' : 'Join target'}
      </Button>
    </form>
  );
}

export function JoinScreen() {
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Join your target</h1>
      <RequireSignIn>{(me) => <JoinForm userId={me.user.id} />}</RequireSignIn>
    </div>
  );
}
