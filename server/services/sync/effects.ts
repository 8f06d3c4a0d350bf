import { sortEnd, sortEndWithMarks } from '../../../src/core';
import type { EndSettleArgs, EndWriteArgs } from '../../../src/contract/sync';
import type { EndRuleArgs } from '../../../src/contract/judging';
import type { EndEntryRow, RulingRow, SettlementRow } from './fieldRows';

/**
 * Who made a change and when: the person, the phone's clock, the mutation's uuid; and the judge
 * who transcribed it from a file no phone signed, when one did.
 */
export type Author = {
  userId: number;
  at: string;
  mutationId: string;
  transcribedBy?: { userId: number; name: string };
};

/*
 * What an applied mutation does to the current tables, as pure functions. The live push and the
 * replay of the log (rebuildFromLog) both use them, so the two can never tell different stories.
 */

/** A writer's new record of an end: the arrows as tapped (flags point into them), one revision on. */
export function nextEndEntry(
  previous: Pick<EndEntryRow, 'revision'> | undefined,
  args: EndWriteArgs,
  by: Author,
): EndEntryRow {
  // Stored highest to lowest whatever order a phone sent, each flag kept on its arrow.
  const sorted = sortEndWithMarks(args.arrows, args.flags);
  return {
    session_id: args.sessionId,
    entry_id: args.entryId,
    end_index: args.endIndex,
    slot: args.slot,
    arrows_json: JSON.stringify(sorted.values),
    flags_json: JSON.stringify(sorted.marks),
    revision: (previous?.revision ?? 0) + 1,
    written_by: by.userId,
    written_at: by.at,
    mutation_id: by.mutationId,
  };
}

/** The caller's settlement: arrows highest first (disputed positions refer to that order), positions once each. */
export function settlementRow(args: EndSettleArgs, by: Author): SettlementRow {
  return {
    session_id: args.sessionId,
    entry_id: args.entryId,
    end_index: args.endIndex,
    arrows_json: JSON.stringify(sortEnd(args.arrows)),
    disputed_json: JSON.stringify([...new Set(args.disputed)].sort((a, b) => a - b)),
    basis_json: JSON.stringify({ first: args.basis.first, second: args.basis.second }),
    settled_by: by.userId,
    settled_at: by.at,
    mutation_id: by.mutationId,
  };
}

/** A judge's ruling: the end's values highest first, the reason as given (trimmed by the schema). */
export function rulingRow(args: EndRuleArgs, by: Author): RulingRow {
  return {
    session_id: args.sessionId,
    entry_id: args.entryId,
    end_index: args.endIndex,
    arrows_json: JSON.stringify(sortEnd(args.arrows)),
    reason: args.reason,
    photo_id: args.photoId ?? null,
    judged_by: by.userId,
    judged_at: by.at,
    mutation_id: by.mutationId,
  };
}

/** What a record shows of a transcription: the judge who brought it in from a file. */
export const transcriptionLabel = (by: Author): { transcribedBy?: string } =>
  by.transcribedBy ? { transcribedBy: by.transcribedBy.name } : {};
