import type { Writable } from 'node:stream';
import { endsOfRound, getFace, type RoundDefinition } from '../../../src/core';
import { PrintDocument } from './pdfDocument';
import type { PrintSession } from './printSession';

const PAGE = { width: 595.28, height: 841.89, margin: 36 };
const INK = '#123047';
const LINE = '#555555';

type Column = { label: string; width: number };

type Counts = { total: number; tens: number; xs: number };

/** What a final (signed) card prints in the boxes a blank scorecard leaves empty. */
export type FilledCard = {
  /** By end index: the counting arrows highest first, the end's counts and the running total. */
  ends: Map<number, Counts & { arrows: string[]; runningTotal: number; signedBy: string | null }>;
  distances: Counts[];
  totals: Counts & { hits: number };
  /** Archer's and scorer's signatures as printed: who and when. */
  signatures: { label: string; name: string; at: string }[];
  /** A line about the judges' signatures on the ends, e.g. "All 12 ends signed by a judge (Tobias Wren)." */
  judgesLine: string;
  verify: { url: string };
  /** The card's sheet title in the heading band. */
  title: string;
};

function cell(pdf: PrintDocument, x: number, y: number, w: number, h: number, fill?: string) {
  const { doc } = pdf;
  if (fill) doc.rect(x, y, w, h).fillAndStroke(fill, LINE);
  else doc.rect(x, y, w, h).stroke(LINE);
}

/** One distance's end table: end number, one box per arrow, end total, running total, 10s and Xs. */
function distanceTable(
  pdf: PrintDocument,
  round: RoundDefinition,
  distanceIndex: number,
  x: number,
  y: number,
  width: number,
  rowHeight: number,
  filled?: FilledCard,
): void {
  const { doc } = pdf;
  const distance = round.distances[distanceIndex]!;
  const ends = endsOfRound(round).filter((e) => e.distanceIndex === distanceIndex);
  const arrowsPerEnd = distance.arrowsPerEnd;
  const fixed: Column[] = [
    { label: 'End', width: 24 },
    { label: 'End total', width: 34 },
    { label: 'Running total', width: 38 },
    { label: '10s', width: 24 },
    { label: 'Xs', width: 24 },
  ];
  const arrowWidth = (width - fixed.reduce((s, c) => s + c.width, 0)) / arrowsPerEnd;
  const columns: Column[] = [
    fixed[0]!,
    ...Array.from({ length: arrowsPerEnd }, (_, i) => ({ label: String(i + 1), width: arrowWidth })),
    ...fixed.slice(1),
  ];
  const size = Math.max(6, Math.min(10, rowHeight * 0.5));
  doc.lineWidth(0.75);

  // Title: the distance and its face.
  pdf.text(
    `${distance.label} · ${getFace(distance.faceId).label} · ${distance.arrows} arrows, ends of ${arrowsPerEnd}`,
    x,
    y + rowHeight * 0.2,
    {
      size: size + 1,
      bold: true,
      width,
      minSize: 6,
      color: INK,
    },
  );
  y += rowHeight;

  let cx = x;
  for (const column of columns) {
    cell(pdf, cx, y, column.width, rowHeight, '#e8e6df');
    const words = column.label.split(' ');
    if (words.length === 2) {
      // Two-word headings ("End total") go on two lines so the arrow boxes keep their width.
      const small = Math.min(size, rowHeight * 0.4);
      words.forEach((word, line) =>
        pdf.text(word, cx + 1, y + rowHeight / 2 - small + line * small, {
          size: small,
          bold: true,
          width: column.width - 2,
          align: 'center',
          minSize: 5,
        }),
      );
    } else {
      pdf.text(column.label, cx + 1, y + (rowHeight - size) / 2, {
        size,
        bold: true,
        width: column.width - 2,
        align: 'center',
        minSize: 5,
      });
    }
    cx += column.width;
  }
  y += rowHeight;

  for (const end of ends) {
    cx = x;
    columns.forEach((column, i) => {
      const unused = i >= 1 && i <= arrowsPerEnd && i > end.arrows;
      cell(pdf, cx, y, column.width, rowHeight, unused ? '#bdbdbd' : undefined);
      const value =
        i === 0 ? String(end.indexInDistance + 1) : filledValue(filled, end.index, i, arrowsPerEnd);
      if (value)
        pdf.text(value, cx + 1, y + (rowHeight - size) / 2, {
          size,
          bold: i > arrowsPerEnd && i <= arrowsPerEnd + 2,
          width: column.width - 2,
          align: 'center',
          minSize: 5,
        });
      cx += column.width;
    });
    y += rowHeight;
  }

  // The distance subtotal under the end totals and counts.
  const labelWidth = columns.slice(0, arrowsPerEnd + 1).reduce((s, c) => s + c.width, 0);
  pdf.text(`${distance.label} total`, x, y + (rowHeight - size) / 2, {
    size,
    bold: true,
    width: labelWidth - 4,
    align: 'right',
    minSize: 5,
  });
  cx = x + labelWidth;
  const subtotal = filled?.distances[distanceIndex];
  const subtotalValues = subtotal
    ? [String(subtotal.total), '', String(subtotal.tens), String(subtotal.xs)]
    : [];
  columns.slice(arrowsPerEnd + 1).forEach((column, i) => {
    cell(pdf, cx, y, column.width, rowHeight);
    if (subtotalValues[i])
      pdf.text(subtotalValues[i]!, cx + 1, y + (rowHeight - size) / 2, {
        size,
        bold: true,
        width: column.width - 2,
        align: 'center',
        minSize: 5,
      });
    cx += column.width;
  });
}

/** The text of column `i` of an end's row on a filled card: arrows, end total, running total, 10s, Xs. */
function filledValue(
  filled: FilledCard | undefined,
  endIndex: number,
  i: number,
  arrowsPerEnd: number,
): string | undefined {
  const end = filled?.ends.get(endIndex);
  if (!end) return undefined;
  if (i <= arrowsPerEnd) return end.arrows[i - 1];
  return [end.total, end.runningTotal, end.tens, end.xs].map(String)[i - arrowsPerEnd - 1];
}

/** Rows a distance table needs: title, header, one per end, subtotal. */
const rowsFor = (round: RoundDefinition, distanceIndex: number) =>
  endsOfRound(round).filter((e) => e.distanceIndex === distanceIndex).length + 3;

export function scorecardPage(
  pdf: PrintDocument,
  print: Pick<PrintSession, 'event' | 'session'>,
  archer: PrintSession['targets'][number]['archers'][number],
  filled?: FilledCard,
): void {
  const { doc } = pdf;
  const left = PAGE.margin;
  const width = PAGE.width - PAGE.margin * 2;
  const round = archer.round;
  pdf.addPage();

  // Heading: event and session, then the archer and where they shoot.
  doc.rect(0, 0, PAGE.width, 64).fill(INK);
  pdf.text(print.event.name, left, 14, {
    size: 16,
    bold: true,
    width: width - 120,
    minSize: 10,
    color: '#ffffff',
  });
  pdf.text(
    `${print.session.name} · ${print.session.startsAt.replace('T', ' ')}${print.event.venue ? ` · ${print.event.venue}` : ''}`,
    left,
    38,
    {
      size: 10,
      width: width - 120,
      minSize: 7,
      color: '#ffffff',
    },
  );
  pdf.text(filled?.title ?? 'Scorecard', left + width - 110, 14, {
    size: 16,
    bold: true,
    width: 110,
    align: 'right',
    color: '#ffffff',
  });
  pdf.text('Ringcall', left + width - 110, 38, { size: 10, width: 110, align: 'right', color: '#ffffff' });

  let y = 78;
  pdf.text(archer.name, left, y, { size: 22, bold: true, width: width - 130, minSize: 12 });
  pdf.text(archer.club || ' ', left, y + 28, { size: 11, width: width - 130, minSize: 8 });
  // Target and position, large, so the card finds its boss.
  doc
    .lineWidth(1.5)
    .rect(left + width - 120, y - 4, 120, 50)
    .stroke(INK);
  pdf.text('Target', left + width - 116, y, { size: 9, width: 112, align: 'center' });
  pdf.text(`${archer.targetNumber}${archer.position}`, left + width - 116, y + 12, {
    size: 26,
    bold: true,
    width: 112,
    align: 'center',
  });

  y += 56;
  const facts = [
    ['Division', archer.divisionName],
    ['Round', round ? round.name : 'No round in this session'],
    ['Detail', archer.position === 'A' || archer.position === 'B' ? 'AB' : 'CD'],
  ] as const;
  const factWidths = [width * 0.38, width * 0.46, width * 0.16];
  let fx = left;
  facts.forEach(([label, value], i) => {
    doc.lineWidth(0.75).rect(fx, y, factWidths[i]!, 34).stroke(LINE);
    pdf.text(label, fx + 5, y + 3, { size: 8 });
    pdf.text(value, fx + 5, y + 14, { size: 12, bold: true, width: factWidths[i]! - 10, minSize: 7 });
    fx += factWidths[i]!;
  });
  y += 42;
  pdf.text(
    filled
      ? 'Every end signed by a judge and the card countersigned. Check this card with the QR code below.'
      : 'Write each end highest value first. X is the inner 10, M is a miss. Only a judge may change a value once written.',
    left,
    y,
    {
      size: 9,
      width,
      minSize: 7,
    },
  );
  y += 16;

  const footerHeight = filled ? 220 : 150;
  const bottom = PAGE.height - PAGE.margin - footerHeight;
  if (round) {
    // Distances side by side in pairs (the two halves of a 70 m round sit next to each other).
    const perRow = round.distances.length >= 2 ? 2 : 1;
    const gap = 14;
    const blockWidth = (width - gap * (perRow - 1)) / perRow;
    const gridRows: number[][] = [];
    round.distances.forEach((_, i) => {
      if (i % perRow === 0) gridRows.push([]);
      gridRows[gridRows.length - 1]!.push(i);
    });
    const rowsNeeded =
      gridRows.reduce((sum, row) => sum + Math.max(...row.map((i) => rowsFor(round, i))), 0) +
      (gridRows.length - 1) * 0.6;
    const rowHeight = Math.min(24, (bottom - y) / rowsNeeded);
    for (const row of gridRows) {
      row.forEach((distanceIndex, column) =>
        distanceTable(
          pdf,
          round,
          distanceIndex,
          left + column * (blockWidth + gap),
          y,
          blockWidth,
          rowHeight,
          filled,
        ),
      );
      y += Math.max(...row.map((i) => rowsFor(round, i))) * rowHeight + rowHeight * 0.6;
    }
  }

  // Totals, then the two signatures.
  y = bottom + 10;
  const totals = ['Total', '10s', 'Xs', 'Hits'];
  const totalValues = filled
    ? [filled.totals.total, filled.totals.tens, filled.totals.xs, filled.totals.hits].map(String)
    : [];
  const boxWidth = width / totals.length;
  totals.forEach((label, i) => {
    doc
      .lineWidth(1.25)
      .rect(left + i * boxWidth, y, boxWidth - 6, 42)
      .stroke(INK);
    pdf.text(label, left + i * boxWidth + 6, y + 4, { size: 10, bold: true });
    if (totalValues[i])
      pdf.text(totalValues[i]!, left + i * boxWidth + 6, y + 14, {
        size: 22,
        bold: true,
        width: boxWidth - 18,
        align: 'right',
      });
  });
  if (round)
    pdf.text(`of ${round.distances.reduce((s, d) => s + d.arrows, 0) * 10}`, left + 6, y + 28, {
      size: 8,
      color: '#444444',
    });
  y += 62;
  if (filled) signedFooter(pdf, filled, left, y, width);
  else {
    const half = (width - 24) / 2;
    for (const [i, label] of ['Archer’s signature', 'Scorer’s signature'].entries()) {
      const sx = left + i * (half + 24);
      doc
        .lineWidth(0.75)
        .moveTo(sx, y + 34)
        .lineTo(sx + half, y + 34)
        .stroke('#000000');
      pdf.text(label, sx, y + 38, { size: 9 });
    }
  }
  pdf.text(
    `Ringcall · ${print.session.name} · Target ${archer.targetNumber}${archer.position}`,
    left,
    PAGE.height - PAGE.margin - 4,
    { size: 7, width, color: '#555555' },
  );
}

/** A final card's signatures (who and when, as the server signed them), the judges' line and the verification QR code. */
function signedFooter(pdf: PrintDocument, filled: FilledCard, left: number, y: number, width: number): void {
  const { doc } = pdf;
  const qrSize = 140;
  const textWidth = width - qrSize - 16;
  const half = (textWidth - 16) / 2;
  filled.signatures.forEach((signature, i) => {
    const sx = left + i * (half + 16);
    doc.lineWidth(0.75).rect(sx, y, half, 46).stroke(LINE);
    pdf.text(signature.label, sx + 6, y + 4, { size: 8 });
    pdf.text(signature.name, sx + 6, y + 15, { size: 12, bold: true, width: half - 12, minSize: 7 });
    pdf.text(signature.at, sx + 6, y + 32, { size: 8, width: half - 12, minSize: 6, color: '#333333' });
  });
  pdf.text(filled.judgesLine, left, y + 54, { size: 9, width: textWidth, minSize: 6 });
  pdf.text('Signed by the Ringcall server. Scan the code to check this card is unchanged:', left, y + 70, {
    size: 8,
    width: textWidth,
    minSize: 6,
    color: '#333333',
  });
  pdf.text(filled.verify.url, left, y + 82, { size: 6, width: textWidth, minSize: 4, color: '#333333' });
  pdf.qr(filled.verify.url, left + width - qrSize, y - 4, qrSize);
}

/** One page per archer on a target, in target and position order, streamed to `out`. */
export async function scorecardsPdf(print: PrintSession, out: Writable): Promise<void> {
  const pdf = new PrintDocument(`Scorecards · ${print.event.name} · ${print.session.name}`);
  const archers = print.targets.flatMap((target) => target.archers);
  await pdf.streamPages(out, archers, (archer) => scorecardPage(pdf, print, archer));
}
