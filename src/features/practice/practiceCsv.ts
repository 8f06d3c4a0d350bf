import { arrowPoints, getFace } from '../../core';
import { countedValues } from '../../core/practice';
import type { PracticeEndRow, PracticeSessionRow } from '../../local/db';
import { sessionTitle } from './plan';

export const PRACTICE_CSV_HEADER = [
  'session',
  'started',
  'round',
  'bow style',
  'note',
  'end',
  'arrow',
  'distance m',
  'face',
  'value',
  'points',
  'x mm',
  'y mm',
] as const;

/** As in the results CSV (server/services/results/resultsCsv.ts): a cell a spreadsheet would run as a formula gets an apostrophe. */
const safe = (cell: string) => (/^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell);

/** One CSV field: quoted when it holds a comma, a quote or a line break (RFC 4180). */
const field = (cell: string | number) => {
  const text = typeof cell === 'number' ? String(cell) : safe(cell);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
};

/**
 * The practice log as CSV, one row an arrow, sessions oldest first and arrows in the order shot.
 * The value is the one that counts (on the triple face a second arrow in a spot is M); plotted
 * arrows carry their point in mm from the centre of the sheet, y downwards.
 */
export function practiceCsv(
  sessions: readonly PracticeSessionRow[],
  ends: readonly PracticeEndRow[],
): string {
  const lines = [PRACTICE_CSV_HEADER.map(field).join(',')];
  const inOrder = [...sessions].sort((a, b) => a.startedAt.localeCompare(b.startedAt));
  for (const session of inOrder) {
    const own = ends.filter((e) => e.sessionId === session.id).sort((a, b) => a.index - b.index);
    for (const end of own) {
      const values = countedValues(end.arrows);
      end.arrows.forEach((arrow, i) => {
        const value = values[i] ?? arrow.value;
        lines.push(
          [
            session.id,
            session.startedAt,
            sessionTitle(session),
            session.bowStyle,
            session.note ?? '',
            end.index + 1,
            i + 1,
            end.distanceM,
            getFace(end.faceId).label,
            value,
            arrowPoints(value),
            arrow.xMm === undefined ? '' : Math.round(arrow.xMm * 10) / 10,
            arrow.yMm === undefined ? '' : Math.round(arrow.yMm * 10) / 10,
          ]
            .map(field)
            .join(','),
        );
      });
    }
  }
  return `${lines.join('\r\n')}\r\n`;
}
