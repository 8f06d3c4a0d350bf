import type { PullQuery, PushResponse, ReceivedPush } from '../../../src/contract/sync';
import type { Db } from '../../db';
import { GroupCommit } from '../../groupCommit';
import type { SigningKeys } from '../signing/serverKeys';
import { applyPushes, type CardRef, type Push, type PushDone } from './applyPushes';

export type PushOptions = {
  /** The server's key: judges' and archers' signatures are made with it. */
  signingKeys?: SigningKeys;
  /**
   * Called once the push is committed with the cards it made final (both signatures), so the
   * final card can be mailed outside the transaction: a mail failure never loses a signature.
   */
  onFinalCards?: (cards: CardRef[]) => void;
  /**
   * A judge who brings these changes in from a file no phone signed: they are that judge's
   * transcription (labelled so), and may not carry anyone's signature or ruling.
   */
  transcribedBy?: { userId: number; name: string };
  /** Answer the push with this pull too (pushAndPull.ts). */
  pull?: PullQuery;
};

/** Keeps one commit to a few thousand mutations, so a pull never waits long behind it. */
const MAX_MUTATIONS_PER_COMMIT = 2000;

const commits = new WeakMap<Db, GroupCommit<Push, PushDone>>();

function commitsOf(db: Db): GroupCommit<Push, PushDone> {
  let group = commits.get(db);
  if (!group) {
    group = new GroupCommit(db, applyPushes, {
      weight: (push) => push.request.mutations.length,
      maxWeight: MAX_MUTATIONS_PER_COMMIT,
    });
    commits.set(db, group);
  }
  return group;
}

/**
 * Applies a phone's batch of mutations exactly once each, in seq order, in one transaction with
 * the append-only log row of each mutation and the phone's last seq, so effect, log and sequence
 * can never diverge (a failure rolls the whole batch back and the phone sends it again).
 *
 * - seq at or below the phone's last seq: a duplicate, answered from the stored outcome.
 * - seq beyond last seq + 1: a gap; the batch stops and the answer names the seq expected.
 * - a mutation that breaks a rule is logged as rejected with its reason and the batch goes on.
 *
 * The batch is sorted by seq first: the phone's order is its seq order, so a batch that arrived
 * reordered applies exactly as the ordered one would. Pushes that arrive while another commit
 * is under way share the next one (GroupCommit, applyPushes); each is answered only once its
 * effects are committed.
 */
export async function pushBatch(
  db: Db,
  userId: number,
  request: ReceivedPush,
  options: PushOptions = {},
): Promise<PushResponse> {
  const done = await commitsOf(db).run({
    userId,
    request,
    signingKeys: options.signingKeys,
    ...(options.transcribedBy !== undefined ? { transcribedBy: options.transcribedBy } : {}),
    ...(options.pull !== undefined ? { pull: options.pull } : {}),
  });
  if (done.finalCards.length > 0) options.onFinalCards?.(done.finalCards);
  return done.response;
}
