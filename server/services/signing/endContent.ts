import { sortEnd, type ArrowValue } from '../../../src/core';
import { contentHash } from './contentHash';

/** Where an end lives: what a signature's `ref` names, so a verifier can find it again. */
export type EndRef = { eventId: number; sessionId: number; entryId: number; endIndex: number };

/**
 * What a judge's signature on an end covers: the end's place and its values, highest first.
 * Signing and verifying both build it here, so the two can never hash different things.
 */
export function endContent(ref: EndRef, arrows: readonly ArrowValue[]) {
  return {
    typ: 'ringcall-end',
    event: ref.eventId,
    session: ref.sessionId,
    entry: ref.entryId,
    endIndex: ref.endIndex,
    arrows: sortEnd(arrows),
  };
}

export const endContentHash = (ref: EndRef, arrows: readonly ArrowValue[]): string =>
  contentHash(endContent(ref, arrows));
