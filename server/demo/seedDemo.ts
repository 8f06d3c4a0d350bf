import bcrypt from 'bcryptjs';
import type { Db } from '../db';
import { nowIso } from '../time';
import { getRound } from '../../src/core';
import { ensureJoinCodes } from '../services/organizer/joinCodes';
import { planTargets } from '../services/organizer/targetAssignment';
import { loadLayout } from '../services/organizer/targetLayout';
import type { SessionRow } from '../services/organizer/sessions';
import type { SigningKeys } from '../services/signing/serverKeys';
import { playDemoField } from './demoField';
import {
  DEMO_ARCHER_EMAIL,
  DEMO_DIVISIONS,
  DEMO_EVENT,
  DEMO_JUDGES,
  DEMO_ORGANIZER,
  DEMO_PASSWORD,
  DEMO_SESSION,
  demoArchers,
} from './demoPeople';

/** Cost of the demo accounts' shared hash; the same as real accounts use. */
const BCRYPT_COST = 12;

/**
 * Fills an empty database with the invented demo event, partway through its session (see
 * demoField.ts). It refuses to touch a database that already holds any account, so real data is
 * never overwritten; it is made in one transaction, so it is there whole or not at all.
 */
export async function seedDemoIfEmpty(db: Db, signingKeys: SigningKeys): Promise<boolean> {
  const row = await db('users').count<{ n: number | string }[]>({ n: '*' }).first();
  if (Number(row?.n ?? 0) > 0) return false;

  // Every demo account shares one password, so one hash serves them all.
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, BCRYPT_COST);
  const at = nowIso();

  await db.transaction(async (trx) => {
    const [organizer] = await trx('users')
      .insert({
        email: DEMO_ORGANIZER.email,
        display_name: DEMO_ORGANIZER.name,
        password_hash: passwordHash,
        email_verified_at: at,
        created_at: at,
      })
      .returning('id');
    const organizerId = (organizer as { id: number }).id;

    const [event] = await trx('events')
      .insert({
        name: DEMO_EVENT.name,
        venue: DEMO_EVENT.venue,
        starts_on: DEMO_EVENT.startsOn,
        ends_on: DEMO_EVENT.endsOn,
        time_zone: DEMO_EVENT.timeZone,
        created_by: organizerId,
        created_at: at,
        updated_at: at,
      })
      .returning('id');
    const eventId = (event as { id: number }).id;
    await trx('event_roles').insert({
      event_id: eventId,
      user_id: organizerId,
      role: 'organizer',
      created_at: at,
    });

    const judgeIds: number[] = [];
    for (const judge of DEMO_JUDGES) {
      const [user] = await trx('users')
        .insert({
          email: judge.email,
          display_name: judge.name,
          password_hash: passwordHash,
          email_verified_at: at,
          created_at: at,
        })
        .returning('id');
      judgeIds.push((user as { id: number }).id);
      await trx('event_roles').insert({
        event_id: eventId,
        user_id: (user as { id: number }).id,
        role: 'judge',
        created_at: at,
      });
    }

    const divisionIds = new Map<string, number>();
    for (const division of DEMO_DIVISIONS) {
      const [row] = await trx('divisions')
        .insert({
          event_id: eventId,
          bow_style: division.bowStyle,
          class_name: division.className,
          name: division.name,
        })
        .returning('id');
      divisionIds.set(division.name, (row as { id: number }).id);
    }

    for (const archer of demoArchers()) {
      const [user] = await trx('users')
        .insert({
          email: archer.email,
          display_name: archer.name,
          password_hash: passwordHash,
          email_verified_at: at,
          created_at: at,
        })
        .returning('id');
      const userId = (user as { id: number }).id;
      await trx('event_roles').insert({ event_id: eventId, user_id: userId, role: 'archer', created_at: at });
      await trx('entries').insert({
        event_id: eventId,
        division_id: divisionIds.get(archer.division)!,
        user_id: userId,
        name: archer.name,
        club: archer.club,
        email: archer.email,
        class_name: archer.className,
        created_at: at,
      });
    }

    // One session with each division's catalog round, every archer on a target, join codes issued.
    const [session] = await trx('event_sessions')
      .insert({ event_id: eventId, name: DEMO_SESSION.name, starts_at: DEMO_SESSION.startsAt })
      .returning('id');
    const sessionId = (session as { id: number }).id;
    for (const division of DEMO_DIVISIONS) {
      const round = getRound(DEMO_SESSION.roundFor[division.bowStyle]);
      await trx('session_divisions').insert({
        session_id: sessionId,
        division_id: divisionIds.get(division.name)!,
        round_id: round.id,
        round_json: JSON.stringify(round),
      });
    }
    const sessionRow: SessionRow = {
      id: sessionId,
      event_id: eventId,
      name: DEMO_SESSION.name,
      starts_at: DEMO_SESSION.startsAt,
      closed_at: null,
    };
    const placements = planTargets(await loadLayout(trx, sessionRow));
    for (const p of placements) {
      await trx('target_assignments').insert({
        session_id: sessionId,
        entry_id: p.entryId,
        target_number: p.targetNumber,
        position: p.position,
      });
    }
    await ensureJoinCodes(
      trx,
      sessionId,
      placements.map((p) => p.targetNumber),
    );

    // The session partway through on targets 1–3, pushed as real mutations (in this transaction).
    await playDemoField(trx, signingKeys, sessionId, judgeIds, DEMO_ARCHER_EMAIL());
  });
  return true;
}
