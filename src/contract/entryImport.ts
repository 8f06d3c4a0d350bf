import { z } from 'zod';
import { emailSchema } from './auth';
import { ENTRY_CSV_MAX_ROWS, type ImportRow } from './events';
import { nameText, optionalNameText } from './names';

/*
 * The rows of an entry-list import, checked by the same rules on the organizer's phone (after each
 * correction in the preview) and on the server (which checks again everything it receives).
 */

/** One archer of the list, as read from the file or corrected in the preview. */
export type ImportRowValues = {
  name: string;
  club: string;
  email: string;
  division: string;
  /** The class inside the division; empty when the event does not use classes. */
  className: string;
};

/**
 * Two entries are the same archer when they have the same name in the same division (case and
 * spacing ignored). The same person in two divisions (two bow styles) is allowed, and so are two
 * archers sharing one e-mail address (juniors entered with a parent's address).
 */
export const archerKey = (name: string, divisionId: number): string =>
  `${divisionId}:${name.trim().replace(/\s+/g, ' ').toLowerCase()}`;

const collapseSpaces = (s: string) => s.replace(/\s+/g, ' ');

/** The fields of one row; each problem is a sentence the preview shows beside the row. */
const rowFieldsSchema = z.object({
  name: nameText("the archer's name", 120, 'The name is missing.').transform(collapseSpaces),
  club: optionalNameText('the club', 120),
  email: z.string().transform((value, ctx) => {
    if (value.trim() === '') return '';
    const parsed = emailSchema.safeParse(value);
    if (parsed.success) return parsed.data;
    ctx.addIssue({ code: 'custom', message: `"${value.trim()}" is not an e-mail address.` });
    return z.NEVER;
  }),
  division: z.string().trim(),
  className: optionalNameText('the class', 60),
});

/** `POST /api/events/:eventId/entries/import`: the rows as corrected in the preview (dropped ones left out). */
export const importRowsSchema = z.object({
  rows: z
    .array(
      z.object({
        /** The row number in the file, so problems still name the row the organizer sees. */
        row: z.number().int().min(2).max(1_000_000),
        name: z.string().max(1000),
        club: z.string().max(1000),
        email: z.string().max(1000),
        division: z.string().max(1000),
        className: z.string().max(1000).default(''),
      }),
      { error: 'Send the rows to import as a list.' },
    )
    .min(1, 'There is no row to import: keep at least one.')
    .max(ENTRY_CSV_MAX_ROWS, `Import at most ${ENTRY_CSV_MAX_ROWS} archers at a time.`),
});
export type ImportRowsInput = z.infer<typeof importRowsSchema>;

/** What the check needs to know of the event: its divisions and who is entered already. */
export type ImportContext = {
  divisions: { id: number; name: string }[];
  entered: { name: string; divisionId: number; divisionName: string }[];
};

const sameText = (s: string) => s.trim().replace(/\s+/g, ' ').toLowerCase();

/**
 * Every row with every problem found in it (field rules, an unknown division, the same archer
 * twice in the list or already entered), and the division each ready row goes into.
 */
export function checkImportRows(
  rows: ({ row: number } & ImportRowValues)[],
  { divisions, entered }: ImportContext,
): { rows: ImportRow[]; divisionIds: (number | undefined)[] } {
  const enteredIn = new Map(entered.map((e) => [archerKey(e.name, e.divisionId), e.divisionName]));
  const seen = new Map<string, number>();
  const divisionNames = divisions.map((d) => d.name).join(', ') || 'none yet — add divisions first';
  const divisionIds: (number | undefined)[] = [];
  const checked = rows.map(({ row, ...raw }): ImportRow => {
    const parsed = rowFieldsSchema.safeParse(raw);
    const problems = parsed.success ? [] : [...new Set(parsed.error.issues.map((i) => i.message))];
    const values = parsed.success ? parsed.data : raw;
    const division = divisions.find((d) => sameText(d.name) === sameText(values.division));
    if (!values.division.trim()) problems.push(`The division is missing. Use one of: ${divisionNames}.`);
    else if (!division)
      problems.push(`There is no division "${values.division}" in this event. Use one of: ${divisionNames}.`);
    if (division && parsed.success) {
      const key = archerKey(values.name, division.id);
      const earlier = seen.get(key);
      if (earlier !== undefined) problems.push(`The same archer is on row ${earlier} already.`);
      else seen.set(key, row);
      const already = enteredIn.get(key);
      if (already !== undefined) problems.push(`${values.name} is already entered in ${already}.`);
    }
    divisionIds.push(division?.id);
    return { row, ...values, problems };
  });
  return { rows: checked, divisionIds };
}
