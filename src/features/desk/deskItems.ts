import { endView, endsOfRound, type ArrowValue, type EndView } from '../../core';
import type { JoinedTarget } from '../../local/db';
import type { LocalEnd } from '../../local/endFacts';
import { flagWords, openFlags } from '../../ui/scorecard/endFlags';

export type DeskItemKind = 'dispute' | 'incident' | 'mismatch' | 'to-sign';

export type DeskItem = {
  kind: DeskItemKind;
  target: JoinedTarget;
  archerIndex: number;
  endIndex: number;
  local: LocalEnd;
  view: EndView;
  detail: string;
  /** Changes whenever anything shown for this end changes: a card redraws only then. */
  revision: string;
};

/** One end's card on the desk, the same across reads. */
export const deskItemKey = (item: Pick<DeskItem, 'target' | 'archerIndex' | 'endIndex'>): string =>
  `${item.target.key}-${item.archerIndex}-${item.endIndex}`;

/**
 * The items a read shows, less the ends signed since that read began. A signed end leaves the desk
 * at the tap (`Infinity` until its signature is stored: no read shows it), without waiting for the
 * desk's ends to be read again; a read begun after the signature was stored is the truth again (a
 * refused signature brings the end back). `signedAt`: by item key, how many reads had begun when
 * its signature was stored; `readNumber`: this read's own number in that count.
 */
export function withoutSigned<T extends Pick<DeskItem, 'target' | 'archerIndex' | 'endIndex'>>(
  items: T[],
  signedAt: ReadonlyMap<string, number>,
  readNumber: number,
): T[] {
  return items.filter((item) => (signedAt.get(deskItemKey(item)) ?? -1) < readNumber);
}

/** Most urgent first: a judge's decision before a signature. */
const KIND_ORDER: DeskItemKind[] = ['dispute', 'incident', 'mismatch', 'to-sign'];

export const DESK_KIND_LABELS: Record<DeskItemKind, { mark: string; word: string }> = {
  dispute: { mark: '?', word: 'Disputed arrow' },
  incident: { mark: '⚑', word: 'Incident' },
  mismatch: { mark: '≠', word: 'Cards differ' },
  'to-sign': { mark: '✍', word: 'Ready to sign' },
};

function describe(local: LocalEnd, view: EndView): { kind: DeskItemKind; detail: string } | undefined {
  if (view.state === 'signed') return undefined;
  if (view.state === 'disputed') {
    const positions = local.facts.settlement?.disputed.map((i) => i + 1).join(', ') ?? '';
    return { kind: 'dispute', detail: `The caller sent arrow ${positions} to a judge.` };
  }
  if (view.openIncidents > 0) {
    return {
      kind: 'incident',
      detail: `${flagWords(openFlags(local))}. Rule on the end before it can be signed.`,
    };
  }
  if (view.state === 'mismatch') {
    const differing = view.check.arrows.filter((a) => !a.same).map((a) => a.index + 1);
    return {
      kind: 'mismatch',
      detail: `The two cards differ at arrow ${differing.join(', ')}; the caller has not settled it.`,
    };
  }
  if (view.canSign) return { kind: 'to-sign', detail: `${view.arrows?.join(' ')}` };
  return undefined;
}

function revisionOf(kind: DeskItemKind, target: JoinedTarget, local: LocalEnd): string {
  const pending = [local.slots[1]?.pending, local.slots[2]?.pending, local.settlementPending];
  return JSON.stringify([kind, target.joinedAt, local.facts, pending, local.rulings.length, local.signature]);
}

/** What needs a judge on these targets, most urgent kind first, then target, end and position. */
export function deskItems(
  targets: JoinedTarget[],
  ends: Map<string, LocalEnd>,
  keyOf: (t: JoinedTarget, entryId: number, endIndex: number) => string,
): DeskItem[] {
  const items: DeskItem[] = [];
  for (const target of targets) {
    target.archers.forEach((archer, archerIndex) => {
      for (const { index: endIndex } of endsOfRound(archer.round)) {
        const local = ends.get(keyOf(target, archer.entryId, endIndex));
        if (!local) continue;
        const view = endView(local.facts);
        const found = describe(local, view);
        if (found)
          items.push({
            ...found,
            target,
            archerIndex,
            endIndex,
            local,
            view,
            revision: revisionOf(found.kind, target, local),
          });
      }
    });
  }
  return items.sort(
    (a, b) =>
      KIND_ORDER.indexOf(a.kind) - KIND_ORDER.indexOf(b.kind) ||
      a.endIndex - b.endIndex ||
      a.target.targetNumber - b.target.targetNumber ||
      a.archerIndex - b.archerIndex,
  );
}

/**
 * What the form starts from: the values the writers or the caller agree on. Disputed, differing
 * and flagged arrows stay empty, so the judge decides them rather than confirming one writer.
 */
export function startingValues(item: Pick<DeskItem, 'local' | 'view'>, count: number): (ArrowValue | '')[] {
  const { local, view } = item;
  const blank = new Set([
    ...(view.state === 'disputed' ? (local.facts.settlement?.disputed ?? []) : []),
    ...(view.state === 'mismatch' ? view.check.arrows.filter((a) => !a.same).map((a) => a.index) : []),
    ...openFlags(local).map((f) => f.index),
  ]);
  const decided = view.arrows ?? local.facts.settlement?.arrows;
  return Array.from({ length: count }, (_, i) => {
    if (blank.has(i)) return '';
    if (decided) return decided[i] ?? '';
    const both = view.check.arrows[i];
    return both?.same ? (both.first ?? '') : '';
  });
}

export type TargetSummary = {
  target: JoinedTarget;
  counts: Record<DeskItemKind, number>;
  /** The most urgent kind waiting on this target; undefined when nothing waits. */
  first: DeskItemKind | undefined;
};

/**
 * One row per target for the desk's overview, targets whose ends need a judge's decision first
 * (disputes, then incidents, then differing cards), then those with ends to sign, then the rest.
 */
export function targetSummaries(targets: JoinedTarget[], items: DeskItem[]): TargetSummary[] {
  const byTarget = new Map(
    targets.map((target) => [
      target.key,
      {
        target,
        counts: { dispute: 0, incident: 0, mismatch: 0, 'to-sign': 0 } as Record<DeskItemKind, number>,
      },
    ]),
  );
  for (const item of items) {
    const summary = byTarget.get(item.target.key);
    if (summary) summary.counts[item.kind] += 1;
  }
  const rank = (first: DeskItemKind | undefined) => (first ? KIND_ORDER.indexOf(first) : KIND_ORDER.length);
  return [...byTarget.values()]
    .map((s) => ({ ...s, first: KIND_ORDER.find((kind) => s.counts[kind] > 0) }))
    .sort((a, b) => rank(a.first) - rank(b.first) || a.target.targetNumber - b.target.targetNumber);
}
