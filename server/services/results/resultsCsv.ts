import Papa from 'papaparse';
import type { EventResults } from '../../../src/contract/results';
import type { DivisionFinalPlaces } from './bracketPlaces';

/**
 * A cell a spreadsheet would read as a formula (=, +, -, @, or a tab or carriage return that
 * some programs strip first) gets a leading apostrophe, so opening the file runs nothing.
 */
export function neutraliseCell(value: string | number): string | number {
  return typeof value === 'string' && /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

const TRUST_WORDS = { provisional: 'provisional', signed: 'signed', final: 'final' } as const;

/** The heading line above the final places, after the standings. */
export const FINAL_PLACES_HEADING = 'Final places after the eliminations';

/**
 * The final places of each division's bracket, under their own heading and column names, after a
 * blank line: a spreadsheet opens both tables on one sheet.
 */
function finalPlacesCsv(finals: DivisionFinalPlaces[]): string {
  if (finals.length === 0) return '';
  const table = Papa.unparse({
    fields: ['Division', 'Final place', 'Archer', 'Club', 'Seed'],
    data: finals.flatMap((d) =>
      d.places.map((p) => [d.divisionName, p.place, p.name, p.club, p.seed].map(neutraliseCell)),
    ),
  });
  return `\r\n\r\n${Papa.unparse([[FINAL_PLACES_HEADING]])}\r\n${table}`;
}

/**
 * The standings as CSV: one row per archer (place in the division), for the whole event or one
 * division of it; then, for each division with a bracket, its final places.
 */
export function resultsCsv(
  results: EventResults,
  divisionId?: number,
  finals: DivisionFinalPlaces[] = [],
): string {
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
  return (
    Papa.unparse({
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
    }) + finalPlacesCsv(finals)
  );
}
