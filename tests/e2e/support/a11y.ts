import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

/**
 * Runs axe-core on the page as it is now and fails on serious or critical findings, naming each
 * rule and the elements it found, so the failure says what to fix.
 */
export async function checkA11y(page: Page, label = page.url()): Promise<void> {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const lines = bad.map(
    (v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`,
  );
  expect(lines, `accessibility findings on ${label}`).toEqual([]);
}
