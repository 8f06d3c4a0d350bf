import type { Knex } from 'knex';

/**
 * Sign-in sessions, invitations, caught mail, the audit log, and the event setup:
 * sessions of shooting, which round each division shoots in a session, target assignments
 * and join codes.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.string('email_verified_at', 30).nullable();
  });

  await knex.schema.createTable('refresh_tokens', (t) => {
    t.increments('id').primary();
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    // Only a SHA-256 of the token is stored; the token itself lives in the phone's cookie.
    t.string('token_hash', 64).notNullable().unique();
    // All tokens rotated from one sign-in share a family; reuse of a rotated token revokes the family.
    t.string('family_id', 36).notNullable();
    t.string('expires_at', 30).notNullable();
    t.string('rotated_at', 30).nullable();
    t.string('revoked_at', 30).nullable();
    t.string('created_at', 30).notNullable();
    t.string('user_agent', 200).notNullable().defaultTo('');
    t.index(['family_id']);
    t.index(['user_id']);
  });

  await knex.schema.createTable('email_tokens', (t) => {
    t.increments('id').primary();
    t.string('token_hash', 64).notNullable().unique();
    t.string('purpose', 20).notNullable(); // 'verify' | 'invite'
    t.string('email', 254).notNullable();
    t.integer('event_id').unsigned().nullable().references('events.id').onDelete('CASCADE');
    t.string('role', 16).nullable();
    t.integer('created_by').unsigned().nullable().references('users.id');
    t.string('expires_at', 30).notNullable();
    t.string('used_at', 30).nullable();
    t.string('created_at', 30).notNullable();
    t.index(['email']);
  });

  await knex.schema.createTable('caught_mail', (t) => {
    t.increments('id').primary();
    t.string('mail_from', 254).notNullable();
    t.text('mail_to').notNullable();
    t.string('subject', 300).notNullable();
    t.text('text_body').notNullable();
    t.text('raw').notNullable();
    t.string('received_at', 30).notNullable();
  });

  await knex.schema.createTable('audit_log', (t) => {
    t.increments('id').primary();
    t.string('at', 30).notNullable();
    t.integer('user_id').unsigned().nullable().references('users.id');
    t.integer('event_id').unsigned().nullable().references('events.id').onDelete('CASCADE');
    t.string('action', 60).notNullable();
    t.text('details').notNullable().defaultTo('{}');
    t.index(['event_id', 'at']);
  });

  await knex.schema.createTable('event_sessions', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('starts_at', 30).notNullable(); // local date-time in the event's time zone
    t.string('closed_at', 30).nullable();
    t.unique(['event_id', 'name']);
  });

  await knex.schema.createTable('session_divisions', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id').onDelete('CASCADE');
    t.integer('division_id').unsigned().notNullable().references('divisions.id').onDelete('CASCADE');
    // Catalog id, or 'custom'; round_json keeps the full definition used, so later catalog changes never alter a card.
    t.string('round_id', 60).notNullable();
    t.text('round_json').notNullable();
    t.unique(['session_id', 'division_id']);
  });

  await knex.schema.createTable('target_assignments', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id').onDelete('CASCADE');
    t.integer('entry_id').unsigned().notNullable().references('entries.id').onDelete('CASCADE');
    t.integer('target_number').unsigned().notNullable();
    t.string('position', 1).notNullable(); // A-D
    t.unique(['session_id', 'entry_id']);
    t.unique(['session_id', 'target_number', 'position']);
  });

  await knex.schema.createTable('join_codes', (t) => {
    t.increments('id').primary();
    t.integer('session_id').unsigned().notNullable().references('event_sessions.id').onDelete('CASCADE');
    t.integer('target_number').unsigned().notNullable();
    t.string('code', 16).notNullable().unique();
    t.string('created_at', 30).notNullable();
    t.string('revoked_at', 30).nullable();
    t.index(['session_id', 'target_number']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
