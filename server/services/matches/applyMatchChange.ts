import type { MatchMutation } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { rolesInEvent } from '../../auth/eventRoles';
import { HttpError } from '../../http/httpError';
import type { Author } from '../sync/effects';
import { countersignMatch } from './countersignMatch';
import { signMatchEnd } from './endSignatures';
import { recordMatchEnd, recordMatchShootOff, signMatch } from './matchActions';
import { recordMatchWrite } from './matchWrites';
import { recordFirstShooter } from './shootingOrder';

/** A writer's end, an archer's countersignature, who shoots first: their own rules say who may (not the judge role alone). */
const byWriterOrArcher = (m: MatchMutation) =>
  m.kind === 'match.write' || m.kind === 'match.countersign' || m.kind === 'match.firstShooter';

/**
 * A match change from the phone's outbox: a judge's (`match.end`, `match.shootoff`, `match.endSign`,
 * `match.sign`), a writer's end (`match.write`), an archer's countersignature (`match.countersign`) or
 * who shoots first in an alternating match (`match.firstShooter`, a writer or a judge), applied
 * through the same services as the match routes, inside the push's transaction. The sync
 * log answers a change pushed again, so it takes effect once. A refusal (not a judge of the event,
 * a match of another event, a card the rules cannot produce) comes back as its sentence, with
 * nothing stored: the phone shows it like any other refused change.
 */
export async function applyMatchChange(trx: Db, m: MatchMutation, by: Author): Promise<string | null> {
  if (by.transcribedBy)
    return `A match card counts only from the phone of the person who wrote or signed it. This file was not signed by that phone, so ${by.transcribedBy.name} cannot bring it in; ask them to send it from their phone.`;
  const { eventId, matchId } = m.args;
  if (!byWriterOrArcher(m) && !(await rolesInEvent(trx, by.userId, eventId)).includes('judge'))
    return 'Only a judge of this event can score its matches. Ask one of the event’s judges.';
  try {
    // A savepoint: a refusal half-way leaves nothing of this change behind.
    await trx.transaction(async (sp) => {
      if (m.kind === 'match.end') {
        const { a, b, endIndex } = m.args;
        await recordMatchEnd(sp, eventId, matchId, endIndex, { a, b }, by.userId);
      } else if (m.kind === 'match.write') {
        await recordMatchWrite(sp, m.args, by.userId);
      } else if (m.kind === 'match.firstShooter') {
        await recordFirstShooter(sp, m.args, by.userId);
      } else if (m.kind === 'match.countersign') {
        await countersignMatch(sp, eventId, matchId, by.userId);
      } else if (m.kind === 'match.endSign') {
        await signMatchEnd(sp, eventId, matchId, m.args.endIndex, by.userId);
      } else if (m.kind === 'match.shootoff') {
        await recordMatchShootOff(sp, eventId, matchId, { a: m.args.a, b: m.args.b }, by.userId);
      } else {
        await signMatch(sp, eventId, matchId, by.userId);
      }
    });
    return null;
  } catch (error) {
    if (error instanceof HttpError && error.status < 500) return error.message;
    throw error;
  }
}
