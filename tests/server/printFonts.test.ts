import { describe, expect, it } from 'vitest';
import { PrintDocument } from '../../server/services/printouts/pdfDocument';

/*
 * Printouts show names in the scripts people enter them in: Atkinson Hyperlegible for Latin,
 * DejaVu Sans for Greek, Cyrillic, Hebrew, Arabic and more; a letter no font has becomes a
 * visible mark (from DejaVu Sans) with a note on the page.
 */

async function printed(name: string): Promise<string> {
  const pdf = new PrintDocument('Fonts');
  pdf.addPage();
  pdf.text(name, 36, 36, { size: 12, width: 300 });
  return (await pdf.toBuffer()).toString('latin1');
}

const embedded = (pdf: string) => [
  ...new Set([...pdf.matchAll(/\/BaseFont \/[A-Z]{6}\+([A-Za-z-]+)/g)].map((m) => m[1])),
];

describe('fonts of printed names', () => {
  it('prints Latin names in Atkinson Hyperlegible alone', async () => {
    expect(embedded(await printed('Łucja Dvořák'))).toEqual(['AtkinsonHyperlegible-Regular']);
  });

  it.each([
    ['Cyrillic', 'Иван Петров'],
    ['Greek', 'Ελένη Παπαδοπούλου'],
    ['Hebrew', 'שרה כהן'],
    ['Arabic', 'ليلى حسن'],
  ])('prints %s names with DejaVu Sans', async (_script, name) => {
    expect(embedded(await printed(name))).toContain('DejaVuSans');
  });

  it('prints a letter no font has as the mark, with its note, from the fonts it has', async () => {
    const pdf = await printed('李小龍');
    expect(embedded(pdf)).toEqual(expect.arrayContaining(['DejaVuSans', 'AtkinsonHyperlegible-Regular']));
  });
});
