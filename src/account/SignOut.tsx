import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLiveQuery } from 'dexie-react-hooks';
import { cardQuery, myCardsQuery } from '../api/card';
import { localDb } from '../local/db';
import { saveWaitingFile } from '../local/saveWaitingFile';
import { syncLoop } from '../local/syncLoop';
import { matchInWords, waitingInWords } from '../local/waitingInWords';
import type { BracketDto } from '../contract/matches';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { useSignOut } from './signIn';

/** Names of archers whose cards this person looked at, from the query cache. */
function useCardNames() {
  const client = useQueryClient();
  return (sessionId: number, entryId: number) =>
    client.getQueryData(cardQuery(sessionId, entryId).queryKey)?.archer.name ??
    client
      .getQueryData(myCardsQuery.queryKey)
      ?.toSign.find((c) => c.sessionId === sessionId && c.entryId === entryId)?.archerName;
}

/** A match's archers from any bracket in the query cache (the judge's match cards). */
function useMatchNames() {
  const client = useQueryClient();
  return (matchId: number) => {
    for (const [, data] of client.getQueriesData<{ brackets: BracketDto[] }>({ queryKey: ['brackets'] })) {
      const match = data?.brackets.flatMap((b) => b.matches).find((m) => m.id === matchId);
      if (match) return matchInWords(match);
    }
    return undefined;
  };
}

/**
 * Sign-out on a phone that may be shared. With nothing waiting, it signs out and clears the
 * person's data at once. Otherwise it first lists what has not reached the server, tries to send
 * it, and offers a file of it, staying signed in, or signing out anyway (the changes then stay on
 * the phone, hidden, and go when this person signs in here again).
 */
export function SignOut({ userId }: { userId: number }) {
  const signOut = useSignOut();
  const [asking, setAsking] = useState(false);
  const names = useCardNames();
  const matchNames = useMatchNames();
  const waiting = useLiveQuery(() => waitingInWords(localDb(), userId, names, matchNames), [userId]);
  const busy = signOut.isPending || waiting === undefined;
  const error = signOut.error && <Notice tone="error">{signOut.error.message}</Notice>;

  if (!asking) {
    return (
      <div className="space-y-2">
        <Button
          variant="secondary"
          disabled={busy}
          onClick={() => {
            if (waiting && waiting.length > 0) {
              setAsking(true);
              syncLoop().kick();
            } else signOut.mutate();
          }}
        >
          Sign out
        </Button>
        {error}
      </div>
    );
  }
  if (waiting && waiting.length === 0) {
    return (
      <div className="space-y-2">
        <Notice tone="success">Everything you entered has reached the event server.</Notice>
        <Button variant="secondary" disabled={busy} onClick={() => signOut.mutate()}>
          Sign out
        </Button>
        {error}
      </div>
    );
  }
  return (
    <section
      aria-labelledby="sign-out-waiting"
      data-testid="sign-out-warning"
      className="surface space-y-3 rounded-xl border-2 border-brick bg-brick-bg p-3 text-brick"
    >
      <h2 id="sign-out-waiting" className="text-xl font-bold">
        ▲ Not on the event server yet
      </h2>
      <ul className="list-disc space-y-1 pl-6">
        {waiting?.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      <p>
        They are sent as soon as there is signal. If you sign out now, they stay on this phone, hidden from
        anyone else, and go to the event server the next time you sign in here. A judge can also import them
        from a file.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => setAsking(false)}>Stay signed in</Button>
        <Button variant="secondary" onClick={() => void saveWaitingFile()}>
          Save waiting changes as a file
        </Button>
        <Button variant="danger" disabled={busy} onClick={() => signOut.mutate()}>
          Sign out anyway
        </Button>
      </div>
      {error}
    </section>
  );
}
