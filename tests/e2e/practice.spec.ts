import { expect, test } from '@playwright/test';
import { checkA11y } from './support/a11y';
import { exportedCsvLines } from './support/practiceCsv';
import { pixelsOf } from './support/plotFace';
import { openThenGoOffline } from './support/offline';

/** Twelve points 15 mm around (30, -10) mm: their mean is (30, -10), 32 mm out at 2 o'clock. */
const PLOTS = Array.from({ length: 12 }, (_, i) => {
  const angle = (i * Math.PI) / 6;
  return { xMm: 30 + 15 * Math.cos(angle), yMm: -10 + 15 * Math.sin(angle) };
});

test('with no account and no signal, a practice session plotted arrow by arrow is kept over a reload', async ({
  page,
  context,
}) => {
  await openThenGoOffline(page, context);
  await page.reload();

  await page.getByTestId('practice-link').click();
  await expect(page.getByRole('heading', { level: 1, name: 'Practice log' })).toBeVisible();
  await expect(page.getByText('No practice yet')).toBeVisible();
  await checkA11y(page, 'practice log, empty');
  await page.screenshot({ path: '.tmp/screens/practice-empty.png', fullPage: true });

  // Free practice: 18 m on the 40 cm face, two ends of six.
  await page.getByLabel('Arrows per end').selectOption('6');
  await page.getByLabel('Ends', { exact: true }).fill('2');
  await page.getByLabel('Note (optional)').fill('Club hall, new tab');
  await page.getByLabel('Arrow shaft diameter (mm)').fill('8,5');
  await page.getByRole('button', { name: 'Start free practice' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Free practice, 18 m');
  await expect(page.getByRole('heading', { name: /End 1 of 2/ })).toBeVisible();
  await page.getByRole('button', { name: 'Plot on the face' }).click();
  await expect(page.getByText('Shaft 8.5 mm')).toBeVisible();
  await checkA11y(page, 'practice session, first end');
  await page.screenshot({ path: '.tmp/screens/practice-plot-start.png', fullPage: true });

  for (const [i, plot] of PLOTS.entries()) {
    if (i === 2) await page.getByRole('button', { name: 'Zoom in' }).click();
    if (i === 11) {
      // The last arrow by keyboard: the mark starts at the centre, each arrow key moves it a
      // quarter zone (5 mm on the 40 cm face), Enter keeps it: (40, -15) mm.
      await page.getByTestId('plot-face').focus();
      for (let k = 0; k < 8; k += 1) await page.keyboard.press('ArrowRight');
      for (let k = 0; k < 3; k += 1) await page.keyboard.press('ArrowUp');
      await expect(page.getByTestId('keep-arrow')).toHaveText(/Keep arrow: (9|10)/);
      await page.keyboard.press('Enter');
      break;
    }
    const target = await pixelsOf(page, plot.xMm, plot.yMm);
    if (i === 0) {
      // The first arrow is dragged into place from the centre before it is kept.
      const centre = await pixelsOf(page, 0, 0);
      await page.mouse.move(centre.x, centre.y);
      await page.mouse.down();
      await page.mouse.move(target.x, target.y, { steps: 5 });
      await page.mouse.up();
    } else {
      await page.mouse.click(target.x, target.y);
    }
    if (i === 3) {
      await checkA11y(page, 'practice session, a mark waiting, zoomed in');
      await page.screenshot({ path: '.tmp/screens/practice-plot-mark.png', fullPage: true });
      await page.getByRole('button', { name: 'Whole face' }).click();
    }
    await page.getByTestId('keep-arrow').click();
    if (i === 5) await expect(page.getByRole('heading', { name: /End 2 of 2/ })).toBeVisible();
  }

  const summary = page.getByTestId('practice-summary');
  await expect(page.getByTestId('session-finished')).toContainText('12 arrows');
  await expect(summary).toContainText('from 12 arrows');
  // Mean of the twelve points: about (30, -10) → √1000 ≈ 31.6 mm, atan2(30, 10) ≈ 71.6° → 2 o'clock
  // (the keyboard's arrow at (40, -15) instead of (43, -17.5) and a pixel of rounding per tap may
  // move it by a millimetre).
  await expect(summary).toContainText(/3[12] mm at 2 o’clock/);
  await checkA11y(page, 'practice session, summary');
  await page.screenshot({ path: '.tmp/screens/practice-summary.png', fullPage: true });
  const before = (await summary.textContent()) ?? '';

  await page.reload();
  await expect(page.getByTestId('practice-summary')).toHaveText(before);
  await expect(page.getByText('Club hall, new tab')).toBeVisible();
  await checkA11y(page, 'practice session after reload');

  await page.getByRole('link', { name: '← Practice log' }).click();
  await expect(page.getByTestId('practice-sessions')).toContainText('from 12 arrows');
  await checkA11y(page, 'practice log with one session');
  await page.screenshot({ path: '.tmp/screens/practice-log.png', fullPage: true });

  // The log leaves the phone as CSV, one row an arrow, with no signal.
  const csv = await exportedCsvLines(page);
  expect(csv).toHaveLength(1 + 12);
  expect(csv[1]).toContain('Club hall');

  // Delete, then undo: the session comes back whole.
  await page.getByRole('button', { name: /^Delete Free practice/ }).click();
  await expect(page.getByText('No practice yet')).toBeVisible();
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page.getByTestId('practice-sessions')).toContainText('from 12 arrows');
});

test('a catalog round starts in two taps and takes values from the pad’s keys and a keyboard', async ({
  page,
}) => {
  await page.goto('/practice');
  await page.getByRole('button', { name: 'Barebow' }).click();
  await page.getByRole('button', { name: /50 m barebow round/ }).click();
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('50 m barebow round');
  await expect(page.getByRole('heading', { name: /End 1 of 12 · 50 m/ })).toBeVisible();
  await page.getByRole('button', { name: 'Type values' }).click();
  await page.getByRole('button', { name: 'Arrow X', exact: true }).click();
  // A keyboard: "1" then "0" is 10, "9" is 9, "m" a miss (src/ui/scorecard/keyEntry.ts).
  await page.keyboard.press('1');
  await page.keyboard.press('0');
  await page.keyboard.press('9');
  await page.keyboard.press('m');
  await expect(page.getByRole('list', { name: 'End 1 so far' })).toHaveText(/X109M/);
  await expect(page.getByTestId('practice-summary')).toContainText('29 from 4 arrows');
  await checkA11y(page, 'practice session, typing values');
  await page.screenshot({ path: '.tmp/screens/practice-keys.png', fullPage: true });
});

test('two fingers zoom the plotting face, and a finger dragging a mark shows it magnified', async ({
  page,
  context,
}) => {
  await page.goto('/practice');
  await page.getByRole('button', { name: 'Start free practice' }).click();
  await page.getByRole('button', { name: 'Plot on the face' }).click();
  const face = page.getByTestId('plot-face');
  const width = async () => Number((await face.getAttribute('viewBox'))?.split(' ')[2]);
  const whole = await width();
  // Touches as a phone sends them (the Pixel 7 context has a touch screen).
  const cdp = await context.newCDPSession(page);
  const touch = (type: 'touchStart' | 'touchMove' | 'touchEnd', points: { x: number; y: number }[]) =>
    cdp.send('Input.dispatchTouchEvent', { type, touchPoints: points.map((p, id) => ({ ...p, id })) });

  const c = await pixelsOf(page, 0, 0);
  await touch('touchStart', [{ x: c.x - 30, y: c.y }]);
  await touch('touchStart', [
    { x: c.x - 30, y: c.y },
    { x: c.x + 30, y: c.y },
  ]);
  for (const spread of [45, 60, 75, 90]) {
    await touch('touchMove', [
      { x: c.x - spread, y: c.y },
      { x: c.x + spread, y: c.y },
    ]);
  }
  await touch('touchEnd', []);
  // Fingers three times as far apart: a third of the face's width on show, and no mark placed.
  await expect.poll(width).toBeCloseTo(whole / 3, 0);
  await expect(page.getByTestId('keep-arrow')).toHaveText('Tap the face first');

  const at = await pixelsOf(page, 10, 0);
  await touch('touchStart', [at]);
  await touch('touchMove', [{ x: at.x + 5, y: at.y }]);
  await expect(page.getByTestId('plot-loupe')).toBeVisible();
  await page.screenshot({ path: '.tmp/screens/practice-plot-loupe.png' });
  await touch('touchEnd', []);
  await expect(page.getByTestId('plot-loupe')).toBeHidden();
  await expect(page.getByTestId('keep-arrow')).toHaveText(/Keep arrow: (9|10|X)/);

  await face.focus();
  await page.keyboard.press('0');
  await expect.poll(width).toBeCloseTo(whole, 0);
  await checkA11y(page, 'practice session, plotting face after a pinch');
});
