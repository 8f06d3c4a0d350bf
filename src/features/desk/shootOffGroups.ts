import { arrowPoints } from '../../core';
import { rankArchers } from '../../core/ranking';
import type { EventResults, ShootOffArrowDto, ShootOffRecordArgs, StandingRow } from '../../contract/results';
import type { OutboxRow } from '../../local/db';

/** A shoot-off arrow as the judge's phone knows it: the server's copy, or this phone's change and its state. */
export type KnownArrow = ShootOffArrowDto & { state: 'synced' | 'waiting' };

export type ShootOffArcher = {
  entryId: number;
  name: string;
  targetNumber: number;
  /** Place after the arrows known on this phone (waiting ones included). */
  place: number;
  /** Still level with another archer where it matters: shoots the next arrow. */
  level: boolean;
  arrows: KnownArrow[];
};

export type ShootOffGroup = {
  key: string;
  sessionId: number;
  sessionName: string;
  divisionName: string;
  total: number;
  /** Every archer has an arrow that tells them apart. */
  settled: boolean;
  /** The next arrow still-level archers shoot (from 0). */
  nextArrow: number;
  archers: ShootOffArcher[];
};

/** The server's arrows with this phone's later changes laid over them (latest change per arrow wins). */
function knownArrows(row: StandingRow, changes: OutboxRow[]): KnownArrow[] {
  const arrows: KnownArrow[] = row.shootOffArrows.map((a) => ({ ...a, state: 'synced' }));
  for (const change of [...changes].sort((a, b) => a.seq - b.seq)) {
    const args = change.args as ShootOffRecordArgs;
    const waiting = change.status === 'pending' || change.status === 'held';
    // A delivered change is already in the server's copy unless that copy is older than it.
    if (!waiting && (change.status !== 'applied' || args.arrowIndex < row.shootOffArrows.length)) continue;
    arrows[args.arrowIndex] = {
      value: args.value,
      ...(args.distanceMm !== undefined && { distanceMm: args.distanceMm }),
      ...(args.closer && { closer: true }),
      state: waiting ? 'waiting' : 'synced',
    };
  }
  // Arrows are shot in order; a gap (an arrow recorded out of turn) ends what counts.
  const firstGap = arrows.findIndex((a) => a === undefined);
  return firstGap === -1 ? arrows : arrows.slice(0, firstGap);
}

/**
 * The event's ties that a shoot-off decides (or has decided), one group per equal total, with
 * the order the known arrows give: the core's own rule, applied to the group alone with the cut
 * or the medal places moved to where the group starts, so it agrees with the server's standings.
 */
export function shootOffGroups(results: EventResults, changes: OutboxRow[]): ShootOffGroup[] {
  const groups: ShootOffGroup[] = [];
  for (const session of results.sessions) {
    for (const division of session.divisions) {
      const tied = division.rows.filter((r) => r.shootOff || r.decidedByShootOff);
      for (const total of [...new Set(tied.map((r) => r.total))]) {
        const rows = tied.filter((r) => r.total === total);
        const first = Math.min(...rows.map((r) => r.place));
        const ranked = rankArchers(
          rows.map((r) => {
            const arrows = knownArrows(
              r,
              changes.filter(
                (c) =>
                  'entryId' in c.args &&
                  c.args.sessionId === session.sessionId &&
                  c.args.entryId === r.entryId,
              ),
            );
            return {
              id: String(r.entryId),
              total: r.total,
              tens: 0,
              xs: 0,
              nines: 0,
              row: r,
              arrows,
              shootOff: arrows,
            };
          }),
          division.cut === null
            ? { medalPlaces: Math.max(0, 3 - (first - 1)) }
            : { cut: Math.max(0, division.cut - (first - 1)) },
        );
        // The ranking's placing replaces the input's shoot-off arrows with a flag: the arrows stay in `arrows`.
        const archers = ranked.map((r) => ({
          entryId: r.row.entryId,
          name: r.row.name,
          targetNumber: r.row.targetNumber,
          place: first + r.place - 1,
          level: r.shootOff,
          arrows: r.arrows,
        }));
        const levelOnes = archers.filter((a) => a.level);
        groups.push({
          key: `${session.sessionId}:${division.divisionId}:${total}`,
          sessionId: session.sessionId,
          sessionName: session.name,
          divisionName: division.name,
          total,
          settled: levelOnes.length === 0,
          nextArrow: levelOnes.length ? Math.min(...levelOnes.map((a) => a.arrows.length)) : 0,
          archers,
        });
      }
    }
  }
  return groups;
}

/** Archers whose arrow at this index has the same value as another's in the group: distance or "closer" decides. */
export function equalAt(group: ShootOffGroup, arrowIndex: number): Set<number> {
  const values = new Map<number, number[]>();
  for (const a of group.archers) {
    const arrow = a.arrows[arrowIndex];
    if (!arrow) continue;
    const points = arrowPoints(arrow.value);
    values.set(points, [...(values.get(points) ?? []), a.entryId]);
  }
  return new Set([...values.values()].filter((ids) => ids.length > 1).flat());
}
