import type { BracketDto, MatchDto } from '../../contract/matches';
import { roundName } from '../../ui/bracketLabels';

/** Matches on one page of the field screen: two lines each, readable from 10 m on a 1080-line screen. */
export const MATCHES_PER_PAGE = 4;

export type FieldBracketPage =
  | { kind: 'matches'; title: string; subtitle: string; format: BracketDto['format']; matches: MatchDto[] }
  | { kind: 'places'; title: string; subtitle: string; places: BracketDto['places'] };

const decided = (m: MatchDto) => m.winner !== null;

/** The places decided so far, a few a page: final once every match is decided. */
function placePages(b: BracketDto, title: string, rowsPerPage: number, final: boolean): FieldBracketPage[] {
  const count = Math.ceil(b.places.length / rowsPerPage);
  const heading = final ? 'Final places' : 'Places decided so far';
  return Array.from({ length: count }, (_, i) => ({
    kind: 'places',
    title,
    subtitle: `${heading}${count > 1 ? ` · page ${i + 1} of ${count}` : ''}`,
    places: b.places.slice(i * rowsPerPage, (i + 1) * rowsPerPage),
  }));
}

/**
 * The field screen's pages of each bracket: the current round (the earliest with a match not yet
 * decided; in the last round the final and the bronze match), a few matches a page, then the
 * places decided so far (from the round each archer lost in, and 1–4 once the medal matches are
 * signed), so the field sees a place as soon as it is known; once every match is decided, only
 * the final places.
 */
export function fieldBracketPages(brackets: BracketDto[], rowsPerPage: number): FieldBracketPage[] {
  return brackets.flatMap((b): FieldBracketPage[] => {
    const title = `${b.divisionName}: eliminations`;
    const open = b.matches.filter((m) => !decided(m));
    if (open.length === 0) return placePages(b, title, rowsPerPage, true);
    const round = Math.min(...open.map((m) => m.round));
    // Byes are decided before anyone shoots: they are not shown as matches.
    const matches = b.matches.filter((m) => m.round === round && m.decidedBy !== 'bye');
    const count = Math.ceil(matches.length / MATCHES_PER_PAGE);
    const format = b.format === 'sets' ? 'set points' : 'totals';
    const matchPages = Array.from({ length: count }, (_, i): FieldBracketPage => ({
      kind: 'matches',
      title,
      subtitle: `${roundName(round, b.rounds)}${round === b.rounds - 1 ? ' and bronze match' : ''} · ${format}${
        count > 1 ? ` · page ${i + 1} of ${count}` : ''
      }`,
      format: b.format,
      matches: matches.slice(i * MATCHES_PER_PAGE, (i + 1) * MATCHES_PER_PAGE),
    }));
    return [...matchPages, ...placePages(b, title, rowsPerPage, false)];
  });
}
