import Papa from 'papaparse';
import type { EventResults } from '../../../src/contract/results';

/**
 * A cell a spreadsheet would read as a formula (=, +, -, @, or a tab or carriage return that
 * some programs strip first) gets a leading apostrophe, so opening the file runs nothing.
 */
export function neutraliseCell(value: string | number): string | number {
  return typeof value === 'string' && /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

const TRUST_WORDS = { provisional: 'provisional', signed: 'signed', final: 'final' } as const;

/** The standings as CSV: one row per archer (place in the division), for the whole event or one division of it. */
export function resultsCsv(results: EventResults, divisionId?: number): string {
  const rows: (string | number)[][] = [];
  for (const session of results.sessions) {
    for (const division of session.divisions) {
      if (divisionId !== undefined && division.divisionId !== divisionId) continue;
      for (const r of division.rows) {
        rows.push([
          session.name,
          division.name,
          r.className,
          r.place,
          r.tied ? 'tied' : '',
          r.name,
          r.club,
          r.total,
          r.tens,
          `${r.second} ${division.secondCount}`,
          r.hits,
          `${r.endsShot}/${r.totalEnds}`,
          TRUST_WORDS[r.trust],
          r.shootOff ? 'shoot-off needed' : r.decidedByShootOff ? 'decided by shoot-off' : '',
        ]);
      }
    }
  }
  return Papa.unparse({
    fields: [
      'Session',
      'Division',
      'Class',
      'Place',
      'Tie',
      'Archer',
      'Club',
      'Total',
      '10s',
      'Xs or 9s',
      'Hits',
      'Ends',
      'Status',
      'Shoot-off',
    ],
    data: rows.map((row) => row.map(neutraliseCell)),
  });
}
