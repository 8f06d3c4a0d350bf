import { expect, test } from '@playwright/test';
import { routeSizes } from '../../scripts/routeSizes';

/**
 * First loads in KiB gzip, read from the build the browser tests run on (scripts/routeSizes.ts).
 * The pad's goal is 130 (scripts/routeSizes.ts GOALS); until it is met, its ceiling is what it
 * weighs now, so any growth fails here. The others are their goals.
 */
const CEILINGS: Record<string, number> = {
  'features/pad/PadScreen': 135,
  'features/practice/PracticeArea': 150,
  'features/results/ResultsScreen': 110,
};

test('the pad, the practice log and the public results load within their ceilings', () => {
  const gzipKiB = new Map(routeSizes().map((r) => [r.route, r.gz / 1024]));
  for (const [route, ceiling] of Object.entries(CEILINGS)) {
    expect(gzipKiB.get(route), route).toBeLessThanOrEqual(ceiling);
  }
});
