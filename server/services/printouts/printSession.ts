import type { Position } from '../../../src/contract/events';
import type { RoundDefinition } from '../../../src/core';
import type { Db } from '../../db';
import { conflict } from '../../http/httpError';
import { loadEvent } from '../organizer/events';
import { activeJoinCodes, joinUrl } from '../organizer/joinCodes';
import type { SessionRow } from '../organizer/sessions';
import { facesPerTarget } from '../organizer/targetFaces';
import { loadLayout } from '../organizer/targetLayout';

export type PrintArcher = {
  entryId: number;
  name: string;
  club: string;
  divisionName: string;
  round: RoundDefinition | null;
  targetNumber: number;
  position: Position;
};

/** Everything the printouts of one session need, gathered once. */
export type PrintSession = {
  event: { name: string; venue: string };
  session: { name: string; startsAt: string };
  targets: {
    targetNumber: number;
    archers: PrintArcher[];
    facesPerTarget: number;
    joinCode: string | null;
    joinUrl: string | null;
  }[];
};

export async function loadPrintSession(db: Db, session: SessionRow, baseUrl: string): Promise<PrintSession> {
  const event = await loadEvent(db, session.event_id);
  const layout = (await loadLayout(db, session))
    .filter((e) => e.targetNumber !== null)
    .sort((a, b) => a.targetNumber! - b.targetNumber! || a.position!.localeCompare(b.position!));
  if (layout.length === 0)
    throw conflict(`No archers are on targets in "${session.name}" yet. Assign targets first, then print.`);
  const codes = await activeJoinCodes(db, session.id);
  const targets: PrintSession['targets'] = [];
  for (const e of layout) {
    let target = targets[targets.length - 1];
    if (!target || target.targetNumber !== e.targetNumber) {
      const code = codes.get(e.targetNumber!)?.code ?? null;
      target = {
        targetNumber: e.targetNumber!,
        archers: [],
        facesPerTarget: 1,
        joinCode: code,
        joinUrl: code ? joinUrl(baseUrl, code) : null,
      };
      targets.push(target);
    }
    target.archers.push({
      entryId: e.entryId,
      name: e.name,
      club: e.club,
      divisionName: e.divisionName,
      round: e.round,
      targetNumber: e.targetNumber!,
      position: e.position!,
    });
  }
  for (const t of targets) {
    t.facesPerTarget = facesPerTarget(
      t.archers.flatMap((a) => (a.round ? [a.round] : [])),
      t.archers.length,
    );
  }
  return {
    event: { name: event.name, venue: event.venue },
    session: { name: session.name, startsAt: session.starts_at },
    targets,
  };
}
