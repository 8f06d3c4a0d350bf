import type { WaitingChangesFile, WaitingChangesImport } from '../../../src/contract/waitingChanges';
import { understood } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { badRequest } from '../../http/httpError';
import { audit } from '../audit';
import { pushBatch, type PushOptions } from './pushBatch';

/**
 * A judge brings a phone's saved changes to the server. They are applied exactly as if the phone
 * had pushed them: as its person, under its client id and numbers, with every rule checked.
 */
export async function importWaitingChanges(
  db: Db,
  eventId: number,
  judgeId: number,
  file: WaitingChangesFile,
  options: PushOptions,
): Promise<WaitingChangesImport> {
  const sessionIds = new Set(
    (await db('event_sessions').where({ event_id: eventId }).select('id')).map((r) => Number(r.id)),
  );
  const foreign = file.clients
    .flatMap((c) => understood(c.mutations))
    .find((m) => !sessionIds.has(m.args.sessionId));
  if (foreign)
    throw badRequest('This file holds changes of another event. Import it at that event’s judge desk.');

  const clients: WaitingChangesImport['clients'] = [];
  for (const client of file.clients) {
    const person = await db('users').where({ id: client.userId }).first('id');
    if (!person) throw badRequest('This file names a person this server does not know.');
    const response = await pushBatch(
      db,
      client.userId,
      { clientId: client.clientId, mutations: client.mutations },
      options,
    );
    clients.push({
      clientId: client.clientId,
      userId: client.userId,
      applied: response.results.filter((r) => r.status === 'applied').length,
      duplicates: response.results.filter((r) => r.status === 'duplicate').length,
      results: response.results,
    });
    await audit(db, {
      userId: judgeId,
      eventId,
      action: 'sync.import',
      details: { clientId: client.clientId, for: client.userId, changes: client.mutations.length },
    });
  }
  return { clients };
}
