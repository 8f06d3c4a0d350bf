import { memo, useMemo, useState } from 'react';
import {
  cardTotals,
  endsOfRound,
  rulesForEnd,
  writerLock,
  type ArrowValue,
  type WriterLock,
} from '../../core';
import { ARROW_FLAGS, type ArrowFlag, type WriterSlot } from '../../contract/fieldTerms';
import { endKeyOf, localDb, type JoinedTarget } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { messageOf } from '../../api/request';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { afterNextPaint } from '../../local/afterPaint';
import { Notice } from '../../ui/Notice';
import { RulingHistory } from '../../ui/scorecard/RulingHistory';
import { ArrowKeypad } from '../../ui/scorecard/ArrowKeypad';
import { EndArrows } from '../../ui/scorecard/EndArrows';
import { addArrow, flagArrow, removeArrow, type EditableEnd } from './endEdits';
import { FLAG_LABELS, openFlags } from '../../ui/scorecard/endFlags';
import { endLabel } from '../../ui/scorecard/endStateLabel';
import { FlagNotes } from './FlagNotes';
import { padEndView } from './padEndView';
import { useSteadyCallback } from './useSteadyCallback';

type Props = {
  target: JoinedTarget;
  slot: WriterSlot;
  ends: Map<string, LocalEnd>;
  endIndex: number;
  archerIndex: number;
  onArcherIndex: (i: number) => void;
};

const other = (slot: WriterSlot): WriterSlot => (slot === 1 ? 2 : 1);

/** What the pad says instead of the keys when the writer may no longer change the end (core `writerLock`). */
const LOCK_WORDS: Record<WriterLock, string> = {
  signed: 'This end is signed. Ask a judge to correct it.',
  ruled: 'A judge has ruled on this end. Only a judge can change it now.',
  closed: 'The session is closed, so its ends can no longer change. Ask a judge.',
};

/** The values the pad counts for an end: what a judge or the caller decided, else this writer's card. */
export function countedValues(
  local: LocalEnd | undefined,
  own: readonly ArrowValue[] | undefined,
): readonly ArrowValue[] | undefined {
  const view = local && padEndView(local);
  return view?.arrows && view.decidedBy !== 'writers' ? view.arrows : own;
}

/**
 * Drawn again only when their own props change: a tap changes this writer's values, not the keys,
 * the judge's history or the other card (a tap's frame draws only what the tap changed).
 */
const SteadyKeypad = memo(ArrowKeypad);
const SteadyRulingHistory = memo(RulingHistory);

const sameValues = (a: object, b: object) => JSON.stringify(a) === JSON.stringify(b);

function withoutKey<T>(record: Record<string, T>, key: string): Record<string, T> {
  const { [key]: _dropped, ...rest } = record;
  return rest;
}

/** The writer's pad for one archer's end: keys, the end so far, totals, and the other card. */
export function WriterPad({ target, slot, ends, endIndex, archerIndex, onArcherIndex }: Props) {
  const archer = target.archers[archerIndex]!;
  // Kept between taps (the target keeps its identity, see usePadData), so the keys' values do too.
  const roundEnds = useMemo(() => endsOfRound(archer.round), [archer.round]);
  const endInfo = roundEnds[endIndex];
  const key = endKeyOf(target.session.id, archer.entryId, endIndex);
  const local = ends.get(key);
  const stored: EditableEnd = {
    arrows: [...(local?.slots[slot]?.arrows ?? [])],
    flags: [...(local?.slots[slot]?.flags ?? [])],
  };
  // Taps faster than IndexedDB answers build on what was just typed, not on the last stored value.
  const [typed, setTyped] = useState<Record<string, EditableEnd>>({});
  const mine = typed[key] ?? stored;
  // Once the store has caught up, show the store again (so a refused change visibly reverts).
  if (typed[key] && JSON.stringify(typed[key]) === JSON.stringify(stored)) setTyped(withoutKey(typed, key));
  const theirs = local?.slots[other(slot)];
  const view = useMemo(() => (local ? padEndView(local) : undefined), [local]);
  const [undo, setUndo] = useState<Record<string, EditableEnd[]>>({});
  const [selected, setSelected] = useState<number>();
  const [notice, setNotice] = useState<{ tone: 'info' | 'error'; text: string }>();
  const lock = writerLock({
    signed: view?.state === 'signed',
    ruled: !!local?.ruling,
    sessionClosed: target.session.closed,
  });

  const rules = useMemo(
    () => (endInfo ? rulesForEnd(archer.round, endInfo, archer.bowStyle, { allowPartial: true }) : undefined),
    [archer.round, archer.bowStyle, endInfo],
  );
  const flags = useMemo(() => openFlags(local), [local]);
  const differing = useMemo(
    () => new Set(view?.check.arrows.filter((a) => !a.same).map((a) => a.index) ?? []),
    [view],
  );

  /** Stores what this writer's card now says for the end; resolves once it is on the phone. */
  const store = async (value: EditableEnd): Promise<boolean> => {
    try {
      await recordChange(localDb(), target.userId, {
        kind: 'end.write',
        args: {
          sessionId: target.session.id,
          entryId: archer.entryId,
          endIndex,
          slot,
          arrows: value.arrows,
          flags: value.flags,
        },
      });
      return true;
    } catch (error) {
      // Show what is stored, not what was typed, and say so.
      setTyped((t) => withoutKey(t, key));
      setNotice({
        tone: 'error',
        text: `The last value was not saved on this phone (${messageOf(error)}). Check the end and enter it again.`,
      });
      return false;
    }
  };

  const write = async (next: EditableEnd, previous: EditableEnd) => {
    const started = performance.now();
    // The database write starts before React renders, so the two overlap instead of queueing.
    const stored = store(next);
    setUndo((u) => ({ ...u, [key]: [...(u[key] ?? []), previous] }));
    setTyped((t) => ({ ...t, [key]: next }));
    if (!(await stored)) return;
    // Read by bench/pad-tap.bench.ts: tap to IndexedDB commit.
    performance.measure('ringcall:tap-to-commit', { start: started });
    // The short buzz says the value is stored on the phone, not only that a key was touched.
    navigator.vibrate?.(10);
    // A sync (its request, its writes, the screens' re-reads) never starts inside the tap's frame.
    afterNextPaint(syncLoop().afterChange);
  };

  const onValues = useSteadyCallback((values: ArrowValue[]) => {
    if (!rules || lock) return;
    const room = rules.arrowsPerEnd - mine.arrows.length;
    if (room < values.length) {
      setNotice({
        tone: 'info',
        text: `All ${rules.arrowsPerEnd} arrows are in. Tap an arrow to change or remove it.`,
      });
      if (room <= 0) return;
    } else setNotice(undefined);
    const next = values.slice(0, room).reduce(addArrow, mine);
    void write(next, mine);
    // A full end moves on to the next archer whose end is not complete yet.
    if (next.arrows.length === rules.arrowsPerEnd) {
      const nextIndex = target.archers.findIndex(
        (a, i) =>
          i > archerIndex &&
          (ends.get(endKeyOf(target.session.id, a.entryId, endIndex))?.slots[slot]?.arrows.length ?? 0) <
            rules.arrowsPerEnd,
      );
      if (nextIndex >= 0) onArcherIndex(nextIndex);
    }
  });

  const onUndo = useSteadyCallback(() => {
    const stack = undo[key] ?? [];
    const previous = stack[stack.length - 1];
    if (!previous) return;
    setUndo((u) => ({ ...u, [key]: stack.slice(0, -1) }));
    setTyped((t) => ({ ...t, [key]: previous }));
    void store(previous).then((stored) => stored && afterNextPaint(syncLoop().afterChange));
  });

  // The archer's card as this writer keeps it, with what a judge or the caller decided instead.
  const counted = roundEnds.map((e) => {
    const endLocal = ends.get(endKeyOf(target.session.id, archer.entryId, e.index));
    return countedValues(endLocal, e.index === endIndex ? mine.arrows : endLocal?.slots[slot]?.arrows);
  });
  const totals = cardTotals(
    archer.round,
    counted.map((v) => (v && v.length ? [...v] : undefined)),
  );

  if (!endInfo || !rules) return <Notice tone="info">This archer's round has no end {endIndex + 1}.</Notice>;
  const endTotal = totals.ends[endIndex]?.total;
  const label = endLabel(view);

  return (
    <section aria-label={`${archer.name}, end ${endIndex + 1}`} className="space-y-4">
      <div className="flex items-baseline justify-between gap-2">
        <h2 className="text-2xl font-bold">
          {archer.position} · {archer.name}
        </h2>
        <p className="text-lg" data-testid="end-state">
          <span aria-hidden="true">{label.mark} </span>
          {label.word}
        </p>
      </div>
      {local?.ruling && (
        <EndArrows
          label="The judge's values for this end"
          arrows={local.ruling.arrows}
          slots={rules.arrowsPerEnd}
        />
      )}
      {local && <SteadyRulingHistory steps={local.rulings} />}
      <FlagNotes flags={flags} />
      <EndArrows
        label="Your values for this end"
        arrows={mine.arrows}
        flags={mine.flags}
        slots={rules.arrowsPerEnd}
        selected={selected}
        onSelect={lock ? undefined : (i) => setSelected(selected === i ? undefined : i)}
        differing={view?.state === 'mismatch' ? differing : undefined}
      />
      <p className="text-xl" data-testid="totals">
        End <strong data-testid="end-total">{endTotal ?? 0}</strong> · Running total{' '}
        <strong data-testid="running-total">{totals.total}</strong> · 10s {totals.tens} · Xs {totals.xs}
      </p>

      {!lock && selected !== undefined && mine.arrows[selected] && (
        <div className="surface space-y-2 rounded-xl border-2 border-ink bg-card p-3">
          <p className="font-bold">
            Arrow {selected + 1}: {mine.arrows[selected]}
          </p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              className="min-h-12 rounded-lg border-2 border-brick px-3 font-bold text-brick"
              onClick={() => {
                void write(removeArrow(mine, selected), mine);
                setSelected(undefined);
              }}
            >
              Remove this arrow
            </button>
            {ARROW_FLAGS.map((flag) => {
              const on = mine.flags.some((f) => f.index === selected && f.flag === flag);
              return (
                <button
                  key={flag}
                  type="button"
                  aria-pressed={on}
                  className={`min-h-12 rounded-lg border-2 px-3 font-bold ${on ? 'border-ink bg-ink text-white' : 'border-ink'}`}
                  onClick={() => {
                    void write(flagArrow(mine, selected, on ? undefined : flag), mine);
                    setSelected(undefined);
                  }}
                >
                  ⚑ {FLAG_LABELS[flag]}
                </button>
              );
            })}
          </div>
        </div>
      )}

      {notice && <Notice tone={notice.tone}>{notice.text}</Notice>}
      {lock ? (
        <Notice tone="info">{LOCK_WORDS[lock]}</Notice>
      ) : (
        <SteadyKeypad
          allowed={rules.allowed}
          onValues={onValues}
          onUndo={onUndo}
          canUndo={(undo[key]?.length ?? 0) > 0}
        />
      )}

      <OtherCard
        slot={other(slot)}
        theirs={theirs?.arrows}
        theirFlags={theirs?.flags}
        state={view?.state}
        decidedBy={view?.decidedBy}
        agreed={view?.arrows}
        arrowsPerEnd={rules.arrowsPerEnd}
        differing={[...differing]}
      />
    </section>
  );
}

/**
 * The other writer's card: drawn again only when it, or what the two cards say together, changes
 * (a re-read after a tap builds equal values anew, so they are compared by value).
 */
const OtherCard = memo(function OtherCard({
  slot,
  theirs,
  theirFlags,
  state,
  decidedBy,
  agreed,
  arrowsPerEnd,
  differing,
}: {
  decidedBy: 'writers' | 'caller' | 'judge' | undefined;
  slot: WriterSlot;
  theirs: readonly ArrowValue[] | undefined;
  theirFlags: { index: number; flag: ArrowFlag }[] | undefined;
  state: string | undefined;
  agreed: ArrowValue[] | undefined;
  arrowsPerEnd: number;
  differing: readonly number[];
}) {
  return (
    <section
      aria-label="Cross-check"
      className="surface space-y-2 rounded-xl border border-line bg-card p-3"
      data-testid="cross-check"
    >
      <h3 className="font-bold">Cross-check with writer {slot}</h3>
      {!theirs ? (
        <p>Writer {slot}'s card for this end has not reached this phone yet.</p>
      ) : (
        <>
          <EndArrows
            label={`Writer ${slot}'s values`}
            arrows={theirs}
            flags={theirFlags}
            slots={arrowsPerEnd}
            differing={state === 'mismatch' ? new Set(differing) : undefined}
          />
          {state === 'agreed' && <p>✓ Both cards agree.</p>}
          {state === 'mismatch' && (
            <p className="font-bold text-brick">
              ≠ The cards differ at arrow {differing.map((i) => i + 1).join(', ')}. The caller settles it
              before arrows are pulled.
            </p>
          )}
          {state === 'settled' && agreed && (
            <p>
              {decidedBy === 'judge' ? '⚖ Decided by a judge' : '✓ Settled by the caller'}: {agreed.join(' ')}
            </p>
          )}
          {state === 'disputed' && <p>? A judge is deciding this end.</p>}
        </>
      )}
    </section>
  );
}, sameValues);
