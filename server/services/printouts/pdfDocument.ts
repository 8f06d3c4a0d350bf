import type { Writable } from 'node:stream';
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { pdfFonts } from './pdfFonts';

export type Pdf = InstanceType<typeof PDFDocument>;

type FontSet = { regular: string[]; bold: string[] };

function registerFonts(doc: Pdf): FontSet {
  const files = pdfFonts();
  const set: FontSet = { regular: [], bold: [] };
  for (const weight of ['regular', 'bold'] as const)
    files[weight].forEach((file, i) => {
      doc.registerFont(`rc-${weight}-${i}`, file);
      set[weight].push(`rc-${weight}-${i}`);
    });
  return set;
}

/** Printed instead of a letter none of the fonts has, with a note at the foot of the page. */
const MISSING_MARK = '\u25a1';
const MISSING_NOTE = `${MISSING_MARK} stands for a letter these printouts cannot show; Ringcall shows the name in full.`;

/** Lets other requests be answered between the pages of a long printout. */
const breathe = () => new Promise<void>((resolve) => setImmediate(resolve));

type GlyphFont = { font?: { hasGlyphForCodePoint?: (cp: number) => boolean } };

export type TextOptions = {
  size: number;
  bold?: boolean;
  /** Width to fit in; longer text is shrunk down to minSize, then cut with an ellipsis. */
  width?: number;
  align?: 'left' | 'center' | 'right';
  minSize?: number;
  color?: string;
  /** Extra space between characters (join codes). */
  spacing?: number;
};

/** A PDF with Ringcall's fonts and single-line text that prints names in most scripts. */
export class PrintDocument {
  readonly doc: Pdf;
  private readonly fonts: FontSet;
  /** By font name: the font's glyph lookup; by code point and weight: the font that prints it. */
  private readonly glyphs = new Map<string, GlyphFont['font']>();
  private readonly fontFor = new Map<string, string | null>();
  private missingOnPage = false;

  constructor(title: string) {
    this.doc = new PDFDocument({
      size: 'A4',
      margin: 36,
      autoFirstPage: false,
      info: { Title: title, Author: 'Ringcall', Creator: 'Ringcall' },
    });
    this.fonts = registerFonts(this.doc);
  }

  addPage(layout: 'portrait' | 'landscape' = 'portrait'): void {
    this.noteMissing();
    this.doc.addPage({ size: 'A4', layout, margin: 36 });
  }

  /** The first font of the weight that has the letter, or null when none has it. */
  private fontOf(cp: number, bold: boolean): string | null {
    const key = `${bold ? 'b' : 'r'}${cp}`;
    const known = this.fontFor.get(key);
    if (known !== undefined) return known;
    const found =
      (bold ? this.fonts.bold : this.fonts.regular).find((name) => {
        if (!this.glyphs.has(name)) {
          this.doc.font(name);
          this.glyphs.set(name, (this.doc as unknown as { _font: GlyphFont })._font.font);
        }
        const glyphs = this.glyphs.get(name);
        return !glyphs?.hasGlyphForCodePoint || glyphs.hasGlyphForCodePoint(cp);
      }) ?? null;
    this.fontFor.set(key, found);
    return found;
  }

  /** Splits text into runs, each in the first font file that has its characters. */
  private runs(text: string, bold: boolean): { font: string; text: string }[] {
    const runs: { font: string; text: string }[] = [];
    for (const letter of text) {
      let char = letter;
      let font = this.fontOf(char.codePointAt(0)!, bold);
      if (font === null) {
        char = MISSING_MARK;
        font = this.fontOf(MISSING_MARK.codePointAt(0)!, bold) ?? this.fonts.regular[0]!;
        this.missingOnPage = true;
      }
      const last = runs[runs.length - 1];
      if (last && last.font === font) last.text += char;
      else runs.push({ font, text: char });
    }
    return runs;
  }

  private widthOf(runs: { font: string; text: string }[], size: number, spacing: number): number {
    return runs.reduce((sum, r) => {
      this.doc.font(r.font).fontSize(size);
      return sum + this.doc.widthOfString(r.text, { characterSpacing: spacing });
    }, 0);
  }

  /** Writes one line of text at (x, y), fitted into `width`. Returns the size used. */
  text(value: string, x: number, y: number, options: TextOptions): number {
    const spacing = options.spacing ?? 0;
    let size = options.size;
    let runs = this.runs(value, options.bold ?? false);
    if (options.width !== undefined) {
      const minSize = options.minSize ?? options.size;
      while (size > minSize && this.widthOf(runs, size, spacing) > options.width) size -= 0.5;
      if (this.widthOf(runs, size, spacing) > options.width) {
        let cut = [...value];
        while (
          cut.length > 1 &&
          this.widthOf(this.runs(`${cut.join('')}…`, options.bold ?? false), size, spacing) > options.width
        )
          cut = cut.slice(0, -1);
        runs = this.runs(`${cut.join('').trimEnd()}…`, options.bold ?? false);
      }
    }
    const total = this.widthOf(runs, size, spacing);
    let at = x;
    if (options.width !== undefined && options.align === 'center') at = x + (options.width - total) / 2;
    if (options.width !== undefined && options.align === 'right') at = x + options.width - total;
    this.doc.fillColor(options.color ?? '#000000');
    for (const run of runs) {
      this.doc.font(run.font).fontSize(size);
      this.doc.text(run.text, at, y, { lineBreak: false, characterSpacing: spacing });
      at += this.doc.widthOfString(run.text, { characterSpacing: spacing });
    }
    return size;
  }

  /** A wrapped paragraph of Ringcall's own (Latin) words: cautions and notes. */
  paragraph(
    value: string,
    x: number,
    y: number,
    options: { size: number; width: number; bold?: boolean; color?: string },
  ): number {
    const font = (options.bold ? this.fonts.bold : this.fonts.regular)[0]!;
    this.doc
      .font(font)
      .fontSize(options.size)
      .fillColor(options.color ?? '#000000');
    this.doc.text(value, x, y, { width: options.width });
    return this.doc.y;
  }

  /**
   * A QR code drawn as squares (crisp at any size, and far quicker than making and embedding a
   * picture of it), with a quiet zone of two modules.
   */
  qr(value: string, x: number, y: number, size: number): void {
    const { modules } = QRCode.create(value, { errorCorrectionLevel: 'M' });
    const cell = size / (modules.size + 4);
    for (let row = 0; row < modules.size; row += 1)
      for (let col = 0; col < modules.size; col += 1)
        if (modules.get(row, col)) this.doc.rect(x + (col + 2) * cell, y + (row + 2) * cell, cell, cell);
    this.doc.fill('#000000');
  }

  /** Says at the foot of the page when a letter was printed as the mark. */
  private noteMissing(): void {
    if (!this.missingOnPage) return;
    this.missingOnPage = false;
    const { width, height } = this.doc.page;
    this.text(MISSING_NOTE, 36, height - 24, { size: 7, width: width - 72, minSize: 5, color: '#555555' });
  }

  /** The whole PDF in memory, for a one-page document such as a final card to mail. */
  async toBuffer(): Promise<Buffer> {
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (chunk: Buffer) => chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
    });
    this.noteMissing();
    this.doc.end();
    return done;
  }

  /**
   * Streams a printout of many pages to `out` as they are made, one page per item, pausing
   * between pages so other requests are answered meanwhile; stops when the reader goes away.
   */
  async streamPages<T>(
    out: Writable,
    items: Iterable<T>,
    page: (item: T) => void | Promise<void>,
  ): Promise<void> {
    this.doc.pipe(out);
    for (const item of items) {
      if (out.destroyed) break;
      await page(item);
      await breathe();
    }
    this.noteMissing();
    this.doc.end();
  }
}
