import { expect, test, type Page } from '@playwright/test';
import { checkA11y } from './support/a11y';
import { openThenGoOffline } from './support/offline';

/** Puts sessions into the phone's practice store as the phone keeps them (one transaction). */
function storeSessions(page: Page, sessions: object[]) {
  return page.evaluate(
    (rows) =>
      new Promise<void>((resolve, reject) => {
        const open = indexedDB.open('ringcall');
        open.onsuccess = () => {
          const tx = open.result.transaction('practiceSessions', 'readwrite');
          for (const row of rows) tx.objectStore('practiceSessions').put(row);
          tx.oncomplete = () => {
            open.result.close();
            resolve();
          };
          tx.onerror = () => reject(tx.error);
        };
        open.onerror = () => reject(open.error);
      }),
    sessions,
  );
}

test('with no signal, practice just recorded shows on the progress screen: chart, summary and table', async ({
  page,
  context,
}) => {
  await openThenGoOffline(page, context);

  await page.goto('/practice/progress');
  await expect(page.getByRole('heading', { level: 1, name: 'Progress' })).toBeVisible();
  await expect(page.getByText('Nothing to draw yet')).toBeVisible();
  await checkA11y(page, 'progress, empty');
  await page.screenshot({ path: '.tmp/screens/progress-empty.png', fullPage: true });

  // One end of three at 18 m on the 40 cm face: X, 10, 9 = 29 points, 9.67 an arrow.
  await page.getByRole('link', { name: 'Start practice' }).click();
  await page.getByLabel('Ends', { exact: true }).fill('1');
  await page.getByRole('button', { name: 'Start free practice' }).click();
  await page.getByRole('button', { name: 'Type values' }).click();
  await page.getByRole('button', { name: 'Arrow X', exact: true }).click();
  await page.keyboard.press('1');
  await page.keyboard.press('0');
  await page.keyboard.press('9');
  await expect(page.getByTestId('session-finished')).toContainText('3 arrows');

  await page.getByRole('link', { name: '← Practice log' }).click();
  await page.getByRole('link', { name: 'Progress over weeks' }).click();
  await expect(page.getByRole('heading', { level: 2, name: /18 m/ })).toBeVisible();
  // The chart library arrives after the screen; the chart says when it is drawn.
  await expect(page.getByTestId('progress-chart')).toHaveAttribute('data-drawn', '1');
  await expect(page.locator('[data-testid="progress-chart"] canvas')).toHaveCount(1);
  const summary = page.getByTestId('progress-summary');
  await expect(summary).toContainText('9.67 an arrow over 3 arrows');
  await expect(summary).toContainText('Best session: 9.67 an arrow');
  // The same figures as a table, drawn when opened.
  await page.getByText('Every week (1)').click();
  await expect(page.getByRole('table')).toContainText('9.67');
  await expect(page.getByRole('table')).toContainText('best session');
  await checkA11y(page, 'progress with one session');
  await page.screenshot({ path: '.tmp/screens/progress-one-week.png', fullPage: true });

  // Filters: the session's bow and distance keep it; both pressed, still drawn.
  await page.getByRole('group', { name: 'Bow style' }).getByRole('button', { name: 'Recurve' }).click();
  await page.getByRole('group', { name: 'Distance' }).getByRole('button', { name: '18 m' }).click();
  await expect(page.getByRole('button', { name: '18 m' })).toHaveAttribute('aria-pressed', 'true');
  await expect(summary).toContainText('9.67 an arrow over 3 arrows');
  await checkA11y(page, 'progress, filtered');
  await page.screenshot({ path: '.tmp/screens/progress-filtered.png', fullPage: true });
});

test('a long log draws its 20 newest sessions, the rest on request, each line from the session’s kept parts', async ({
  page,
}) => {
  await page.goto('/practice');
  await expect(page.getByText('No practice yet')).toBeVisible();
  // 25 sessions as the phone keeps them, each with its parts (30 arrows, 270 points) and no ends:
  // the log's line reads the parts, not the arrows.
  await storeSessions(
    page,
    Array.from({ length: 25 }, (_, s) => ({
      id: 'long-' + String(s).padStart(2, '0'),
      ownerId: 0,
      startedAt: new Date(Date.UTC(2026, 0, 1 + s * 7, 17)).toISOString(),
      bowStyle: 'recurve',
      venue: 'indoor',
      distanceM: 18,
      faceId: 'full-40',
      arrowsPerEnd: 3,
      plannedEnds: 10,
      shaftDiameterMm: 5.5,
      finishedAt: '2026-01-01T18:00:00.000Z',
      progress: [{ distanceM: 18, faceId: 'full-40', arrows: 30, points: 270 }],
    })),
  );
  await page.reload();
  const lines = page.getByTestId('practice-sessions').getByRole('listitem');
  await expect(lines).toHaveCount(20);
  await expect(lines.first()).toContainText('270 from 30 arrows · 9.00 an arrow');
  await checkA11y(page, 'a long practice log, newest 20');
  await page.getByRole('button', { name: 'Show the whole log (25)' }).click();
  await expect(lines).toHaveCount(25);
  await expect(page.getByRole('button', { name: /Show the whole log/ })).toHaveCount(0);
});

test('charts below the screen are drawn when scrolled near, the one on screen at once', async ({ page }) => {
  await page.goto('/practice');
  await expect(page.getByText('No practice yet')).toBeVisible();
  // Three distances, one session each (30 arrows, 270 points): three series, three charts.
  await storeSessions(
    page,
    (
      [
        [18, 'full-40'],
        [30, 'full-80'],
        [70, 'full-122'],
      ] as const
    ).map(([distanceM, faceId], s) => ({
      id: 'far-' + s,
      ownerId: 0,
      startedAt: new Date(Date.UTC(2026, 0, 5 + s * 7, 17)).toISOString(),
      bowStyle: 'recurve',
      venue: 'outdoor',
      distanceM,
      faceId,
      arrowsPerEnd: 6,
      plannedEnds: 5,
      shaftDiameterMm: 5.5,
      finishedAt: '2026-02-01T18:00:00.000Z',
      progress: [{ distanceM, faceId, arrows: 30, points: 270 }],
    })),
  );
  // Opened at its top (a tap on the log's link keeps the log's scroll).
  await page.goto('/practice/progress');
  const charts = page.getByTestId('progress-chart');
  await expect(charts).toHaveCount(3);
  await expect(charts.first()).toHaveAttribute('data-drawn', '1');
  // The last is far below a phone's screen: not drawn yet, its place kept.
  const last = charts.last();
  await expect(last).not.toBeInViewport();
  await expect(last).not.toHaveAttribute('data-drawn');
  expect((await last.boundingBox())?.height).toBe(220);
  await expect(page.getByRole('heading', { level: 2, name: /70 m/ })).toBeAttached();
  await last.scrollIntoViewIfNeeded();
  await expect(last).toHaveAttribute('data-drawn', '1');
  await expect(last.locator('canvas')).toHaveCount(1);
  await checkA11y(page, 'progress, three distances scrolled down');
  await page.screenshot({ path: '.tmp/screens/progress-scrolled.png' });
});
