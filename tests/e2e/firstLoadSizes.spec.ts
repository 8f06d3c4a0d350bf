import { expect, test } from '@playwright/test';
import { GOALS, meetsGoal, routeSizes } from '../../scripts/routeSizes';

/**
 * First loads in KiB gzip, read from the build the browser tests run on (scripts/routeSizes.ts):
 * each route with a goal meets it, and the pad's whole first load (its CSS too) does not grow
 * past what it weighs now.
 */
const PAD_WHOLE_CEILING_KIB = 136;

test('the pad, the practice log and the public results load within their goals', () => {
  const rows = routeSizes();
  for (const route of Object.keys(GOALS)) {
    const row = rows.find((r) => r.route === route);
    expect(row, route).toBeDefined();
    expect(
      meetsGoal(row!),
      `${route}: ${(row!.jsGz / 1024).toFixed(1)} KiB of JavaScript, ${(row!.gz / 1024).toFixed(1)} KiB in all`,
    ).toBe(true);
  }
  const pad = rows.find((r) => r.route === 'features/pad/PadScreen')!;
  expect(pad.gz / 1024).toBeLessThanOrEqual(PAD_WHOLE_CEILING_KIB);
});
