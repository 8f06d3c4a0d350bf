import type { Knex } from 'knex';

/**
 * One row per mail a person caused (invitation, confirmation, a card sent again), written before
 * it is sent: the limits per person, per event and per address count these rows.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sent_mail', (t) => {
    t.increments('id').primary();
    t.string('kind', 20).notNullable(); // 'invite' | 'verify' | 'card'
    t.integer('sent_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.integer('event_id').unsigned().nullable().references('events.id').onDelete('CASCADE');
    t.string('recipient', 254).notNullable();
    t.string('at', 30).notNullable();
    t.index(['sent_by', 'at']);
    t.index(['event_id', 'at']);
    t.index(['recipient', 'at']);
  });
  // Photo limits count a person's uploads across events.
  await knex.schema.alterTable('photos', (t) => {
    t.index(['uploaded_by', 'uploaded_at']);
  });
}
