import type { Knex } from 'knex';

/**
 * An entry's class inside its division (an age class such as "Under 18" or "50+" inside a bow
 * division): the standings rank each class on its own as well. Empty: no class.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('entries', (t) => {
    t.string('class_name', 60).notNullable().defaultTo('');
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
