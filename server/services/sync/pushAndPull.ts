import { PULL_LIMIT_DEFAULT, type PushResponse, type ReceivedPush } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { pushBatch, type PushOptions } from './pushBatch';

/**
 * A phone's push, and when it sent its pull cursor, the pull in the same answer (one round trip
 * per sync). The pull is read in the push's commit after all its writes, and answered only once
 * that commit is done, so it holds the push's own effects; the pulls of a commit's pushes are
 * read together (pullMany).
 */
export async function pushAndPull(
  db: Db,
  userId: number,
  request: ReceivedPush,
  options: PushOptions = {},
  pullLimit = PULL_LIMIT_DEFAULT,
): Promise<PushResponse> {
  if (request.cursor === undefined) return pushBatch(db, userId, request, options);
  return pushBatch(db, userId, request, { ...options, pull: { cursor: request.cursor, limit: pullLimit } });
}
