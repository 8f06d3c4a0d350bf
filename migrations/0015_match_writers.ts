import type { Knex } from 'knex';

/**
 * Two writers at a match's target (docs/matches.md): a join code per match; the organizer's named
 * scorers (in place of an archer as a match's writer); who joined a match as writer 1 or 2; each
 * writer's own record of each end, kept apart and compared by the core's cross-check; and each
 * archer's countersignature after the judge's. `match_ends.source` tells an end the two writers
 * agreed on from one the judge entered or settled (which the writers can no longer change).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('match_join_codes', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.string('code', 12).notNullable().unique();
    t.string('created_at', 30).notNullable();
    t.unique(['match_id']);
  });
  await knex.schema.createTable('match_scorers', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.integer('slot').unsigned().notNullable(); // 1 writes for the upper line's archer, 2 the lower's
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.unique(['match_id', 'slot']);
  });
  await knex.schema.createTable('match_writers', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.integer('slot').unsigned().notNullable();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('joined_at', 30).notNullable();
    t.unique(['match_id', 'slot']);
    t.unique(['match_id', 'user_id']);
    t.index(['user_id']);
  });
  await knex.schema.createTable('match_end_writes', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.integer('end_index').unsigned().notNullable();
    t.integer('slot').unsigned().notNullable();
    t.text('a_json').notNullable();
    t.text('b_json').notNullable();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.integer('revision').unsigned().notNullable();
    t.string('written_at', 30).notNullable();
    t.unique(['match_id', 'end_index', 'slot']);
  });
  await knex.schema.alterTable('match_ends', (t) => {
    t.string('source', 8).notNullable().defaultTo('judge'); // judge | writers
  });
  await knex.schema.createTable('match_countersignatures', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('signed_at', 30).notNullable();
    t.unique(['match_id', 'entry_id']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
