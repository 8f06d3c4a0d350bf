import type { Knex } from 'knex';

/**
 * Who may speak for whom, and what a card signature covers:
 * - `device_keys`: each phone's public key (ECDSA P-256, JWK) for one client id, registered by
 *   that client's own person. A file of waiting changes signed by it counts as that person's.
 * - `mutations.transcribed_by`: a judge who brought in changes from a file no phone signed; they
 *   are that judge's transcription and are labelled so wherever shown.
 * - `card_signatures`: the content each signature covers (as signed), the phone's clock beside
 *   the server's, and countersignatures made on paper and recorded by a judge (with the photo).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('device_keys', (t) => {
    t.string('client_id', 100).primary();
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.text('public_jwk').notNullable();
    t.string('created_at', 30).notNullable();
  });
  await knex.schema.alterTable('mutations', (t) => {
    t.integer('transcribed_by').unsigned().nullable().references('users.id');
  });
  await knex.schema.alterTable('card_signatures', (t) => {
    t.text('content_json').nullable();
    t.string('phone_at', 30).nullable();
    t.boolean('on_paper').notNullable().defaultTo(false);
    t.integer('photo_id').unsigned().nullable().references('photos.id');
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
