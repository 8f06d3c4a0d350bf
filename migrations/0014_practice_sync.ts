import type { Knex } from 'knex';

/**
 * The practice log synced to the person's account (docs/practice.md): each session's setup and
 * its ends, owned by one account and shown to no one else. Practice changes go into the same
 * `changes` log the phones pull, kept apart from every event by `user_id` (the one person who
 * may pull them) and `practice_id` (so deleting a session removes its earlier changes too).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('practice_sessions', (t) => {
    t.string('id', 36).primary(); // the phone's UUID
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('started_at', 30).notNullable();
    t.text('session_json').notNullable();
    t.string('updated_at', 30).notNullable();
    t.index(['user_id', 'started_at']);
  });
  await knex.schema.createTable('practice_ends', (t) => {
    t.string('session_id', 36).notNullable().references('practice_sessions.id').onDelete('CASCADE');
    t.integer('end_index').unsigned().notNullable();
    t.text('end_json').notNullable();
    t.primary(['session_id', 'end_index']);
  });
  await knex.schema.alterTable('changes', (t) => {
    t.integer('user_id').unsigned().nullable();
    t.string('practice_id', 36).nullable();
    t.index(['user_id', 'version']);
    t.index(['practice_id']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
