import type { Knex } from 'knex';

/**
 * Values that arrived after their session was closed, held for a judge. The mutation itself stays
 * in the append-only `mutations` log (status `held`); this table is where the desk finds it and
 * what the judge decided. The decision is also a log row (`late.accept` / `late.reject`), so the
 * log alone still rebuilds the field tables.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('late_values', (t) => {
    t.increments('id').primary();
    t.string('mutation_uuid', 36).notNullable().unique();
    t.integer('event_id').unsigned().notNullable().references('events.id');
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('target_number').unsigned().notNullable();
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('end_index').unsigned().notNullable();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    // What it is: a writer's record (its slot) or the caller's settlement (slot 0). A later late
    // value of the same end, kind and slot from the same person replaces a waiting one.
    t.string('kind', 40).notNullable();
    t.integer('slot').unsigned().notNullable();
    t.string('received_at', 30).notNullable();
    t.string('status', 10).notNullable(); // waiting | accepted | rejected | replaced
    t.text('reason').nullable();
    t.integer('decided_by').unsigned().nullable().references('users.id');
    t.string('decided_at', 30).nullable();
    t.index(['session_id', 'status']);
  });
}
