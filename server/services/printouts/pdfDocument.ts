import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';

export type Pdf = InstanceType<typeof PDFDocument>;

type FontSet = { regular: string[]; bold: string[] };

const require = createRequire(import.meta.url);

function fontFile(name: string): string | undefined {
  try {
    const file = require.resolve(`@fontsource/atkinson-hyperlegible/files/${name}`);
    return existsSync(file) ? file : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Atkinson Hyperlegible (it keeps 8/B, 0/O and 1/I apart, which matters for join codes). The
 * font ships split into a Latin and a Latin Extended file; text is written in runs, each in the
 * first file that has its letters, so "Łucja Dvořák" prints whole. Without the files, Helvetica.
 */
const FILES = {
  regular: ['atkinson-hyperlegible-latin-400-normal.woff', 'atkinson-hyperlegible-latin-ext-400-normal.woff'],
  bold: ['atkinson-hyperlegible-latin-700-normal.woff', 'atkinson-hyperlegible-latin-ext-700-normal.woff'],
};

function registerFonts(doc: Pdf): FontSet {
  const regular = FILES.regular.map(fontFile);
  const bold = FILES.bold.map(fontFile);
  if (regular.some((f) => !f) || bold.some((f) => !f))
    return { regular: ['Helvetica'], bold: ['Helvetica-Bold'] };
  const set: FontSet = { regular: [], bold: [] };
  regular.forEach((file, i) => {
    doc.registerFont(`rc-regular-${i}`, file!);
    set.regular.push(`rc-regular-${i}`);
  });
  bold.forEach((file, i) => {
    doc.registerFont(`rc-bold-${i}`, file!);
    set.bold.push(`rc-bold-${i}`);
  });
  return set;
}

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

/** A PDF with Ringcall's fonts and single-line text that prints any Latin name. */
export class PrintDocument {
  readonly doc: Pdf;
  private readonly fonts: FontSet;
  private readonly chunks: Buffer[] = [];
  private readonly finished: Promise<Buffer>;

  constructor(title: string) {
    this.doc = new PDFDocument({
      size: 'A4',
      margin: 36,
      autoFirstPage: false,
      info: { Title: title, Author: 'Ringcall', Creator: 'Ringcall' },
    });
    this.fonts = registerFonts(this.doc);
    this.finished = new Promise((resolve, reject) => {
      this.doc.on('data', (chunk: Buffer) => this.chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(this.chunks)));
      this.doc.on('error', reject);
    });
  }

  addPage(): void {
    this.doc.addPage({ size: 'A4', margin: 36 });
  }

  /** Splits text into runs, each in the first font file that has its characters. */
  private runs(text: string, bold: boolean): { font: string; text: string }[] {
    const names = bold ? this.fonts.bold : this.fonts.regular;
    const runs: { font: string; text: string }[] = [];
    for (const char of text) {
      const cp = char.codePointAt(0)!;
      const font =
        names.find((name) => {
          this.doc.font(name);
          const glyphs = (this.doc as unknown as { _font: GlyphFont })._font.font;
          return !glyphs?.hasGlyphForCodePoint || glyphs.hasGlyphForCodePoint(cp);
        }) ?? names[0]!;
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

  async finish(): Promise<Buffer> {
    this.doc.end();
    return this.finished;
  }
}
