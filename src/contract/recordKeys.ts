import type { WriterSlot } from './fieldTerms';

/*
 * The keys of field records, the same on the phone (Dexie primary keys and indexes) and on the
 * server (its in-memory maps): one end of one archer, one writer's record of it, one card.
 */

export const endKeyOf = (sessionId: number, entryId: number, endIndex: number): string =>
  `${sessionId}:${entryId}:${endIndex}`;

export const recordKeyOf = (sessionId: number, entryId: number, endIndex: number, slot: WriterSlot): string =>
  `${endKeyOf(sessionId, entryId, endIndex)}:${slot}`;

export const cardKeyOf = (sessionId: number, entryId: number): string => `${sessionId}:${entryId}`;
