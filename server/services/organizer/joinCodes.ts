import { randomInt } from 'node:crypto';
import QRCode from 'qrcode';
import type { JoinCode } from '../../../src/contract/events';
import type { Db } from '../../db';
import { conflict, notFound } from '../../http/httpError';
import { nowIso } from '../../time';

/**
 * Join codes are read off a target sheet and typed on a phone in the field, so the alphabet
 * leaves out characters that look alike: 0/O, 1/I/L, 8/B.
 */
export const JOIN_CODE_ALPHABET = 'ACDEFGHJKMNPQRSTUVWXYZ2345679';
export const JOIN_CODE_LENGTH = 6;

export function randomJoinCode(): string {
  let code = '';
  for (let i = 0; i < JOIN_CODE_LENGTH; i += 1)
    code += JOIN_CODE_ALPHABET[randomInt(JOIN_CODE_ALPHABET.length)];
  return code;
}

export const joinUrl = (baseUrl: string, code: string): string => `${baseUrl}/join?code=${code}`;

export type JoinCodeRow = {
  id: number;
  session_id: number;
  target_number: number;
  code: string;
  created_at: string;
  revoked_at: string | null;
};

export async function activeJoinCodes(db: Db, sessionId: number): Promise<Map<number, JoinCodeRow>> {
  const rows = (await db('join_codes')
    .where({ session_id: sessionId })
    .whereNull('revoked_at')
    .select()) as JoinCodeRow[];
  return new Map(rows.map((r) => [r.target_number, r]));
}

/** Inserts a fresh code for the target; codes are unique across all events (a collision draws again). */
async function insertCode(db: Db, sessionId: number, targetNumber: number): Promise<string> {
  for (let attempt = 0; attempt < 20; attempt += 1) {
    const code = randomJoinCode();
    if (await db('join_codes').where({ code }).first('id')) continue;
    await db('join_codes').insert({
      session_id: sessionId,
      target_number: targetNumber,
      code,
      created_at: nowIso(),
    });
    return code;
  }
  throw new Error('Could not draw an unused join code after 20 attempts.');
}

/** Gives every listed target a code if it has no active one; existing codes stay, so printed sheets keep working. */
export async function ensureJoinCodes(
  db: Db,
  sessionId: number,
  targetNumbers: Iterable<number>,
): Promise<number> {
  const active = await activeJoinCodes(db, sessionId);
  let created = 0;
  for (const target of new Set(targetNumbers)) {
    if (active.has(target)) continue;
    await insertCode(db, sessionId, target);
    created += 1;
  }
  return created;
}

export async function assignedTargetNumbers(db: Db, sessionId: number): Promise<number[]> {
  const rows = await db('target_assignments')
    .where({ session_id: sessionId })
    .distinct('target_number')
    .orderBy('target_number');
  return rows.map((r) => Number(r.target_number));
}

async function requireTargetInUse(db: Db, sessionId: number, targetNumber: number): Promise<void> {
  const used = await db('target_assignments')
    .where({ session_id: sessionId, target_number: targetNumber })
    .first('id');
  if (!used) throw notFound(`Target ${targetNumber} has no archers in this session.`);
}

/** Revokes the target's current code (a photo of the sheet went round, a phone was lost) and issues a new one. */
export async function reissueJoinCode(
  db: Db,
  sessionId: number,
  targetNumber: number,
): Promise<{ code: string; revoked: string | null }> {
  await requireTargetInUse(db, sessionId, targetNumber);
  return db.transaction(async (trx) => {
    const current = (await activeJoinCodes(trx, sessionId)).get(targetNumber);
    if (current) await trx('join_codes').where({ id: current.id }).update({ revoked_at: nowIso() });
    const code = await insertCode(trx, sessionId, targetNumber);
    return { code, revoked: current?.code ?? null };
  });
}

/** Revokes the target's code without a new one: no phone can join the target until one is issued. */
export async function revokeJoinCode(db: Db, sessionId: number, targetNumber: number): Promise<string> {
  const current = (await activeJoinCodes(db, sessionId)).get(targetNumber);
  if (!current) throw conflict(`Target ${targetNumber} has no join code to revoke.`);
  await db('join_codes').where({ id: current.id }).update({ revoked_at: nowIso() });
  return current.code;
}

export async function toJoinCode(row: JoinCodeRow, baseUrl: string): Promise<JoinCode> {
  const url = joinUrl(baseUrl, row.code);
  return {
    code: row.code,
    joinUrl: url,
    qrDataUrl: await QRCode.toDataURL(url, { errorCorrectionLevel: 'M', margin: 2, width: 256 }),
    createdAt: row.created_at,
  };
}
