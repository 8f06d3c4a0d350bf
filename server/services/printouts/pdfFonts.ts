import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { woffToSfnt } from './woffToSfnt';

const require = createRequire(import.meta.url);

/** Font files in the order text looks for a letter in them: the first that has it prints it. */
export type FontFiles = { regular: Buffer[]; bold: Buffer[] };

const atkinson = (file: string) =>
  woffToSfnt(readFileSync(require.resolve(`@fontsource/atkinson-hyperlegible/files/${file}`)));
const dejavu = (file: string) => readFileSync(require.resolve(`dejavu-fonts-ttf/ttf/${file}`));

let loaded: FontFiles | undefined;

/**
 * Atkinson Hyperlegible first (it keeps 8/B, 0/O and 1/I apart, which matters for join codes; it
 * ships as a Latin and a Latin Extended file), then DejaVu Sans, whose TrueType files cover
 * Greek, Cyrillic, Armenian, Georgian, Hebrew, Arabic and many more, for names in other
 * scripts. Read once per process.
 */
export function pdfFonts(): FontFiles {
  loaded ??= {
    regular: [
      atkinson('atkinson-hyperlegible-latin-400-normal.woff'),
      atkinson('atkinson-hyperlegible-latin-ext-400-normal.woff'),
      dejavu('DejaVuSans.ttf'),
    ],
    bold: [
      atkinson('atkinson-hyperlegible-latin-700-normal.woff'),
      atkinson('atkinson-hyperlegible-latin-ext-700-normal.woff'),
      dejavu('DejaVuSans-Bold.ttf'),
    ],
  };
  return loaded;
}
