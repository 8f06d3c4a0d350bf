import type { Knex } from 'knex';

/** People, events, who holds which role in an event, divisions and the entry list. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable().unique();
    t.string('display_name', 120).notNullable();
    // Null until the person sets a password (an invited judge, an archer on an entry list).
    t.string('password_hash', 100).nullable();
    t.string('created_at', 30).notNullable();
  });

  await knex.schema.createTable('events', (t) => {
    t.increments('id').primary();
    t.string('name', 160).notNullable();
    t.string('venue', 160).notNullable().defaultTo('');
    t.string('starts_on', 10).notNullable();
    t.string('ends_on', 10).notNullable();
    t.string('time_zone', 64).notNullable().defaultTo('UTC');
    t.integer('created_by').unsigned().notNullable().references('users.id');
    t.string('created_at', 30).notNullable();
    t.string('updated_at', 30).notNullable();
  });

  await knex.schema.createTable('event_roles', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id');
    t.string('role', 16).notNullable();
    t.string('created_at', 30).notNullable();
    t.unique(['event_id', 'user_id', 'role']);
    t.index(['user_id']);
  });

  await knex.schema.createTable('divisions', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.string('bow_style', 16).notNullable();
    t.string('class_name', 60).notNullable();
    t.string('name', 120).notNullable();
    t.unique(['event_id', 'name']);
  });

  await knex.schema.createTable('entries', (t) => {
    t.increments('id').primary();
    t.integer('event_id').unsigned().notNullable().references('events.id').onDelete('CASCADE');
    t.integer('division_id').unsigned().notNullable().references('divisions.id');
    t.integer('user_id').unsigned().nullable().references('users.id');
    t.string('name', 120).notNullable();
    t.string('club', 120).notNullable().defaultTo('');
    t.string('email', 254).nullable();
    t.string('created_at', 30).notNullable();
    t.index(['event_id', 'division_id']);
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
