import type { Knex } from 'knex';

/**
 * A deleted practice session is kept as a tombstone (docs/practice.md, "A change racing a
 * deletion"): its setup and ends stay, marked deleted, so a change another of the person's phones
 * made before it heard of the deletion brings the whole session back rather than being refused.
 * `deleted_by_client` tells the deleting phone's own Undo (no notice) from another phone's change;
 * `revived_at` is when another phone's change brought it back, which every phone's log shows.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('practice_sessions', (t) => {
    t.string('deleted_at', 30).nullable();
    t.string('deleted_by_client', 100).nullable();
    t.string('revived_at', 30).nullable();
  });
}

export async function down(): Promise<void> {
  throw new Error('Ringcall migrations are forward-only.');
}
