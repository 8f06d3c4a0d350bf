import type { Writable } from 'node:stream';
import type { DivisionStandings, EventResults, StandingRow, TeamRow } from '../../../src/contract/results';
import { PrintDocument } from '../printouts/pdfDocument';
import type { DivisionFinalPlaces } from './bracketPlaces';

const PAGE = { width: 595.28, height: 841.89, margin: 36 };
const INK = '#123047';
const ROW = 19;
const TABLE_TOP = 128;
/** Rows that fit between the table's head and the page's foot. */
const ROWS_PER_PAGE = Math.floor((PAGE.height - PAGE.margin - 30 - TABLE_TOP - ROW) / ROW);

type Column<T> = { label: string; width: number; right?: boolean; bold?: boolean; cell: (row: T) => string };

const TRUST_WORDS = { provisional: 'provisional', signed: 'signed', final: 'final' } as const;
const place = (r: { place: number; tied: boolean }) => `${r.tied ? '=' : ''}${r.place}`;

function archerColumns(division: DivisionStandings): Column<StandingRow>[] {
  return [
    { label: 'Place', width: 40, bold: true, cell: place },
    { label: 'Archer', width: 150, bold: true, cell: (r) => r.name },
    { label: 'Club', width: 100, cell: (r) => r.club },
    { label: 'Total', width: 45, right: true, bold: true, cell: (r) => String(r.total) },
    { label: '10s', width: 35, right: true, cell: (r) => String(r.tens) },
    { label: division.secondCount, width: 35, right: true, cell: (r) => String(r.second) },
    { label: 'Ends', width: 40, right: true, cell: (r) => `${r.endsShot}/${r.totalEnds}` },
    {
      label: 'Status',
      width: 78,
      cell: (r) =>
        r.shootOff ? 'shoot-off needed' : r.decidedByShootOff ? 'after shoot-off' : TRUST_WORDS[r.trust],
    },
  ];
}

function teamColumns(division: DivisionStandings): Column<TeamRow>[] {
  return [
    { label: 'Place', width: 40, bold: true, cell: place },
    { label: 'Club', width: 120, bold: true, cell: (t) => t.club },
    { label: 'Members', width: 238, cell: (t) => t.members.map((m) => m.name).join(', ') },
    { label: 'Total', width: 45, right: true, bold: true, cell: (t) => String(t.total) },
    { label: '10s', width: 40, right: true, cell: (t) => String(t.tens) },
    { label: division.secondCount, width: 40, right: true, cell: (t) => String(t.second) },
  ];
}

type PlaceRow = DivisionFinalPlaces['places'][number];

const placeColumns: Column<PlaceRow>[] = [
  { label: 'Final place', width: 70, bold: true, cell: (p) => String(p.place) },
  { label: 'Archer', width: 220, bold: true, cell: (p) => p.name },
  { label: 'Club', width: 170, cell: (p) => p.club },
  { label: 'Seed', width: 63, right: true, cell: (p) => String(p.seed) },
];

/** One page of the printout: a slice of a division's archers or of its teams. */
type Page = {
  session: string;
  division: DivisionStandings;
  /** The class these rows rank, when the page is one class of the division. */
  className?: string;
  part:
    | { kind: 'archers'; rows: StandingRow[]; from: number }
    | { kind: 'teams'; rows: TeamRow[]; from: number }
    | { kind: 'places'; rows: PlaceRow[]; from: number };
};

function pagesOf(
  results: EventResults,
  divisionId: number | undefined,
  finals: DivisionFinalPlaces[],
): Page[] {
  const pages: Page[] = [];
  for (const session of results.sessions)
    for (const division of session.divisions) {
      if (divisionId !== undefined && division.divisionId !== divisionId) continue;
      // A division nobody shoots in still gets its page, saying so.
      for (let from = 0; from < Math.max(division.rows.length, 1); from += ROWS_PER_PAGE)
        pages.push({
          session: session.name,
          division,
          part: { kind: 'archers', rows: division.rows.slice(from, from + ROWS_PER_PAGE), from },
        });
      for (const c of division.classes)
        for (let from = 0; from < c.rows.length; from += ROWS_PER_PAGE)
          pages.push({
            session: session.name,
            division,
            className: c.name,
            part: { kind: 'archers', rows: c.rows.slice(from, from + ROWS_PER_PAGE), from },
          });
      for (let from = 0; from < division.teams.length; from += ROWS_PER_PAGE)
        pages.push({
          session: session.name,
          division,
          part: { kind: 'teams', rows: division.teams.slice(from, from + ROWS_PER_PAGE), from },
        });
      // After the qualification: the final places of the bracket seeded from this session.
      const final = finals.find(
        (f) => f.divisionId === division.divisionId && f.sessionId === session.sessionId,
      );
      for (let from = 0; final && from < final.places.length; from += ROWS_PER_PAGE)
        pages.push({
          session: session.name,
          division,
          part: { kind: 'places', rows: final.places.slice(from, from + ROWS_PER_PAGE), from },
        });
    }
  return pages;
}

function table<T>(
  pdf: PrintDocument,
  columns: Column<T>[],
  rows: T[],
  ruleAfter?: (i: number) => boolean,
): void {
  const { doc } = pdf;
  const left = PAGE.margin;
  const width = PAGE.width - PAGE.margin * 2;
  let x = left;
  for (const c of columns) {
    pdf.text(c.label, x + 3, TABLE_TOP + 4, {
      size: 9,
      bold: true,
      width: c.width - 6,
      align: c.right ? 'right' : 'left',
      minSize: 7,
    });
    x += c.width;
  }
  doc
    .lineWidth(1.5)
    .moveTo(left, TABLE_TOP + ROW)
    .lineTo(left + width, TABLE_TOP + ROW)
    .stroke(INK);
  rows.forEach((row, i) => {
    const y = TABLE_TOP + ROW * (i + 1);
    if (i % 2 === 1) doc.rect(left, y, width, ROW).fill('#eef2f5');
    let cx = left;
    for (const c of columns) {
      pdf.text(c.cell(row), cx + 3, y + 5, {
        size: 10,
        bold: c.bold ?? false,
        width: c.width - 6,
        align: c.right ? 'right' : 'left',
        minSize: 7,
      });
      cx += c.width;
    }
    if (ruleAfter?.(i))
      doc
        .lineWidth(2.5)
        .moveTo(left, y + ROW)
        .lineTo(left + width, y + ROW)
        .stroke('#000000');
  });
}

function resultsPage(
  pdf: PrintDocument,
  results: EventResults,
  page: Page,
  number: number,
  of: number,
): void {
  const { doc } = pdf;
  const left = PAGE.margin;
  const width = PAGE.width - PAGE.margin * 2;
  const { division, part } = page;
  pdf.addPage();
  doc.rect(0, 0, PAGE.width, 100).fill(INK);
  pdf.text(results.event.name, left, 16, { size: 22, bold: true, width, minSize: 12, color: '#ffffff' });
  const what =
    part.kind === 'places'
      ? `${division.name}: final places after the eliminations`
      : part.kind === 'teams'
        ? `${division.name} teams`
        : page.className !== undefined
          ? `${division.name}, ${page.className}`
          : division.name;
  pdf.text(`${what} · ${page.session} · ${division.roundName}`, left, 46, {
    size: 13,
    bold: true,
    width,
    minSize: 8,
    color: '#ffffff',
  });
  const at = results.computedAt.slice(0, 16).replace('T', ' ');
  pdf.text(
    `Standings as of ${at} UTC · ${results.finalCards} of ${results.totalCards} cards final`,
    left,
    70,
    {
      size: 10,
      width,
      minSize: 7,
      color: '#ffffff',
    },
  );
  if (!results.event.published)
    pdf.text('Not published yet: for the organizers only.', left, 106, {
      size: 10,
      bold: true,
      color: '#8a1c1c',
    });

  if (part.kind === 'archers') {
    if (part.rows.length === 0)
      pdf.text('Nobody shoots in this division.', left, TABLE_TOP + 4, { size: 12 });
    else
      table(pdf, archerColumns(division), part.rows, (i) =>
        division.cut !== null && page.className === undefined ? part.from + i + 1 === division.cut : false,
      );
  } else if (part.kind === 'teams') table(pdf, teamColumns(division), part.rows);
  else table(pdf, placeColumns, part.rows);

  const foot = PAGE.height - PAGE.margin - 12;
  const key =
    part.kind === 'places'
      ? 'Places 1–2 from the final, 3–4 from the bronze match, then by the round lost (later first), within a round by seed.'
      : part.kind === 'archers'
        ? `10s count X. provisional: some end not signed yet; signed: every end signed by a judge; final: card signed by archer and scorer.${division.cut !== null ? ` The line marks the cut (${division.cut}).` : ''}`
        : `A team is the best ${results.event.teamSize} archers of a club in the division.`;
  pdf.text(key, left, foot - 14, { size: 7, width, minSize: 5, color: '#444444' });
  pdf.text(`Page ${number} of ${of}`, left, foot, { size: 8, width, align: 'right', color: '#444444' });
}

/**
 * The standings as a printout: each division's archers, then each of its classes on its own,
 * then its teams, then the final places of its bracket, about 33 rows a page, for
 * the whole event or one division. Streamed page by page like the other printouts.
 */
export async function resultsPdf(
  results: EventResults,
  out: Writable,
  divisionId?: number,
  finals: DivisionFinalPlaces[] = [],
): Promise<void> {
  const pages = pagesOf(results, divisionId, finals);
  const title = `Results - ${results.event.name}${
    divisionId === undefined ? '' : ` - ${pages[0]?.division.name ?? ''}`
  }`;
  const pdf = new PrintDocument(title);
  let number = 0;
  await pdf.streamPages(out, pages, (page) => {
    number += 1;
    resultsPage(pdf, results, page, number, pages.length);
  });
}
