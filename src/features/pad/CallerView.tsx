import { useState } from 'react';
import { endView, sortEnd, type ArrowValue } from '../../core';
import { endKeyOf, localDb, type JoinedTarget } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { EndArrows } from './EndArrows';
import { END_STATE_LABELS } from './endStateLabel';
import { roundEnds } from './useEndNavigation';

type Choice = ArrowValue | 'judge';

/** One archer's mismatch: both cards side by side, and a choice per differing arrow. */
function SettleEnd({
  target,
  archerIndex,
  endIndex,
  local,
}: {
  target: JoinedTarget;
  archerIndex: number;
  endIndex: number;
  local: LocalEnd;
}) {
  const archer = target.archers[archerIndex]!;
  const view = endView(local.facts);
  const [choices, setChoices] = useState<Record<number, Choice>>({});
  const { save, problem } = useLocalSave();
  const first = local.slots[1];
  const second = local.slots[2];
  if (!first || !second) return null;
  const differing = view.check.arrows.filter((a) => !a.same);
  const arrowsPerEnd = roundEnds(archer)[endIndex]?.arrowsPerEnd ?? first.arrows.length;
  const complete = differing.every((a) => choices[a.index] !== undefined);

  const settle = async () => {
    const arrows: ArrowValue[] = [];
    const disputed: number[] = [];
    for (const a of view.check.arrows) {
      const choice = a.same ? a.first : choices[a.index];
      // A position sent to a judge keeps writer 1's value until the judge rules.
      const value = choice === 'judge' ? (a.first ?? a.second) : choice;
      if (choice === 'judge') disputed.push(a.index);
      if (value) arrows.push(value);
    }
    await recordChange(localDb(), target.userId, {
      kind: 'end.settle',
      args: {
        sessionId: target.session.id,
        entryId: archer.entryId,
        endIndex,
        arrows: sortEnd(arrows),
        disputed,
        basis: { first: first.revision, second: second.revision },
      },
    });
    syncLoop().kick();
  };

  return (
    <article
      className="surface space-y-3 rounded-xl border-2 border-brick bg-card p-3"
      data-testid={`mismatch-${archer.position}`}
    >
      <h3 className="text-xl font-bold">
        ≠ {archer.position} · {archer.name}
      </h3>
      <div className="space-y-2">
        <p className="font-bold">Writer 1</p>
        <EndArrows
          label="Writer 1's values"
          arrows={first.arrows}
          slots={arrowsPerEnd}
          differing={new Set(differing.map((d) => d.index))}
        />
        <p className="font-bold">Writer 2</p>
        <EndArrows
          label="Writer 2's values"
          arrows={second.arrows}
          slots={arrowsPerEnd}
          differing={new Set(differing.map((d) => d.index))}
        />
      </div>
      {differing.map((a) => (
        <fieldset key={a.index} className="space-y-2">
          <legend className="font-bold">Arrow {a.index + 1}: which value did you call?</legend>
          <div className="flex flex-wrap gap-2">
            {[a.first, a.second]
              .filter((v): v is ArrowValue => v !== undefined)
              .filter((v, i, all) => all.indexOf(v) === i)
              .map((v) => (
                <button
                  key={v}
                  type="button"
                  aria-pressed={choices[a.index] === v}
                  onClick={() => setChoices((c) => ({ ...c, [a.index]: v }))}
                  className={`min-h-14 min-w-16 rounded-lg border-2 px-3 text-2xl font-bold ${choices[a.index] === v ? 'border-ink bg-ink text-white' : 'border-ink'}`}
                >
                  {v}
                </button>
              ))}
            <button
              type="button"
              aria-pressed={choices[a.index] === 'judge'}
              onClick={() => setChoices((c) => ({ ...c, [a.index]: 'judge' }))}
              className={`min-h-14 rounded-lg border-2 px-3 font-bold ${choices[a.index] === 'judge' ? 'border-ink bg-ink text-white' : 'border-ink'}`}
            >
              ? Send to a judge
            </button>
          </div>
        </fieldset>
      ))}
      {problem && <Notice tone="error">{problem}</Notice>}
      <Button className="w-full" disabled={!complete} onClick={() => save(settle)}>
        Settle this end
      </Button>
    </article>
  );
}

/** The caller's view of an end: every archer's state, and each mismatch to settle. */
export function CallerView({
  target,
  ends,
  endIndex,
}: {
  target: JoinedTarget;
  ends: Map<string, LocalEnd>;
  endIndex: number;
}) {
  const rows = target.archers.map((archer, archerIndex) => {
    const local = ends.get(endKeyOf(target.session.id, archer.entryId, endIndex));
    return { archer, archerIndex, local, view: local ? endView(local.facts) : undefined };
  });
  const mismatches = rows.filter((r) => r.view?.state === 'mismatch');
  return (
    <div className="space-y-4">
      <ul className="space-y-2" aria-label="Archers on this target">
        {rows.map(({ archer, view }) => (
          <li
            key={archer.entryId}
            className="surface flex items-center justify-between rounded-lg border border-line bg-card p-3"
          >
            <span className="font-bold">
              {archer.position} · {archer.name}
            </span>
            <span data-testid={`state-${archer.position}`}>
              {END_STATE_LABELS[view?.state ?? 'open'].mark} {END_STATE_LABELS[view?.state ?? 'open'].word}
              {view?.arrows && <span className="ml-2 font-bold">{view.arrows.join(' ')}</span>}
            </span>
          </li>
        ))}
      </ul>
      {mismatches.length === 0 ? (
        <p>No mismatch on this end. When both writers' cards are in and agree, arrows can be pulled.</p>
      ) : (
        mismatches.map((r) => (
          <SettleEnd
            key={`${r.archer.entryId}-${endIndex}`}
            target={target}
            archerIndex={r.archerIndex}
            endIndex={endIndex}
            local={r.local!}
          />
        ))
      )}
    </div>
  );
}
