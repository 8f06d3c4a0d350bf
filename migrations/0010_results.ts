import type { Knex } from 'knex';

/**
 * Results: whether an event's results are public, how many archers make a team, each division's
 * cut into the eliminations, archers the organizer took out of the team competition, and the
 * shoot-off arrows judges record (append-only: the latest row for an archer's arrow counts).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('events', (t) => {
    t.boolean('results_published').notNullable().defaultTo(false);
    t.integer('team_size').unsigned().notNullable().defaultTo(3);
  });
  await knex.schema.alterTable('divisions', (t) => {
    // Null: no eliminations, so the medal places are what a shoot-off decides.
    t.integer('cut_size').unsigned().nullable();
  });
  await knex.schema.alterTable('entries', (t) => {
    t.boolean('in_team').notNullable().defaultTo(true);
  });
  await knex.schema.createTable('shootoff_arrows', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('arrow_index').unsigned().notNullable();
    t.string('value', 2).notNullable();
    t.float('distance_mm').nullable();
    t.boolean('closer').notNullable().defaultTo(false);
    t.integer('recorded_by').unsigned().notNullable().references('users.id');
    t.string('recorded_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable().unique();
    t.index(['session_id', 'entry_id']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
