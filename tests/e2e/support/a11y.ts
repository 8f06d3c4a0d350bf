import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

/** Links, keys and fields a person taps must be at least this tall and wide (CSS px). */
const TAP_SIZE = 44;

/** Each visible link, button, select or text field smaller than a thumb, in words. */
async function smallTapTargets(page: Page): Promise<string[]> {
  return page.$$eval(
    'a[href], button, select, [role="button"], input:not([type="hidden"]):not([type="checkbox"]):not([type="radio"])',
    (elements, min) =>
      elements.flatMap((el) => {
        const box = el.getBoundingClientRect();
        const style = getComputedStyle(el);
        if (box.width === 0 || box.height === 0 || style.visibility === 'hidden') return [];
        const big = (b: DOMRect) => b.height >= min && b.width >= min;
        if (big(box)) return [];
        // A visually hidden field (a styled file picker) is tapped through its label.
        const labels = el instanceof HTMLInputElement ? [...(el.labels ?? [])] : [];
        if (labels.some((l) => big(l.getBoundingClientRect()))) return [];
        const name = ((el as HTMLElement).innerText || el.getAttribute('aria-label') || el.id || '').trim();
        return [
          `${el.tagName.toLowerCase()} "${name.slice(0, 40)}" ${Math.round(box.width)}×${Math.round(box.height)} px`,
        ];
      }),
    TAP_SIZE,
  );
}

/**
 * Runs axe-core on the page as it is now and fails on serious or critical findings, naming each
 * rule and the elements it found, so the failure says what to fix; then checks that everything a
 * person taps is at least 44 px each way.
 */
export async function checkA11y(page: Page, label = page.url()): Promise<void> {
  const results = await new AxeBuilder({ page }).analyze();
  const bad = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  const lines = bad.map(
    (v) => `${v.impact} ${v.id}: ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`,
  );
  expect(lines, `accessibility findings on ${label}`).toEqual([]);
  expect(await smallTapTargets(page), `links and keys under ${TAP_SIZE} px on ${label}`).toEqual([]);
}
