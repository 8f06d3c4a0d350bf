import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { migrate, openDb, type Db } from '../../server/db';
import { startTestServer, TEST_BCRYPT_COST, TEST_LINK_ADDRESS, type TestServer } from './support/testServer';
import { TEST_SECRET, makePerson } from './support/people';
import { setUpMixedField } from './support/fieldSetup';
import { Phone } from './support/phone';
import { loadSigningKeys } from '../../server/services/signing/serverKeys';

/*
 * A server restart (a new app and a new connection on the same database file) keeps every
 * phone's sequence: mutations sent again after the restart are duplicates, never applied twice.
 */

let server: TestServer;
let reopened: Db | undefined;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await reopened?.destroy();
  await server.close();
});

describe('server restart', () => {
  it('keeps last seq; replayed mutations are duplicates and the next one applies', async () => {
    const field = await setUpMixedField(server.db);
    const person = await makePerson(server.db, 'Ros Restart');
    const before = new Phone(server.app, person);
    await before.join(field.targets.get(1)!.code, 'writer1');
    const entryId = field.archer(1, 'C').entryId;
    const batch = [0, 1, 2].map((endIndex) =>
      before.write({
        sessionId: field.sessionId,
        entryId,
        endIndex,
        slot: 1,
        arrows: ['9', '9', '8', '8', '7', '7'],
      }),
    );
    expect((await before.push(batch)).lastSeq).toBe(3);
    const next = before.write({ sessionId: field.sessionId, entryId, endIndex: 3, slot: 1, arrows: ['X'] });

    await server.db.destroy();
    reopened = openDb(server.file);
    await migrate(reopened);
    // The signing key made on the first start is read back from the data folder, not made anew.
    const signingKeys = await loadSigningKeys(server.dir);
    expect(signingKeys.kid).toBe(server.signingKeys.kid);
    const app = createApp({
      db: reopened,
      version: 'test',
      secret: TEST_SECRET,
      mailer: { send: async () => undefined },
      dataDir: server.dir,
      linkAddress: TEST_LINK_ADDRESS,
      signingKeys,
      bcryptCost: TEST_BCRYPT_COST,
    });
    const after = new Phone(app, person, before.clientId);

    const replay = await after.push([...batch, next]);
    expect(replay.results.map((r) => r.status)).toEqual(['duplicate', 'duplicate', 'duplicate', 'applied']);
    expect(replay.lastSeq).toBe(4);
    const revisions = await reopened('end_entries')
      .where({ session_id: field.sessionId, entry_id: entryId })
      .orderBy('end_index')
      .pluck('revision');
    expect(revisions).toEqual([1, 1, 1, 1]);
    expect(
      await reopened('mutations').where({ client_id: before.clientId }).count({ n: '*' }).first(),
    ).toEqual({ n: 4 });
  });
});
