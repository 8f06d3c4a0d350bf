import type { Knex } from 'knex';
import * as m0001 from '../migrations/0001_people_and_events';
import * as m0002 from '../migrations/0002_accounts_and_setup';
import * as m0004 from '../migrations/0004_field_loop';
import * as m0005 from '../migrations/0005_judging_and_signatures';
import * as m0006 from '../migrations/0006_mail_limits';
import * as m0007 from '../migrations/0007_late_values';
import * as m0008 from '../migrations/0008_account_recovery';
import * as m0009 from '../migrations/0009_signing_trust';
import * as m0010 from '../migrations/0010_results';
import * as m0011 from '../migrations/0011_entry_classes';
import * as m0013 from '../migrations/0013_matches';
import * as m0014 from '../migrations/0014_practice_sync';
import * as m0015 from '../migrations/0015_match_writers';
import * as m0016 from '../migrations/0016_match_end_signatures';
import * as m0017 from '../migrations/0017_alternate_shooting';
import * as m0018 from '../migrations/0018_practice_tombstones';

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
  ['0006_mail_limits', m0006],
  ['0007_late_values', m0007],
  ['0008_account_recovery', m0008],
  ['0009_signing_trust', m0009],
  ['0010_results', m0010],
  ['0011_entry_classes', m0011],
  ['0013_matches', m0013],
  ['0014_practice_sync', m0014],
  ['0015_match_writers', m0015],
  ['0016_match_end_signatures', m0016],
  ['0017_alternate_shooting', m0017],
  ['0018_practice_tombstones', m0018],
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
