import type { Knex } from 'knex';

/**
 * Alternate shooting in the finals (docs/matches.md): which matches of a bracket alternate, as the
 * organizer sets it (never, the medal matches, from the semi-finals), and, per match, the line
 * chosen to shoot first in the first end, with who recorded it and when.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('brackets', (t) => {
    t.string('alternate', 16).notNullable().defaultTo('never'); // never | medal-matches | semi-finals
  });
  await knex.schema.alterTable('matches', (t) => {
    t.string('first_shooter', 1).nullable(); // a | b
    t.integer('first_shooter_by').unsigned().nullable().references('users.id');
    t.string('first_shooter_at', 30).nullable();
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
