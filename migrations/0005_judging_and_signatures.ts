import type { Knex } from 'knex';

/**
 * Judges' rulings and signatures. Every table here is append-only in spirit: a correction is a
 * new ruling, and a signature it replaces is marked superseded, never deleted, so the history
 * of an end stays readable. Each row names the mutation that made it (unique), so the push's
 * "exactly once" holds for these records too.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('photos', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.string('sha256', 64).notNullable();
    t.string('mime_type', 40).notNullable();
    t.integer('size_bytes').unsigned().notNullable();
    // File name inside DATA_DIR/photos, outside the web root; served only through the API.
    t.string('stored_name', 100).notNullable();
    t.integer('uploaded_by').unsigned().notNullable().references('users.id');
    t.string('uploaded_at', 30).notNullable();
    // The same picture uploaded twice to one event is one photo.
    t.unique(['event_id', 'sha256']);
  });

  // Append-only: the current ruling on an end is its latest row.
  await knex.schema.createTable('end_rulings', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('end_index').unsigned().notNullable();
    t.text('arrows_json').notNullable();
    t.string('reason', 500).notNullable();
    t.integer('photo_id').unsigned().nullable().references('photos.id');
    t.integer('judged_by').unsigned().notNullable().references('users.id');
    t.string('judged_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable().unique();
    t.index(['session_id', 'entry_id', 'end_index']);
  });

  // A judge's signature on an end. Only superseded_at / superseded_by_ruling are ever set later.
  await knex.schema.createTable('end_signatures', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.integer('end_index').unsigned().notNullable();
    t.text('arrows_json').notNullable();
    t.string('content_hash', 64).notNullable();
    t.text('jws').notNullable();
    t.integer('signed_by').unsigned().notNullable().references('users.id');
    t.string('signed_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable().unique();
    // Set when a judge's later correction replaces this signature; the row itself stays.
    t.string('superseded_at', 30).nullable();
    t.integer('superseded_by_ruling').unsigned().nullable().references('end_rulings.id');
    t.index(['session_id', 'entry_id', 'end_index']);
  });

  // The archer's and the scorer's signatures on a whole card; both present (not superseded) = final.
  await knex.schema.createTable('card_signatures', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.string('role', 10).notNullable(); // 'archer' | 'scorer'
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('content_hash', 64).notNullable();
    t.text('jws').notNullable();
    t.string('signed_at', 30).notNullable();
    t.string('mutation_id', 36).notNullable().unique();
    t.string('superseded_at', 30).nullable();
    t.integer('superseded_by_ruling').unsigned().nullable().references('end_rulings.id');
    t.index(['session_id', 'entry_id']);
  });

  // Each attempt to mail a final card, so a failure is visible and the card can be sent again.
  await knex.schema.createTable('card_mailings', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id');
    t.integer('entry_id').unsigned().notNullable().references('entries.id');
    t.string('email', 254).notNullable();
    t.string('status', 10).notNullable(); // sent | failed
    t.text('error').nullable();
    t.string('at', 30).notNullable();
    t.index(['session_id', 'entry_id']);
  });

  // The change log's type names grew ("card-signature"); SQLite ignores lengths, PostgreSQL does not.
  // (SQLite rebuilds the table for this; rows keep their versions, and as the log is never
  // trimmed the next version still follows the highest one.)
  await knex.schema.alterTable('changes', (t) => {
    t.string('type', 20).notNullable().alter();
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
