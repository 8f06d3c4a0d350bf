import { checkImportRows, type ImportContext, type ImportRowValues } from '../../../contract/entryImport';
import type { ImportRow } from '../../../contract/events';

/** A row of the preview as the organizer has it now: corrected in place, or dropped. */
export type ImportDraft = { row: number; dropped: boolean; editing: boolean } & ImportRowValues;

/** The preview's rows as drafts: a row with a problem opens for correcting at once. */
export const draftsOf = (rows: ImportRow[]): ImportDraft[] =>
  rows.map(({ problems, ...values }) => ({ ...values, dropped: false, editing: problems.length > 0 }));

/** What is checked and sent of a draft: its row number and values, not its screen state. */
export const sentValues = ({ row, name, club, email, division, className }: ImportDraft) => ({
  row,
  name,
  club,
  email,
  division,
  className,
});

export type CheckedDrafts = {
  /** Each draft with the problems the shared check finds in it now (none for a dropped row). */
  rows: (ImportDraft & { problems: string[] })[];
  ready: number;
  toFix: number;
  dropped: number;
};

/** Checks the kept rows together (duplicates are found across them) by the server's own rules. */
export function checkDrafts(drafts: ImportDraft[], context: ImportContext): CheckedDrafts {
  const kept = drafts.filter((d) => !d.dropped);
  const checked = checkImportRows(kept.map(sentValues), context).rows;
  const problems = new Map(checked.map((r) => [r.row, r.problems]));
  const toFix = checked.filter((r) => r.problems.length > 0).length;
  return {
    rows: drafts.map((d) => ({ ...d, problems: problems.get(d.row) ?? [] })),
    ready: kept.length - toFix,
    toFix,
    dropped: drafts.length - kept.length,
  };
}
