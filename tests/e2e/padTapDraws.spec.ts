import { expect, test, type Page } from '@playwright/test';
import { demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { demoTarget } from './support/demoDb';
import { joinTarget } from './support/fieldPhones';
import { signedInPhone } from './support/signIn';

const TARGET = 10;

/**
 * The parts of the pad a tap must not draw again. React keeps each element's props on the element
 * and hands it a new props object whenever the component that renders it runs again, so an
 * element holding the same props object after the tap was not drawn again.
 */
const PARTS = {
  // The cross-check is left out: after a whole suite's syncs, an answer arriving in the window
  // redraws it rightly with the server's view (its memo is covered by what it is given).
  keys: '[role="group"][aria-label="Arrow values"]',
  safety: 'aside[aria-label="Range safety"]',
  otherArcher: '[role="tab"]:nth-child(2)',
  tappedArcher: '[role="tab"]:nth-child(1)',
  ownValues: 'ol[aria-label="Your values for this end"]',
};

/** Keeps each part's current props object in the page, to compare after the tap. */
function rememberParts(page: Page) {
  return page.evaluate((parts) => {
    const seen: Record<string, unknown> = {};
    for (const [name, selector] of Object.entries(parts)) {
      const node = document.querySelector(selector)!;
      const key = Object.keys(node).find((k) => k.startsWith('__reactProps$'))!;
      seen[name] = (node as unknown as Record<string, unknown>)[key];
    }
    (globalThis as unknown as { seenParts: Record<string, unknown> }).seenParts = seen;
  }, PARTS);
}

/** Which parts were drawn again since `rememberParts`. */
function drawnAgain(page: Page) {
  return page.evaluate((parts) => {
    const { seenParts } = globalThis as unknown as { seenParts: Record<string, unknown> };
    return Object.entries(parts)
      .filter(([name, selector]) => {
        const node = document.querySelector(selector)!;
        const key = Object.keys(node).find((k) => k.startsWith('__reactProps$'))!;
        return (node as unknown as Record<string, unknown>)[key] !== seenParts[name];
      })
      .map(([name]) => name);
  }, PARTS);
}

test("a tap draws again only the tapped archer's values and tab: not the keys, the cautions or the other archers", async ({
  browser,
}) => {
  const { code } = demoTarget(TARGET);
  const pad = await signedInPhone(browser, demoArchers()[30]!.email);
  await joinTarget(pad, code, /Writer 2/, TARGET);
  await pad.getByRole('tab').first().click();
  await pad.getByRole('button', { name: 'Arrow 10', exact: true }).click();
  // Stored, at the server, and the pad has read the answer back: the first tap's own re-reads
  // and its sync are over (a sync answer still arriving after the second tap would redraw the
  // cross-check rightly, with what the server says).
  await expect(pad.getByTestId('end-total')).toHaveText('10');
  await expect(pad.getByTestId('sync-line')).toContainText(/reached/, { timeout: 30_000 });
  await pad.waitForTimeout(500);

  await rememberParts(pad);
  await pad.getByRole('button', { name: 'Arrow 9', exact: true }).click();
  await expect(pad.getByTestId('end-total')).toHaveText('19');
  await expect(pad.getByRole('tab').first()).toContainText('2/');
  // Long enough for the write to commit, the pad to read it back and the sync to start.
  await pad.waitForTimeout(1_500);
  expect(await drawnAgain(pad)).toEqual(['tappedArcher', 'ownValues']);
  await checkA11y(pad, 'pad after taps');
});
