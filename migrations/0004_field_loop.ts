import type { Knex } from 'knex';

/**
 * The field loop: who keeps which task on a target, the two writers' separate records of each
 * end, the caller's settlements, each phone's sequence, the append-only log of every change a
 * phone sent (with its outcome), and the change log phones pull from.
 *
 * Field data refers to sessions and entries without ON DELETE CASCADE: removing a session or an
 * entry that has scores is refused by the database rather than silently taking the scores along.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('target_members', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id').onDelete('CASCADE');
    t.integer('target_number').unsigned().notNullable();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('task', 10).notNullable(); // writer1 | writer2 | caller | follower
    t.string('joined_at', 30).notNullable();
    t.unique(['session_id', 'target_number', 'user_id']);
    // One writer 1, one writer 2 and one caller per target; any number of followers. A partial
    // index (SQLite and PostgreSQL both have them); its condition must be a literal, not a
    // parameter, hence the one plain-SQL fragment, written in standard SQL.
    t.unique(['session_id', 'target_number', 'task'], {
      indexName: 'target_members_one_per_task',
      predicate: knex.whereRaw("task <> 'follower'"),
    });
    t.index(['user_id']);
  });

  await knex.schema.createTable('sync_clients', (t) => {
    t.string('client_id', 100).primary();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.integer('last_seq').unsigned().notNullable().defaultTo(0);
    t.string('updated_at', 30).notNullable();
  });

  // Append-only: every mutation a phone sent and what became of it. Never updated or deleted.
  await knex.schema.createTable('mutations', (t) => {
    t.increments('id').primary();
    t.string('mutation_uuid', 36).notNullable().unique();
    t.string('client_id', 100).notNullable();
    t.integer('seq').unsigned().notNullable();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('kind', 40).notNullable();
    t.text('args_json').notNullable();
    t.string('at', 30).notNullable(); // the phone's clock when the person made the change
    t.string('received_at', 30).notNullable();
    t.string('status', 10).notNullable(); // applied | rejected
    t.text('reason').nullable();
    t.unique(['client_id', 'seq']);
  });

  // Current record of each writer for each end: two rows per end, neither overwrites the other.
  await knex.schema.createTable('end_entries', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('end_index').unsigned().notNullable();
    t.integer('slot').unsigned().notNullable(); // 1 | 2
    t.text('arrows_json').notNullable();
    t.text('flags_json').notNullable();
    t.integer('revision').unsigned().notNullable();
    t.integer('written_by').unsigned().notNullable().references('users.id');
    t.string('written_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable(); // mutations.mutation_uuid of the write that made this revision
    t.unique(['session_id', 'entry_id', 'end_index', 'slot']);
  });

  await knex.schema.createTable('end_settlements', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('end_index').unsigned().notNullable();
    t.text('arrows_json').notNullable();
    t.text('disputed_json').notNullable();
    t.text('basis_json').notNullable();
    t.integer('settled_by').unsigned().notNullable().references('users.id');
    t.string('settled_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable();
    t.unique(['session_id', 'entry_id', 'end_index']);
  });

  // What phones pull: one row per applied effect, in the order it happened.
  await knex.schema.createTable('changes', (t) => {
    t.increments('version').primary();
    t.integer('event_id').unsigned().notNullable();
    t.integer('session_id').unsigned().notNullable();
    t.integer('target_number').unsigned().notNullable();
    t.string('type', 12).notNullable(); // end | settlement
    t.text('record_json').notNullable();
    t.index(['event_id', 'version']);
    t.index(['session_id', 'target_number', 'version']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
