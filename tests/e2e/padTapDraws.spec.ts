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
  otherCard: '[data-testid="cross-check"]',
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

/**
 * The props the cross-check was last drawn with, as JSON. A sync answer arriving in the window may
 * rightly change what it shows; drawing it again with equal props is the fault looked for.
 */
function crossCheckProps(page: Page) {
  return page.evaluate(() => {
    const node = document.querySelector('[data-testid="cross-check"]')!;
    const key = Object.keys(node).find((k) => k.startsWith('__reactFiber$'))!;
    const propsKey = Object.keys(node).find((k) => k.startsWith('__reactProps$'))!;
    type Fiber = {
      elementType?: { $$typeof?: symbol };
      memoizedProps: unknown;
      return?: Fiber;
      alternate?: Fiber | null;
    };
    const element = node as unknown as Record<string, unknown>;
    let fiber = element[key] as Fiber | undefined;
    // The element keeps the fiber it was made with, which after later drawings may be the copy
    // React works on, not the one on screen: the one on screen holds the element's current props.
    if (fiber && fiber.memoizedProps !== element[propsKey] && fiber.alternate) fiber = fiber.alternate;
    // Up to the memo boundary: the nearest component given as an object (memo), not a function or tag.
    while (fiber && typeof fiber.elementType !== 'object') fiber = fiber.return;
    return JSON.stringify(fiber?.memoizedProps);
  });
}

test("a tap draws again only the tapped archer's values and tab: not the keys, the other card, the cautions or the other archers", async ({
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

  const crossCheckBefore = await crossCheckProps(pad);
  await rememberParts(pad);
  await pad.getByRole('button', { name: 'Arrow 9', exact: true }).click();
  await expect(pad.getByTestId('end-total')).toHaveText('19');
  await expect(pad.getByRole('tab').first()).toContainText('2/');
  // Long enough for the write to commit, the pad to read it back and the sync to start.
  await pad.waitForTimeout(1_500);
  const crossCheckChanged = (await crossCheckProps(pad)) !== crossCheckBefore;
  expect(await drawnAgain(pad)).toEqual([
    ...(crossCheckChanged ? ['otherCard'] : []),
    'tappedArcher',
    'ownValues',
  ]);
  await checkA11y(pad, 'pad after taps');
});
