/**
 * Draws the app icons from Ringcall's own mark (public/favicon.svg) with the system Chromium.
 * Run by hand after changing the mark: `tsx scripts/draw-icons.ts`. The PNGs are committed.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { chromium } from '@playwright/test';
import { chromiumPath, chromiumArgs } from '../tests/support/chromium';

const svg = readFileSync('public/favicon.svg', 'utf8');

const targets = [
  { file: 'public/icons/icon-192.png', size: 192, padding: 0 },
  { file: 'public/icons/icon-512.png', size: 512, padding: 0 },
  // Maskable icons keep their content inside the central 80 % safe zone.
  { file: 'public/icons/icon-maskable-512.png', size: 512, padding: 0.12 },
  { file: 'public/icons/apple-touch-icon.png', size: 180, padding: 0 },
];

const browser = await chromium.launch({ executablePath: chromiumPath(), args: chromiumArgs });
const page = await browser.newPage();
for (const t of targets) {
  const inner = Math.round(t.size * (1 - 2 * t.padding));
  await page.setViewportSize({ width: t.size, height: t.size });
  await page.setContent(
    `<html><body style="margin:0;background:#123047;display:flex;align-items:center;justify-content:center;width:${t.size}px;height:${t.size}px">` +
      svg.replace('<svg ', `<svg width="${inner}" height="${inner}" `) +
      '</body></html>',
  );
  writeFileSync(t.file, await page.screenshot({ omitBackground: false }));
  console.log(`drew ${t.file}`);
}
await browser.close();
