import type { AlternateFrom } from '../../../core';
import { MATCH_SECONDS_PER_ARROW } from '../../../core/matches';
import type { BracketDto } from '../../../contract/matches';
import { Notice } from '../../../ui/Notice';
import { SelectField } from '../../../ui/SelectField';
import { useSetBracketSettings } from '../api/setBracketSettings';

const CHOICES: Record<AlternateFrom, string> = {
  never: 'Never',
  'medal-matches': 'Bronze and gold matches',
  'semi-finals': 'From the semi-finals on',
};

/**
 * Which of a bracket's matches are shot alternately (one arrow each in turn): their writers and
 * judges are asked who shoots first and shown whose arrow is next. Saved as soon as it is chosen.
 */
export function BracketAlternation({ eventId, bracket }: { eventId: number; bracket: BracketDto }) {
  const set = useSetBracketSettings(eventId);
  return (
    <div className="space-y-2">
      <SelectField
        label="Matches shot alternately"
        hint={`One arrow each in turn, ${MATCH_SECONDS_PER_ARROW} s an arrow; the archer behind starts each end. Otherwise both shoot each end at once.`}
        value={set.isPending ? set.variables.alternate : bracket.alternate}
        disabled={set.isPending}
        onChange={(e) => set.mutate({ bracketId: bracket.id, alternate: e.target.value as AlternateFrom })}
      >
        {(Object.keys(CHOICES) as AlternateFrom[]).map((choice) => (
          <option key={choice} value={choice}>
            {CHOICES[choice]}
          </option>
        ))}
      </SelectField>
      {set.error && <Notice tone="error">{set.error.message}</Notice>}
    </div>
  );
}
