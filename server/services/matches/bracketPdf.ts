import type { Writable } from 'node:stream';
import type { BracketDto, MatchDto } from '../../../src/contract/matches';
import { matchEndsLine, matchLine, matchStatus, roundName } from '../../../src/ui/bracketLabels';
import { PrintDocument } from '../printouts/pdfDocument';

/** A4 landscape. */
const PAGE = { width: 841.89, height: 595.28, margin: 36 };
const INK = '#123047';
const TOP = 104;
const BOTTOM = PAGE.height - PAGE.margin - 28;
/** Two lines for the sides, a third for each end's score. */
const BOX = 42;
/** The tree shows the rounds from the one with at most this many matches; earlier rounds are listed first. */
const TREE_MATCHES = 8;
/** A listed match: its box and a line for where it stands; two columns a page. */
const LIST_ROW = BOX + 9;
const LIST_PER_COLUMN = Math.floor((BOTTOM - TOP) / LIST_ROW);
const LIST_ROWS = LIST_PER_COLUMN * 2;
const PLACES_WIDTH = 170;

type Page =
  | { kind: 'list'; bracket: BracketDto; round: number; matches: MatchDto[] }
  | { kind: 'tree'; bracket: BracketDto; firstRound: number };

function pagesOf(brackets: BracketDto[]): Page[] {
  return brackets.flatMap((bracket) => {
    const inRound = (r: number) => bracket.matches.filter((m) => m.round === r && !m.bronze);
    let firstRound = 0;
    while (inRound(firstRound).length > TREE_MATCHES) firstRound += 1;
    const pages: Page[] = [];
    for (let round = 0; round < firstRound; round += 1) {
      const matches = inRound(round);
      for (let from = 0; from < matches.length; from += LIST_ROWS)
        pages.push({ kind: 'list', bracket, round, matches: matches.slice(from, from + LIST_ROWS) });
    }
    pages.push({ kind: 'tree', bracket, firstRound });
    return pages;
  });
}

/** One match as a box: a line a side (the winner in bold), then the score of each end. */
function matchBox(pdf: PrintDocument, m: MatchDto, x: number, y: number, width: number): void {
  pdf.doc.lineWidth(1).rect(x, y, width, BOX).stroke(INK);
  (['a', 'b'] as const).forEach((side, i) => {
    const ty = y + 4 + i * 16;
    const { seed, name, score, won } = matchLine(m, side);
    // An empty line until the earlier match is decided.
    const text = seed !== null ? `${seed}  ${name}` : name === 'bye' ? name : '';
    pdf.text(text, x + 4, ty, {
      size: 9,
      bold: won,
      width: width - 36,
      minSize: 6,
    });
    pdf.text(score === undefined ? '' : String(score), x + width - 30, ty, {
      size: 9,
      bold: true,
      width: 26,
      align: 'right',
    });
  });
  pdf.text(matchEndsLine(m), x + 4, y + 29, { size: 7, width: width - 8, minSize: 5, color: '#444444' });
}

function header(pdf: PrintDocument, eventName: string, title: string, note: string): void {
  const width = PAGE.width - PAGE.margin * 2;
  pdf.doc.rect(0, 0, PAGE.width, 84).fill(INK);
  pdf.text(eventName, PAGE.margin, 14, { size: 20, bold: true, width, minSize: 11, color: '#ffffff' });
  pdf.text(title, PAGE.margin, 42, { size: 13, bold: true, width, minSize: 8, color: '#ffffff' });
  pdf.text(note, PAGE.margin, 62, { size: 10, width, minSize: 7, color: '#ffffff' });
}

function treePage(pdf: PrintDocument, bracket: BracketDto, firstRound: number): void {
  const rounds = Array.from({ length: bracket.rounds - firstRound }, (_, i) => firstRound + i);
  const column = (PAGE.width - PAGE.margin * 2 - PLACES_WIDTH) / rounds.length;
  const boxWidth = column - 18;
  // The final's column also holds the bronze match: the tree keeps the top three quarters.
  const treeBottom = BOTTOM - BOX - 24;
  const centre = new Map<number, number>();
  rounds.forEach((round, c) => {
    const x = PAGE.margin + c * column;
    const matches = bracket.matches.filter((m) => m.round === round && !m.bronze);
    pdf.text(roundName(round, bracket.rounds), x, TOP - 16, { size: 10, bold: true, width: boxWidth });
    const band = (treeBottom - TOP) / matches.length;
    for (const m of matches) {
      const y = TOP + band * (m.slot + 0.5) - BOX / 2;
      matchBox(pdf, m, x, y, boxWidth);
      centre.set(m.id, y + BOX / 2);
      // A line from each of the two matches that feed this one.
      if (c > 0) {
        const feeders = bracket.matches.filter(
          (f) => f.round === round - 1 && !f.bronze && Math.floor(f.slot / 2) === m.slot,
        );
        for (const f of feeders) {
          const fy = centre.get(f.id)!;
          pdf.doc
            .lineWidth(1)
            .moveTo(x - 18, fy)
            .lineTo(x - 9, fy)
            .lineTo(x - 9, y + BOX / 2)
            .lineTo(x, y + BOX / 2)
            .stroke(INK);
        }
      }
    }
  });
  const bronze = bracket.matches.find((m) => m.bronze);
  if (bronze) {
    const x = PAGE.margin + (rounds.length - 1) * column;
    pdf.text('Bronze match', x, BOTTOM - BOX - 14, { size: 10, bold: true, width: boxWidth });
    matchBox(pdf, bronze, x, BOTTOM - BOX, boxWidth);
  }
  const px = PAGE.width - PAGE.margin - PLACES_WIDTH + 6;
  pdf.text('Final places', px, TOP - 16, { size: 10, bold: true, width: PLACES_WIDTH - 6 });
  if (bracket.places.length === 0)
    pdf.text('None decided yet.', px, TOP + 2, { size: 9, width: PLACES_WIDTH - 6 });
  const step = Math.min(16, (BOTTOM - TOP) / Math.max(1, bracket.places.length));
  bracket.places.forEach((p, i) =>
    pdf.text(`${p.place}.  ${p.name}`, px, TOP + 2 + i * step, {
      size: Math.min(9, step - 3),
      bold: p.place <= 3,
      width: PLACES_WIDTH - 6,
      minSize: 5,
    }),
  );
}

function listPage(pdf: PrintDocument, bracket: BracketDto, round: number, matches: MatchDto[]): void {
  const width = PAGE.width - PAGE.margin * 2;
  const column = (width - 24) / 2;
  pdf.text(roundName(round, bracket.rounds), PAGE.margin, TOP - 16, { size: 10, bold: true, width });
  matches.forEach((m, i) => {
    const x = PAGE.margin + Math.floor(i / LIST_PER_COLUMN) * (column + 24);
    const y = TOP + (i % LIST_PER_COLUMN) * LIST_ROW;
    matchBox(pdf, m, x, y, column);
    pdf.text(matchStatus(m), x + 4, y + BOX + 1, {
      size: 7,
      width: column - 8,
      minSize: 6,
      color: '#444444',
    });
  });
}

/**
 * The eliminations as a printout (A4 landscape): each division's bracket as a tree from the round
 * with at most eight matches (earlier rounds listed on pages before it), the bronze match under
 * the final, and the final places so far beside it. Streamed page by page like the other printouts.
 */
export async function bracketPdf(
  brackets: BracketDto[],
  event: { name: string; published: boolean },
  out: Writable,
): Promise<void> {
  const pages = pagesOf(brackets);
  const title = `Eliminations - ${event.name}${brackets.length === 1 ? ` - ${brackets[0]!.divisionName}` : ''}`;
  const pdf = new PrintDocument(title);
  const at = new Date().toISOString().slice(0, 16).replace('T', ' ');
  let number = 0;
  await pdf.streamPages(out, pages.length > 0 ? pages : [null], (page) => {
    number += 1;
    pdf.addPage('landscape');
    if (!page) {
      header(pdf, event.name, 'Eliminations', `As of ${at} UTC`);
      pdf.text('No brackets yet: they are made after qualification.', PAGE.margin, TOP, { size: 12 });
      return;
    }
    const b = page.bracket;
    const format = b.format === 'sets' ? 'set system: set points' : 'cumulative score: totals';
    header(
      pdf,
      event.name,
      `${b.divisionName}: eliminations`,
      `${b.entrants} archers · ${format} · as of ${at} UTC${event.published ? '' : ' · not published yet'}`,
    );
    if (page.kind === 'tree') treePage(pdf, b, page.firstRound);
    else listPage(pdf, b, page.round, page.matches);
    pdf.text(
      'The winner of each match is in bold; a walkover or bye has no score.',
      PAGE.margin,
      BOTTOM + 14,
      {
        size: 8,
        color: '#444444',
      },
    );
    pdf.text(`Page ${number} of ${Math.max(1, pages.length)}`, PAGE.margin, BOTTOM + 14, {
      size: 8,
      width: PAGE.width - PAGE.margin * 2,
      align: 'right',
      color: '#444444',
    });
  });
}
