import type { WaitingChangesFile, WaitingChangesImport } from '../../../src/contract/waitingChanges';
import { isMatchMutation, isPracticeMutation, understood } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { badRequest } from '../../http/httpError';
import { audit } from '../audit';
import { pushBatch, type PushOptions } from './pushBatch';
import { whoseChanges } from './waitingAuthenticity';
import { transcriptionOf } from './transcription';

/**
 * A judge brings a phone's saved changes to the server. A block signed by its phone's registered
 * key (or the judge's own changes) is applied exactly as if the phone had pushed it: as its
 * person, under its client id and numbers, with every rule checked. Any other block is the
 * judge's transcription: applied under its own numbering, labelled with the judge's name, and
 * never carrying a signature or ruling of another person (those are refused with a reason).
 * `raw` is the body as it arrived: the phone signed those bytes, not their parsed form.
 */
export async function importWaitingChanges(
  db: Db,
  eventId: number,
  judgeId: number,
  file: WaitingChangesFile,
  raw: unknown,
  options: PushOptions,
): Promise<WaitingChangesImport> {
  const sessionIds = new Set(
    (await db('event_sessions').where({ event_id: eventId }).select('id')).map((r) => Number(r.id)),
  );
  const foreign = file.clients
    .flatMap((c) => understood(c.mutations))
    // Practice belongs to no event: its person's own signed file may carry it (a transcription refuses it).
    .filter((m) => !isPracticeMutation(m))
    .find((m) => (isMatchMutation(m) ? m.args.eventId !== eventId : !sessionIds.has(m.args.sessionId)));
  if (foreign)
    throw badRequest('This file holds changes of another event. Import it at that event’s judge desk.');

  const clients: WaitingChangesImport['clients'] = [];
  for (const [index, client] of file.clients.entries()) {
    const person = await db('users').where({ id: client.userId }).first('id');
    if (!person) throw badRequest('This file names a person this server does not know.');
    const whose = await whoseChanges(db, judgeId, client, raw, index);
    let results;
    if (whose.transcribedBy === undefined) {
      const request = { clientId: client.clientId, mutations: client.mutations };
      results = (await pushBatch(db, client.userId, request, options)).results;
    } else {
      const transcription = await transcriptionOf(db, judgeId, client);
      const response = await pushBatch(db, client.userId, transcription.request, {
        ...options,
        transcribedBy: { userId: judgeId, name: whose.transcribedBy },
      });
      results = transcription.answer(response.results);
    }
    clients.push({
      clientId: client.clientId,
      userId: client.userId,
      fromThePhone: whose.fromThePhone,
      ...(whose.transcribedBy ? { transcribedBy: whose.transcribedBy } : {}),
      applied: results.filter((r) => r.status === 'applied').length,
      duplicates: results.filter((r) => r.status === 'duplicate').length,
      results,
    });
    await audit(db, {
      userId: judgeId,
      eventId,
      action: whose.fromThePhone ? 'sync.import' : 'sync.transcribe',
      details: { clientId: client.clientId, for: client.userId, changes: client.mutations.length },
    });
  }
  return { clients };
}
