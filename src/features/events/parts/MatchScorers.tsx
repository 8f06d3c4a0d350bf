import { useState, type FormEvent } from 'react';
import { matchScorerSchema, type MatchDto } from '../../../contract/matches';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { useSetMatchScorer } from '../api/setMatchScorer';

/**
 * The organizer names a scorer (an account's e-mail) to write for one line of a match in place of
 * its archer, or gives the line back to its archer. The scorer joins with the match's code.
 */
export function MatchScorers({
  eventId,
  match,
  names,
}: {
  eventId: number;
  match: MatchDto;
  names: (side: 'a' | 'b') => string;
}) {
  const [slot, setSlot] = useState<1 | 2>(1);
  const [email, setEmail] = useState('');
  const [problem, setProblem] = useState<string>();
  const set = useSetMatchScorer(eventId);
  const submit = (e: FormEvent, named: string | null) => {
    e.preventDefault();
    const parsed = matchScorerSchema.safeParse({ slot, email: named });
    setProblem(parsed.success ? undefined : parsed.error.issues[0]?.message);
    if (parsed.success) set.mutate({ matchId: match.id, ...parsed.data });
  };
  const failure = problem ?? set.error?.message;
  return (
    <details>
      <summary className="min-h-12 cursor-pointer py-3 font-bold">Scorers instead of the archers</summary>
      <form onSubmit={(e) => submit(e, email)} className="space-y-2" noValidate>
        <fieldset className="space-y-1">
          <legend>Writes for</legend>
          {([1, 2] as const).map((s) => (
            <label key={s} className="flex min-h-11 items-center gap-2">
              <input
                type="radio"
                name={`scorer-slot-${match.id}`}
                checked={slot === s}
                onChange={() => setSlot(s)}
                className="h-11 w-11 accent-ink"
              />
              Writer {s}, in place of {names(s === 1 ? 'a' : 'b')}
            </label>
          ))}
        </fieldset>
        <Field
          label="Scorer’s e-mail"
          type="email"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
        />
        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="secondary" disabled={set.isPending}>
            Name the scorer
          </Button>
          <Button variant="secondary" disabled={set.isPending} onClick={(e) => submit(e, null)}>
            Back to the archer
          </Button>
        </div>
        {set.isSuccess && <Notice tone="success">Saved. The scorer joins with the match’s code.</Notice>}
        {failure && <Notice tone="error">{failure}</Notice>}
      </form>
    </details>
  );
}
