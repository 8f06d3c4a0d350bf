import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDb, type Db } from '../../server/db';
import { GroupCommit, type ApplyGroup } from '../../server/groupCommit';

/*
 * Group commit: units that arrive together share one transaction and one disk flush; each is
 * answered only once its effects are committed, and one unit's failure never costs another.
 */

let dir: string;
let file: string;
let db: Db;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'ringcall-group-'));
  file = join(dir, 'group.sqlite');
  db = openDb(file);
  await db.schema.createTable('notes', (t) => {
    t.increments('id').primary();
    t.string('text').notNullable().unique();
  });
});
afterAll(async () => {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
});

type Unit = { text: string; refuse?: boolean; crash?: boolean };

/** Writes each unit's note; `refuse` is a unit's own refusal, `crash` an unexpected failure after writing. */
function recorder() {
  const calls: string[][] = [];
  const apply: ApplyGroup<Unit, number> = async (trx, units) => {
    calls.push(units.map((u) => u.text));
    const outcomes = [];
    for (const unit of units) {
      if (unit.refuse) {
        outcomes.push({ error: new Error(`refused ${unit.text}`) });
        continue;
      }
      const [row] = (await trx('notes').insert({ text: unit.text }).returning('id')) as { id: number }[];
      if (unit.crash) throw new Error(`crashed ${unit.text}`);
      outcomes.push({ value: row!.id });
    }
    return outcomes;
  };
  return { calls, apply };
}

/** What another connection sees: only what is committed. */
function committedNotes(): string[] {
  const other = new Database(file, { readonly: true });
  try {
    return (other.prepare('select text from notes order by id').all() as { text: string }[]).map(
      (r) => r.text,
    );
  } finally {
    other.close();
  }
}

const settle = <T>(p: Promise<T>) =>
  p.then(
    (value) => ({ value }),
    (error: Error) => ({ error: error.message }),
  );

describe('group commit', () => {
  it('applies units that arrive together as one group and answers each only after the commit', async () => {
    const { calls, apply } = recorder();
    const group = new GroupCommit(db, apply, { weight: () => 1, maxWeight: 100 });
    const seenAtAnswer: string[][] = [];
    const answers = await Promise.all(
      ['a1', 'a2', 'a3'].map((text) =>
        group.run({ text }).then((id) => {
          seenAtAnswer.push(committedNotes());
          return id;
        }),
      ),
    );
    expect(calls).toEqual([['a1', 'a2', 'a3']]);
    expect(answers).toHaveLength(3);
    for (const seen of seenAtAnswer) expect(seen).toEqual(expect.arrayContaining(['a1', 'a2', 'a3']));
  });

  it('applies a unit that arrives alone by itself', async () => {
    const { calls, apply } = recorder();
    const group = new GroupCommit(db, apply, { weight: () => 1, maxWeight: 100 });
    await group.run({ text: 'b1' });
    await group.run({ text: 'b2' });
    expect(calls).toEqual([['b1'], ['b2']]);
  });

  it('keeps a group within its weight', async () => {
    const { calls, apply } = recorder();
    const group = new GroupCommit(db, apply, { weight: () => 1, maxWeight: 2 });
    await Promise.all(['c1', 'c2', 'c3'].map((text) => group.run({ text })));
    expect(calls).toEqual([['c1', 'c2'], ['c3']]);
  });

  it('answers a unit refused on its own with its error and commits the others', async () => {
    const { apply } = recorder();
    const group = new GroupCommit(db, apply, { weight: () => 1, maxWeight: 100 });
    const answers = await Promise.all(
      [{ text: 'd1' }, { text: 'd2', refuse: true }, { text: 'd3' }].map((u) => settle(group.run(u))),
    );
    expect(answers[1]).toEqual({ error: 'refused d2' });
    expect(answers[0]).toHaveProperty('value');
    expect(answers[2]).toHaveProperty('value');
    expect(committedNotes()).toEqual(expect.arrayContaining(['d1', 'd3']));
    expect(committedNotes()).not.toContain('d2');
  });

  it('undoes a group whose joint attempt fails and tries each unit alone: only the failing one is lost', async () => {
    const { calls, apply } = recorder();
    const group = new GroupCommit(db, apply, { weight: () => 1, maxWeight: 100 });
    const answers = await Promise.all(
      [{ text: 'e1' }, { text: 'e2', crash: true }, { text: 'e3' }].map((u) => settle(group.run(u))),
    );
    expect(calls).toEqual([['e1', 'e2', 'e3'], ['e1'], ['e2'], ['e3']]);
    expect(answers[1]).toEqual({ error: 'crashed e2' });
    expect(answers[0]).toHaveProperty('value');
    expect(answers[2]).toHaveProperty('value');
    const notes = committedNotes();
    expect(notes.filter((n) => n.startsWith('e'))).toEqual(['e1', 'e3']);
  });

  it('answers every waiting unit with the error when no transaction can begin', async () => {
    const closed = openDb(join(dir, 'closed.sqlite'));
    await closed.destroy();
    const { apply } = recorder();
    const group = new GroupCommit(closed, apply, { weight: () => 1, maxWeight: 100 });
    const answers = await Promise.all(['f1', 'f2'].map((text) => settle(group.run({ text }))));
    for (const answer of answers) expect(answer).toHaveProperty('error');
  });
});
