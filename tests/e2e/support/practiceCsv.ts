import { readFileSync } from 'node:fs';
import type { Page } from '@playwright/test';

/** Taps "Export the log as CSV" on the practice log and reads the file's lines. */
export async function exportedCsvLines(page: Page): Promise<string[]> {
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Export the log as CSV' }).click();
  return readFileSync((await (await download).path())!, 'utf8')
    .trimEnd()
    .split('\r\n');
}
