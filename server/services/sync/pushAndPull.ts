import { PULL_LIMIT_DEFAULT, type PushResponse, type ReceivedPush } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { pullChanges } from './pullChanges';
import { pushBatch, type PushOptions } from './pushBatch';

/**
 * A phone's push, and when it sent its pull cursor, the pull in the same answer (one round trip
 * per sync). The pull is read after the push is committed, so it holds the push's own effects.
 */
export async function pushAndPull(
  db: Db,
  userId: number,
  request: ReceivedPush,
  options: PushOptions = {},
  pullLimit = PULL_LIMIT_DEFAULT,
): Promise<PushResponse> {
  const response = await pushBatch(db, userId, request, options);
  if (request.cursor === undefined) return response;
  return { ...response, pull: await pullChanges(db, userId, { cursor: request.cursor, limit: pullLimit }) };
}
