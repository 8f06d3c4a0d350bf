import type { Writable } from 'node:stream';
import { POSITIONS } from '../../../src/contract/events';
import { getFace } from '../../../src/core';
import { faceIsPerPosition } from '../organizer/targetFaces';
import { PrintDocument } from './pdfDocument';
import type { PrintSession } from './printSession';

const PAGE = { width: 595.28, height: 841.89, margin: 36 };
const INK = '#123047';

/** The range cautions printed on every target sheet (the same words the app shows where scoring begins). */
export const RANGE_CAUTIONS = [
  'Go forward to the target only when the signal says shooting has stopped.',
  'Keep your phone away while you are on the shooting line.',
  "Don't touch arrows or the face until every arrow is scored and the holes are marked.",
  'Stand aside when arrows are pulled.',
];

function facesLine(target: PrintSession['targets'][number]): string {
  const faceIds = [...new Set(target.archers.flatMap((a) => a.round?.distances.map((d) => d.faceId) ?? []))];
  if (faceIds.length === 0) return 'Faces: no round set for these archers.';
  return `Faces: ${faceIds
    .map((id) =>
      faceIsPerPosition(id)
        ? `${target.archers.length} × ${getFace(id).label} (one per archer)`
        : `1 × ${getFace(id).label} (shared)`,
    )
    .join(', then ')}`;
}

function targetPage(pdf: PrintDocument, print: PrintSession, target: PrintSession['targets'][number]): void {
  const { doc } = pdf;
  const left = PAGE.margin;
  const width = PAGE.width - PAGE.margin * 2;
  pdf.addPage();

  doc.rect(0, 0, PAGE.width, 120).fill(INK);
  pdf.text(`Target ${target.targetNumber}`, left, 18, {
    size: 64,
    bold: true,
    width,
    minSize: 30,
    color: '#ffffff',
  });
  pdf.text(
    `${print.event.name} · ${print.session.name} · ${print.session.startsAt.replace('T', ' ')}`,
    left,
    94,
    {
      size: 12,
      width,
      minSize: 8,
      color: '#ffffff',
    },
  );

  // Archers by position, grouped in their details.
  let y = 138;
  for (const position of POSITIONS) {
    if (position === 'A' || position === 'C') {
      pdf.text(position === 'A' ? 'Detail AB' : 'Detail CD', left, y, {
        size: 10,
        bold: true,
        color: '#444444',
      });
      y += 15;
    }
    const archer = target.archers.find((a) => a.position === position);
    doc.lineWidth(1).rect(left, y, width, 42).stroke('#777777');
    doc.rect(left, y, 42, 42).fill(INK);
    pdf.text(position, left, y + 8, { size: 24, bold: true, width: 42, align: 'center', color: '#ffffff' });
    if (archer) {
      pdf.text(archer.name, left + 52, y + 5, { size: 16, bold: true, width: width - 60, minSize: 9 });
      const detail = [archer.divisionName, archer.club, archer.round?.name].filter(Boolean).join(' · ');
      pdf.text(detail, left + 52, y + 25, { size: 10, width: width - 60, minSize: 7, color: '#333333' });
    } else {
      pdf.text('free', left + 52, y + 13, { size: 13, color: '#555555' });
    }
    y += 48;
  }
  pdf.text(facesLine(target), left, y + 2, { size: 11, bold: true, width, minSize: 7 });
  y += 26;

  // The join code, large, with its QR code.
  const boxHeight = 250;
  doc.lineWidth(2).rect(left, y, width, boxHeight).stroke(INK);
  if (target.joinCode && target.joinUrl) {
    const qrSize = 210;
    pdf.qr(target.joinUrl, left + width - qrSize - 20, y + 20, qrSize);
    const textWidth = width - qrSize - 60;
    pdf.text('Join code', left + 20, y + 24, { size: 14, bold: true });
    pdf.text(target.joinCode, left + 20, y + 50, {
      size: 54,
      bold: true,
      width: textWidth,
      minSize: 30,
      spacing: 4,
    });
    pdf.paragraph(
      'Writers: scan the code with the phone camera, or open Ringcall and type the code, to join this target.',
      left + 20,
      y + 126,
      {
        size: 11,
        width: textWidth,
      },
    );
    pdf.text(target.joinUrl, left + 20, y + 200, { size: 9, width: textWidth, minSize: 6, color: '#333333' });
  } else {
    pdf.text('No join code yet', left + 20, y + 24, { size: 20, bold: true });
    pdf.paragraph(
      'Issue one on the targets screen in Ringcall, then print this sheet again.',
      left + 20,
      y + 56,
      { size: 12, width: width - 40 },
    );
  }
  y += boxHeight + 16;

  // The range cautions: calm and short.
  const cautionHeight = PAGE.height - PAGE.margin - y;
  doc.rect(left, y, width, cautionHeight).fillAndStroke('#fff1d6', '#4d3200');
  pdf.text('Range safety first', left + 14, y + 10, { size: 13, bold: true, color: '#4d3200' });
  let cy = y + 30;
  for (const line of RANGE_CAUTIONS) {
    pdf.text(`•  ${line}`, left + 14, cy, { size: 10, width: width - 28, minSize: 7, color: '#4d3200' });
    cy += 15;
  }
  pdf.text("The event's judges and the governing body's rules always decide.", left + 14, cy + 3, {
    size: 9,
    width: width - 28,
    minSize: 7,
    color: '#4d3200',
  });
}

/** One page per target: number, archers A–D, faces to hang, join code with QR, range cautions. */
export async function targetSheetsPdf(print: PrintSession, out: Writable): Promise<void> {
  const pdf = new PrintDocument(`Target sheets · ${print.event.name} · ${print.session.name}`);
  await pdf.streamPages(out, print.targets, (target) => targetPage(pdf, print, target));
}
