import { useEffect, useRef, useState } from 'react';
import { endsOfRound, sortEnd, type ArrowValue } from '../../core';
import { padEndView } from './padEndView';
import { endKeyOf, localDb, type JoinedTarget } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useLocalSave } from '../../local/useLocalSave';
import { Button } from '../../ui/Button';
import { Notice } from '../../ui/Notice';
import { RulingHistory } from '../../ui/scorecard/RulingHistory';
import { EndArrows } from '../../ui/scorecard/EndArrows';
import { flagWords, openFlags } from '../../ui/scorecard/endFlags';
import { endLabel } from '../../ui/scorecard/endStateLabel';
import { pullAdvice } from './pullAdvice';

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
  const view = padEndView(local);
  const [choices, setChoices] = useState<Record<number, Choice>>({});
  const { save, problem } = useLocalSave();
  const first = local.slots[1];
  const second = local.slots[2];
  if (!first || !second) return null;
  const differing = view.check.arrows.filter((a) => !a.same);
  const arrowsPerEnd = endsOfRound(archer.round)[endIndex]?.arrows ?? first.arrows.length;
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
      <h2 className="text-xl font-bold">
        ≠ {archer.position} · {archer.name}
      </h2>
      <div className="space-y-2">
        <p className="font-bold">Writer 1</p>
        <EndArrows
          label="Writer 1's values"
          arrows={first.arrows}
          flags={first.flags}
          slots={arrowsPerEnd}
          differing={new Set(differing.map((d) => d.index))}
        />
        <p className="font-bold">Writer 2</p>
        <EndArrows
          label="Writer 2's values"
          arrows={second.arrows}
          flags={second.flags}
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

/**
 * Says so when a mismatch arrives on this end while the caller watches: a buzz where the phone
 * allows it, and words a screen reader announces at once. Mismatches already there when the view
 * opened are on screen and are not announced again.
 */
function useMismatchAlert(endIndex: number, mismatched: string[]): string | undefined {
  const known = useRef<{ endIndex: number; keys: Set<string> }>(undefined);
  const [announcement, setAnnouncement] = useState<string>();
  const joined = mismatched.join(',');
  useEffect(() => {
    const now = new Set(joined ? joined.split(',') : []);
    const before = known.current;
    known.current = { endIndex, keys: now };
    if (!before || before.endIndex !== endIndex) return;
    const arrived = [...now].filter((k) => !before.keys.has(k));
    if (arrived.length === 0) return;
    // Chromium allows vibration only after the person has touched the page; it is a bonus, not the alert.
    navigator.vibrate?.([200, 100, 200]);
    setAnnouncement(
      `New mismatch on end ${endIndex + 1}: ${arrived.join(', ')}. Settle it before arrows are pulled.`,
    );
  }, [endIndex, joined]);
  return announcement;
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
    return { archer, archerIndex, local, view: local ? padEndView(local) : undefined };
  });
  const mismatches = rows.filter((r) => r.view?.state === 'mismatch');
  const announcement = useMismatchAlert(
    endIndex,
    mismatches.map((r) => r.archer.position),
  );
  const advice = pullAdvice(rows.map((r) => ({ position: r.archer.position, local: r.local })));
  return (
    <div className="space-y-4">
      <div aria-live="assertive" role="alert" data-testid="mismatch-alert">
        {announcement && (
          <p className="surface rounded-lg border-2 border-brick bg-brick-bg p-3 font-bold text-brick">
            <span aria-hidden="true">≠ </span>
            {announcement}
          </p>
        )}
      </div>
      <ul className="space-y-2" aria-label="Archers on this target">
        {rows.map(({ archer, local, view }) => {
          const label = endLabel(view);
          const flags = openFlags(local);
          return (
            <li key={archer.entryId} className="surface space-y-1 rounded-lg border border-line bg-card p-3">
              <p className="font-bold">
                {archer.position} · {archer.name}
              </p>
              <p data-testid={`state-${archer.position}`}>
                <span aria-hidden="true">{label.mark} </span>
                {label.word}
                {view?.arrows && (
                  <span className="ml-2 whitespace-nowrap font-bold">{view.arrows.join(' ')}</span>
                )}
                {flags.length > 0 && (
                  <span className="block font-bold">
                    <span aria-hidden="true">⚑ </span>
                    {flagWords(flags)}
                  </span>
                )}
              </p>
              {local && <RulingHistory steps={local.rulings} />}
            </li>
          );
        })}
      </ul>
      <p
        data-testid="pull-advice"
        className={`surface rounded-lg border-2 p-3 font-bold ${
          advice.kind === 'pull'
            ? 'border-moss bg-card text-moss-dark'
            : advice.kind === 'hold'
              ? 'border-brick bg-brick-bg text-brick'
              : 'border-ink/40 bg-card text-ink'
        }`}
      >
        <span aria-hidden="true">{advice.kind === 'pull' ? '✓ ' : advice.kind === 'hold' ? '▲ ' : '… '}</span>
        {advice.text}
      </p>
      {mismatches.map((r) => (
        <SettleEnd
          key={`${r.archer.entryId}-${endIndex}`}
          target={target}
          archerIndex={r.archerIndex}
          endIndex={endIndex}
          local={r.local!}
        />
      ))}
    </div>
  );
}
