import type { Knex } from 'knex';

/**
 * The judge signs each set or end of a match (docs/matches.md): who signed a counted end and when.
 * A signed end is closed to the writers; a judge's correction of it drops the signature.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('match_ends', (t) => {
    t.integer('signed_by').unsigned().nullable().references('users.id');
    t.string('signed_at', 30).nullable();
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
