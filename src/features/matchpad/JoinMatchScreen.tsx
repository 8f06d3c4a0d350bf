import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { matchJoinSchema } from '../../contract/matches';
import { RequireSignIn } from '../../account/RequireSignIn';
import { useOnline } from '../../local/online';
import { Button } from '../../ui/Button';
import { JoinCodeField } from '../../ui/JoinCodeField';
import { Notice } from '../../ui/Notice';
import { useJoinMatch } from './api/matchPad';

function JoinMatchForm({ userId }: { userId: number }) {
  const [params] = useSearchParams();
  const [code, setCode] = useState(params.get('code') ?? '');
  const [problem, setProblem] = useState<string>();
  const join = useJoinMatch();
  const navigate = useNavigate();
  const online = useOnline();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = matchJoinSchema.safeParse({ code });
    setProblem(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (!parsed.success) return;
    join.mutate(
      { input: parsed.data, userId },
      { onSuccess: (m) => navigate(`/match/${m.eventId}/${m.matchId}`) },
    );
  };
  const failure = problem ?? join.error?.message;
  return (
    <form onSubmit={submit} className="space-y-5" noValidate>
      <JoinCodeField
        label="Match join code"
        hint="From the organizer or the judge. Only the match’s archers, or its named scorers, can join."
        code={code}
        setCode={setCode}
      />
      {!online && (
        <Notice tone="info">Joining needs signal once. After that, scoring works without it.</Notice>
      )}
      {failure && <Notice tone="error">{failure}</Notice>}
      <Button type="submit" className="w-full" disabled={join.isPending}>
        {join.isPending ? 'Joining…' : 'Join the match'}
      </Button>
    </form>
  );
}

/** Joining a match's target as one of its two writers, with the match's join code. */
export function JoinMatchScreen() {
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Join your match</h1>
      <RequireSignIn>{(me) => <JoinMatchForm userId={me.user.id} />}</RequireSignIn>
    </div>
  );
}
