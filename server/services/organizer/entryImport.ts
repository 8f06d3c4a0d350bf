import Papa from 'papaparse';
import { checkImportRows, type ImportContext, type ImportRowsInput } from '../../../src/contract/entryImport';
import {
  ENTRY_CSV_COLUMNS,
  ENTRY_CSV_MAX_ROWS,
  type ImportPreview,
  type ImportResult,
} from '../../../src/contract/events';
import { cleanText } from '../../../src/core';
import type { Db } from '../../db';
import { refuseOverLimit } from './eventLimits';
import { HttpError, badRequest } from '../../http/httpError';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { linkEntryToAccount } from './entries';

type Column = (typeof ENTRY_CSV_COLUMNS)[number];

/** Header spellings people use for each column (compared lower-case, without spaces). */
const HEADER_NAMES: Record<Column, string[]> = {
  name: ['name', 'archer', 'archername', 'fullname'],
  club: ['club'],
  email: ['email', 'e-mail', 'emailaddress', 'e-mailaddress', 'mail'],
  division: ['division', 'category'],
  class: ['class', 'ageclass', 'agegroup'],
};

/** UTF-8 when it is UTF-8; otherwise the Windows encoding spreadsheets often save CSV in. */
function decode(buffer: Buffer): string {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    text = new TextDecoder('windows-1252').decode(buffer);
  }
  return text.replace(/^\uFEFF/, '');
}

type RawRow = { row: number; values: Record<Column, string> };

/** Reads the file into rows keyed by column; a missing required column is refused at once. */
export function readEntryCsv(buffer: Buffer): RawRow[] {
  const parsed = Papa.parse<string[]>(decode(buffer), {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t'],
  });
  const records = parsed.data;
  const headerIndex = records.findIndex((r) => r.some((cell) => cell.trim() !== ''));
  if (headerIndex < 0)
    throw badRequest(
      'The file is empty. Download the template, fill in one archer per row, and upload it again.',
    );
  const header = records[headerIndex]!.map((h) => h.trim().toLowerCase().replace(/\s+/g, ''));
  const columnIndex = {} as Record<Column, number>;
  for (const column of ENTRY_CSV_COLUMNS)
    columnIndex[column] = header.findIndex((h) => HEADER_NAMES[column].includes(h));
  const missing = (['name', 'division'] as const).filter((c) => columnIndex[c] < 0);
  if (missing.length) {
    throw badRequest(
      `The file has no ${missing.map((m) => `"${m}"`).join(' or ')} column. The first row must name the columns: ${ENTRY_CSV_COLUMNS.join(', ')}. Download the template to see how.`,
    );
  }
  const rows: RawRow[] = [];
  records.forEach((record, index) => {
    if (index <= headerIndex || record.every((cell) => cell.trim() === '')) return;
    const cell = (c: Column) => (columnIndex[c] >= 0 ? cleanText(record[columnIndex[c]] ?? '').trim() : '');
    rows.push({
      row: index + 1,
      values: {
        name: cell('name').replace(/\s+/g, ' '),
        club: cell('club'),
        email: cell('email').toLowerCase(),
        division: cell('division'),
        class: cell('class'),
      },
    });
  });
  if (rows.length === 0)
    throw badRequest('The file has column names but no archers. Add one archer per row below them.');
  if (rows.length > ENTRY_CSV_MAX_ROWS)
    throw badRequest(`The file has ${rows.length} archers; upload at most ${ENTRY_CSV_MAX_ROWS} at a time.`);
  return rows;
}

/** What the shared row check needs of the event: its divisions and who is entered already. */
async function importContext(db: Db, eventId: number): Promise<ImportContext> {
  const divisions = (await db('divisions')
    .where({ event_id: eventId })
    .orderBy('id')
    .select('id', 'name')) as {
    id: number;
    name: string;
  }[];
  const entered = (await db('entries')
    .join('divisions', 'divisions.id', 'entries.division_id')
    .where('entries.event_id', eventId)
    .select('entries.name', 'entries.division_id as divisionId', 'divisions.name as divisionName')) as {
    name: string;
    divisionId: number;
    divisionName: string;
  }[];
  return { divisions, entered };
}

/** The file's rows with every problem found in them; nothing is stored. */
export async function previewEntryImport(db: Db, eventId: number, buffer: Buffer): Promise<ImportPreview> {
  const raw = readEntryCsv(buffer).map(({ row, values: { class: className, ...values } }) => ({
    row,
    ...values,
    className,
  }));
  const { rows } = checkImportRows(raw, await importContext(db, eventId));
  const problemCount = rows.filter((r) => r.problems.length > 0).length;
  return { rows, readyCount: rows.length - problemCount, problemCount };
}

/**
 * Imports the rows as corrected in the preview. All or nothing: one transaction, every row
 * checked again by the same rules, and any row with a problem refuses the whole list.
 */
export async function importEntries(
  db: Db,
  userId: number,
  eventId: number,
  input: ImportRowsInput,
): Promise<ImportResult> {
  return db.transaction(async (trx) => {
    const { rows, divisionIds } = checkImportRows(input.rows, await importContext(trx, eventId));
    await refuseOverLimit(trx, eventId, 'entries', rows.length);
    const bad = rows.filter((r) => r.problems.length > 0);
    if (bad.length) {
      throw new HttpError(
        422,
        'import_has_problems',
        `Nothing was imported: ${bad.length} ${bad.length === 1 ? 'row has a problem' : 'rows have problems'}. Correct ${bad.length === 1 ? 'it' : 'them'} in the preview or drop ${bad.length === 1 ? 'it' : 'them'}, then import again.`,
        bad.flatMap((r) => r.problems.map((p) => ({ path: `row ${r.row}`, message: p }))),
      );
    }
    const at = nowIso();
    for (const [i, r] of rows.entries()) {
      const [row] = await trx('entries')
        .insert({
          event_id: eventId,
          division_id: divisionIds[i]!,
          name: r.name,
          club: r.club,
          email: r.email || null,
          class_name: r.className,
          created_at: at,
        })
        .returning('id');
      await linkEntryToAccount(trx, {
        id: (row as { id: number }).id,
        event_id: eventId,
        email: r.email || null,
      });
    }
    await audit(trx, { userId, eventId, action: 'entries.imported', details: { count: rows.length } });
    return { imported: rows.length };
  });
}

/**
 * The template: the column names, then two invented archers showing how a row is filled in, in
 * the event's own divisions when it has some (replace them with the real archers).
 */
export async function entryTemplateCsv(db: Db, eventId: number): Promise<string> {
  const divisions = (await db('divisions')
    .where({ event_id: eventId })
    .orderBy('id')
    .pluck('name')) as string[];
  const [first = 'Recurve Women', second = first] = divisions;
  const quote = (v: string) => (/[",\r\n]/.test(v) ? `"${v.replaceAll('"', '""')}"` : v);
  const rows = [
    [...ENTRY_CSV_COLUMNS],
    ['Example Archer One', 'Example Bowmen', 'archer.one@example.org', first, ''],
    ['Example Archer Two', 'Example Bowmen', '', second, 'Under 18'],
  ];
  return rows.map((r) => r.map(quote).join(',')).join('\r\n') + '\r\n';
}
