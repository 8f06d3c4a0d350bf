import { expect, test, type Page } from '@playwright/test';
import { DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { exportedCsvLines } from './support/practiceCsv';
import { pixelsOf } from './support/plotFace';
import { readDemoDb } from './support/demoDb';
import { openThenGoOffline } from './support/offline';
import { signedInPhone, signInHere } from './support/signIn';

/*
 * The practice log synced to the person's account (docs/practice.md): recorded with no account
 * and no signal, adopted at sign-in, sent, and seen on the person's second phone with its
 * progress and CSV; their tournament card in the same history; no one else's session by address.
 */

const shot = (page: Page, name: string) =>
  page.screenshot({ path: `.tmp/screens/practice-sync-${name}.png`, fullPage: true });

test('practice plotted with no account reaches the archer’s second phone once they sign in, with progress and CSV', async ({
  page,
  context,
  browser,
}) => {
  const archer = demoArchers()[0]!;
  await openThenGoOffline(page, context);
  await page.reload();
  await page.goto('/practice').catch(() => undefined);
  await page.getByLabel('Arrows per end').selectOption('6');
  await page.getByLabel('Ends', { exact: true }).fill('2');
  await page.getByLabel('Note (optional)').fill('Synced from the club hall');
  await page.getByRole('button', { name: 'Start free practice' }).click();
  await expect(page.getByRole('heading', { name: /End 1 of 2/ })).toBeVisible();
  const sessionId = new URL(page.url()).pathname.split('/').pop()!;
  await page.getByRole('button', { name: 'Plot on the face' }).click();
  for (let i = 0; i < 12; i += 1) {
    const angle = (i * Math.PI) / 6;
    const at = await pixelsOf(page, 20 * Math.cos(angle), 20 * Math.sin(angle));
    await page.mouse.click(at.x, at.y);
    await page.getByTestId('keep-arrow').click();
  }
  await expect(page.getByTestId('session-finished')).toContainText('12 arrows');
  await page.reload();
  await expect(page.getByTestId('session-finished')).toContainText('12 arrows');

  // Signal back: the archer signs in on this phone, which adopts the session and sends it.
  await context.setOffline(false);
  await signInHere(page, archer.email);
  await expect
    .poll(
      () =>
        readDemoDb<{ n: number }>('select count(*) as n from practice_ends where session_id = ?', sessionId)
          .n,
      {
        timeout: 30_000,
      },
    )
    .toBe(2);

  // A second phone signed in to the same account sees it after its pull.
  const second = await signedInPhone(browser, archer.email);
  await second.goto('/practice');
  const log = second.getByTestId('practice-sessions');
  await expect(log).toContainText('from 12 arrows', { timeout: 30_000 });
  // The archer's own tournament card is in the same history, marked and read-only.
  await expect(log).toContainText('Tournament');
  await checkA11y(second, 'practice log on a second phone, with a tournament card');
  await shot(second, 'second-phone-log');

  const csv = await exportedCsvLines(second);
  expect(csv).toHaveLength(1 + 12);
  expect(csv[1]).toContain('Synced from the club hall');

  await second.getByRole('link', { name: 'Progress over weeks' }).click();
  const series = second.getByRole('region', { name: /18 m/ });
  await expect(series.getByTestId('progress-summary')).toContainText('over 12 arrows');
  // Its chart is drawn (one week, one point: the session).
  await expect(series.getByTestId('progress-chart')).toHaveAttribute('data-drawn', '1');
  await expect(
    second.getByTestId('progress-summary').filter({ hasText: 'tournament' }).first(),
  ).toBeVisible();
  await checkA11y(second, 'progress on a second phone');
  await shot(second, 'second-phone-progress');

  // The session opens on the second phone by its address.
  await second.goto(`/practice/${sessionId}`);
  await expect(second.getByText('Synced from the club hall')).toBeVisible();

  // Another person (the event's organizer) signs in on this shared phone: the address shows nothing of the session.
  await signInHere(second, DEMO_ORGANIZER.email);
  await second.goto(`/practice/${sessionId}`);
  await expect(second.getByRole('heading', { name: 'Practice session not found' })).toBeVisible();
  await expect(second.getByText('Synced from the club hall')).toHaveCount(0);
  await checkA11y(second, 'another person’s practice session by its address');
  await shot(second, 'not-found');
});

test('a session deleted on one phone while the other, offline, keeps an end comes back whole on both, and the log says why', async ({
  browser,
}) => {
  // An archer of their own: the first test's session is not in this log.
  const archer = demoArchers()[1]!;
  const first = await signedInPhone(browser, archer.email);
  await first.goto('/practice');
  await first.getByLabel('Arrows per end').selectOption('3');
  await first.getByLabel('Ends', { exact: true }).fill('3');
  await first.getByLabel('Note (optional)').fill('Raced a deletion');
  await first.getByRole('button', { name: 'Start free practice' }).click();
  await expect(first.getByRole('heading', { name: /End 1 of 3/ })).toBeVisible();
  const sessionId = new URL(first.url()).pathname.split('/').pop()!;
  await first.getByRole('button', { name: 'Type values' }).click();
  for (const value of ['10', '9', '9']) await first.getByRole('button', { name: `Arrow ${value}` }).click();
  const endsOnServer = () =>
    readDemoDb<{ n: number }>('select count(*) as n from practice_ends where session_id = ?', sessionId).n;
  await expect.poll(endsOnServer, { timeout: 30_000 }).toBe(1);

  const second = await signedInPhone(browser, archer.email);
  await second.goto('/practice');
  const log = second.getByTestId('practice-sessions');
  await expect(log).toContainText('28 from 3 arrows', { timeout: 30_000 });

  // The first phone loses signal and keeps a second end; the second phone deletes the session.
  await first.context().setOffline(true);
  for (const value of ['X', '8', '7']) await first.getByRole('button', { name: `Arrow ${value}` }).click();
  await second.getByRole('button', { name: /^Delete / }).click();
  await expect(log).not.toContainText('from 3 arrows');
  await expect
    .poll(
      () =>
        readDemoDb<{ deleted: string | null }>(
          'select deleted_at as deleted from practice_sessions where id = ?',
          sessionId,
        ).deleted,
      { timeout: 30_000 },
    )
    .not.toBeNull();

  // Signal back: the first phone's end wins, and the whole session is on both phones.
  await first.context().setOffline(false);
  await expect.poll(endsOnServer, { timeout: 30_000 }).toBe(2);
  for (const phone of [second, first]) {
    await phone.goto('/practice');
    const sessions = phone.getByTestId('practice-sessions');
    await expect(sessions).toContainText('53 from 6 arrows', { timeout: 30_000 });
    await expect(phone.getByTestId('practice-revived')).toContainText('Back after a deletion');
  }
  await checkA11y(second, 'practice log, a session back after a deletion');
  await shot(second, 'back-after-deletion');
});
