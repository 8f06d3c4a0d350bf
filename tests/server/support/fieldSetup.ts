import { randomUUID } from 'node:crypto';
import type { BowStyleName, Position } from '../../../src/contract/events';
import { getRound } from '../../../src/core';
import type { Db } from '../../../server/db';
import { nowIso } from '../../../server/time';
import { makeEvent, makePerson, giveRole, type TestPerson } from './people';

/*
 * A session ready for the field, written straight into the database: divisions with their
 * rounds (catalog snapshots, as the setup screens store them), entries, target assignments in
 * A–D order and one join code per target.
 */

export type FieldDivision = { name: string; bowStyle: BowStyleName; roundId: string };
export type FieldArcher = {
  entryId: number;
  name: string;
  division: string;
  targetNumber: number;
  position: Position;
};
export type FieldTarget = { number: number; code: string; archers: FieldArcher[] };
export type Field = {
  eventId: number;
  sessionId: number;
  organizer: TestPerson;
  judge: TestPerson;
  targets: Map<number, FieldTarget>;
  /** The archer at a target and position, e.g. archer(7, 'A'). */
  archer: (targetNumber: number, position: Position) => FieldArcher;
};

export type FieldSpec = {
  divisions: FieldDivision[];
  /** Per target, its archers in position order (A, B, C, D), each naming its division. */
  targets: { number: number; archers: { name: string; division: string }[] }[];
  closed?: boolean;
  eventName?: string;
};

let codeCounter = 0;

/** A join code in the real alphabet, unique across the test run. */
function testCode(): string {
  const alphabet = 'ACDEFGHJKMNPQRSTUVWXYZ2345679';
  codeCounter += 1;
  let n = codeCounter * 7919 + (Date.now() % 100_000);
  let code = '';
  for (let i = 0; i < 6; i += 1) {
    code += alphabet[n % alphabet.length];
    n = Math.floor(n / alphabet.length);
  }
  return code;
}

export async function setUpField(db: Db, spec: FieldSpec): Promise<Field> {
  const organizer = await makePerson(db, 'Field Organizer');
  const judge = await makePerson(db, 'Field Judge');
  const eventId = await makeEvent(db, organizer, spec.eventName ?? 'Field Shoot');
  await giveRole(db, eventId, judge, 'judge');
  const insertId = async (table: string, row: object): Promise<number> => {
    const [r] = await db(table).insert(row).returning('id');
    return (r as { id: number }).id;
  };

  const sessionId = await insertId('event_sessions', {
    event_id: eventId,
    name: 'Qualification',
    starts_at: '2026-12-12T09:00',
    closed_at: spec.closed ? nowIso() : null,
  });
  const divisionIds = new Map<string, number>();
  for (const d of spec.divisions) {
    const id = await insertId('divisions', {
      event_id: eventId,
      bow_style: d.bowStyle,
      class_name: d.name,
      name: d.name,
    });
    divisionIds.set(d.name, id);
    await db('session_divisions').insert({
      session_id: sessionId,
      division_id: id,
      round_id: d.roundId,
      round_json: JSON.stringify(getRound(d.roundId)),
    });
  }

  const targets = new Map<number, FieldTarget>();
  for (const t of spec.targets) {
    const archers: FieldArcher[] = [];
    for (const [i, a] of t.archers.entries()) {
      const divisionId = divisionIds.get(a.division);
      if (!divisionId) throw new Error(`No division "${a.division}" in the field spec.`);
      const entryId = await insertId('entries', {
        event_id: eventId,
        division_id: divisionId,
        name: a.name,
        club: 'Field Club',
        created_at: nowIso(),
      });
      const position = (['A', 'B', 'C', 'D'] as const)[i]!;
      await db('target_assignments').insert({
        session_id: sessionId,
        entry_id: entryId,
        target_number: t.number,
        position,
      });
      archers.push({ entryId, name: a.name, division: a.division, targetNumber: t.number, position });
    }
    const code = testCode();
    await db('join_codes').insert({
      session_id: sessionId,
      target_number: t.number,
      code,
      created_at: nowIso(),
    });
    targets.set(t.number, { number: t.number, code, archers });
  }

  const archer = (targetNumber: number, position: Position): FieldArcher => {
    const found = targets.get(targetNumber)?.archers.find((a) => a.position === position);
    if (!found) throw new Error(`No archer at ${targetNumber}${position}.`);
    return found;
  };
  return { eventId, sessionId, organizer, judge, targets, archer };
}

/** Recurve on the 70 m round (122 cm face, ends of 6) and compound indoors on the 18 m round (40 cm face, ends of 3). */
export const MIXED_DIVISIONS: FieldDivision[] = [
  { name: 'Recurve Women', bowStyle: 'recurve', roundId: '70m' },
  { name: 'Compound Men', bowStyle: 'compound', roundId: '18m' },
  { name: 'Compound Women', bowStyle: 'compound', roundId: '50m-compound' },
];

/** Target 1: three recurve archers; target 2: two compound archers indoors and one on the six-ring face. */
export async function setUpMixedField(db: Db, options: { closed?: boolean } = {}): Promise<Field> {
  return setUpField(db, {
    divisions: MIXED_DIVISIONS,
    closed: options.closed ?? false,
    targets: [
      {
        number: 1,
        archers: [
          { name: 'Ada Fletcher', division: 'Recurve Women' },
          { name: 'Bea Quill', division: 'Recurve Women' },
          { name: 'Cora Nock', division: 'Recurve Women' },
        ],
      },
      {
        number: 2,
        archers: [
          { name: 'Dan Vane', division: 'Compound Men' },
          { name: 'Eli Shaft', division: 'Compound Men' },
          { name: 'Fay Limb', division: 'Compound Women' },
        ],
      },
    ],
  });
}

/**
 * Agreed ends written straight into the database (both writers, the same values), for tests that
 * need final standings without the field loop: each archer's ends, the first one dropping
 * `drop(archer)` points from a perfect end; `ends(archer)` how many were shot (default all).
 */
export async function writeAgreedEnds(
  db: Db,
  field: Field,
  endsInRound: number,
  drop: (archer: FieldArcher) => number,
  ends: (archer: FieldArcher) => number = () => endsInRound,
): Promise<void> {
  const rows = [];
  for (const t of field.targets.values()) {
    for (const a of t.archers) {
      for (let endIndex = 0; endIndex < ends(a); endIndex += 1) {
        const arrows = endIndex === 0 ? ['10', '10', String(10 - drop(a))] : ['10', '10', '10'];
        for (const slot of [1, 2]) {
          rows.push({
            session_id: field.sessionId,
            entry_id: a.entryId,
            end_index: endIndex,
            slot,
            arrows_json: JSON.stringify(arrows),
            flags_json: '[]',
            revision: 1,
            written_by: field.organizer.id,
            written_at: nowIso(),
            mutation_id: randomUUID(),
          });
        }
      }
    }
  }
  for (let i = 0; i < rows.length; i += 200) await db('end_entries').insert(rows.slice(i, i + 200));
}
