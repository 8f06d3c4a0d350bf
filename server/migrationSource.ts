import type { Knex } from 'knex';
import * as m0001 from '../migrations/0001_people_and_events';
import * as m0002 from '../migrations/0002_accounts_and_setup';
import * as m0004 from '../migrations/0004_field_loop';
import * as m0005 from '../migrations/0005_judging_and_signatures';
import * as m0006 from '../migrations/0006_results';

type Migration = { up: (knex: Knex) => Promise<void>; down?: (knex: Knex) => Promise<void> };

/**
 * Migrations are imported explicitly (not loaded from a folder) so they run the same under
 * tsx and Vitest. Append new ones at the end; never edit or reorder a released one.
 */
const migrations: [string, Migration][] = [
  ['0001_people_and_events', m0001],
  ['0002_accounts_and_setup', m0002],
  ['0004_field_loop', m0004],
  ['0005_judging_and_signatures', m0005],
  ['0006_results', m0006],
];

export const migrationSource: Knex.MigrationSource<[string, Migration]> = {
  getMigrations: async () => migrations,
  getMigrationName: ([name]) => name,
  getMigration: async ([, migration]) => ({
    up: migration.up,
    // Forward-only: rolling back is refused rather than silently destroying field data.
    down: async () => {
      throw new Error('Ringcall migrations are forward-only.');
    },
  }),
};
