import type { ArrowValue, FaceId } from '../../core';
import { countedValues, groupStats, isPlotted, offsetOnSpot, practiceTally } from '../../core/practice';
import type { GroupStats, OffsetMm, PracticeTally } from '../../core/practice';
import type { PracticeEndRow } from '../../local/db';

/** One distance and face of a session: its tally and, for plotted arrows, its group. */
export type DistancePart = {
  distanceM: number;
  faceId: FaceId;
  tally: PracticeTally;
  /** Plotted arrows as offsets from their spot's centre. */
  points: OffsetMm[];
  group: GroupStats | undefined;
};

export type PracticeSummary = { tally: PracticeTally; parts: DistancePart[] };

/** The session's statistics (docs/practice.md), whole and per distance and face, in shooting order. */
export function summarize(ends: readonly PracticeEndRow[]): PracticeSummary {
  const all: ArrowValue[] = [];
  const byPart = new Map<
    string,
    { distanceM: number; faceId: FaceId; values: ArrowValue[]; points: OffsetMm[] }
  >();
  for (const end of ends) {
    const values = countedValues(end.arrows);
    all.push(...values);
    const key = `${end.distanceM}:${end.faceId}`;
    let part = byPart.get(key);
    if (!part) {
      part = { distanceM: end.distanceM, faceId: end.faceId, values: [], points: [] };
      byPart.set(key, part);
    }
    part.values.push(...values);
    for (const arrow of end.arrows)
      if (isPlotted(arrow)) part.points.push(offsetOnSpot(end.faceId, arrow.xMm, arrow.yMm));
  }
  return {
    tally: practiceTally(all),
    parts: [...byPart.values()].map((p) => ({
      distanceM: p.distanceM,
      faceId: p.faceId,
      tally: practiceTally(p.values),
      points: p.points,
      group: groupStats(p.points),
    })),
  };
}

/** "12 mm at 2 o'clock", or "dead centre". */
export function describeCentre(group: GroupStats): string {
  const mm = Math.round(group.offsetMm);
  return group.clock === undefined || mm === 0 ? 'on the centre' : `${mm} mm at ${group.clock} o’clock`;
}
