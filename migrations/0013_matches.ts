import type { Knex } from 'knex';

/**
 * Eliminations: one bracket per division, seeded from a qualification session's standings; its
 * matches round by round (and the bronze match); each match's two sides, a side holding one
 * archer now and several when team matches come; the values of each end and the shoot-off arrows.
 * A match's winner is stored only once a judge signs it (or the organizer records a withdrawal,
 * a no-show, or the bracket gives a bye); until then the core reads it from the ends.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('brackets', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.integer('division_id').unsigned().notNullable().references('divisions.id');
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.string('format', 16).notNullable(); // sets | cumulative
    t.integer('entrants').unsigned().notNullable();
    t.integer('size').unsigned().notNullable();
    t.integer('created_by').unsigned().notNullable().references('users.id');
    t.string('created_at', 30).notNullable();
    t.unique(['event_id', 'division_id']);
  });
  await knex.schema.createTable('matches', (t) => {
    t.increments('id').primary();
    t.integer('bracket_id').unsigned().notNullable().references('brackets.id').onDelete('CASCADE');
    t.integer('round').unsigned().notNullable(); // 0 = first round; the last is the final
    t.integer('slot').unsigned().notNullable(); // position in its round, top of the bracket first
    t.boolean('bronze').notNullable().defaultTo(false);
    t.integer('target_number').unsigned().nullable();
    t.string('winner_side', 1).nullable(); // a | b
    t.string('decided_by', 16).nullable(); // score | shoot-off | bye | withdrawal | no-show
    t.integer('signed_by').unsigned().nullable().references('users.id');
    t.string('signed_at', 30).nullable();
    t.unique(['bracket_id', 'round', 'slot', 'bronze']);
  });
  await knex.schema.createTable('match_sides', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.string('side', 1).notNullable(); // a = upper line, b = lower line
    t.integer('seed').unsigned().notNullable();
    t.unique(['match_id', 'side']);
  });
  await knex.schema.createTable('match_side_archers', (t) => {
    t.increments('id').primary();
    t.integer('match_side_id').unsigned().notNullable().references('match_sides.id').onDelete('CASCADE');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.unique(['match_side_id', 'entry_id']);
  });
  await knex.schema.createTable('match_ends', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.integer('end_index').unsigned().notNullable();
    t.text('a_json').notNullable();
    t.text('b_json').notNullable();
    t.integer('recorded_by').unsigned().notNullable().references('users.id');
    t.string('recorded_at', 30).notNullable();
    t.unique(['match_id', 'end_index']);
  });
  await knex.schema.createTable('match_shootoff_arrows', (t) => {
    t.increments('id').primary();
    t.integer('match_id').unsigned().notNullable().references('matches.id').onDelete('CASCADE');
    t.string('side', 1).notNullable();
    t.string('value', 2).notNullable();
    t.float('distance_mm').nullable();
    t.boolean('closer').notNullable().defaultTo(false);
    t.integer('recorded_by').unsigned().notNullable().references('users.id');
    t.string('recorded_at', 30).notNullable();
    t.unique(['match_id', 'side']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
