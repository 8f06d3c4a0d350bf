import { expect, test } from '@playwright/test';
import { DEMO_ARCHER_EMAIL } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { demoTarget, readDemoDb } from './support/demoDb';
import { signedInPhone } from './support/signIn';

test('an archer sees their live place on the home screen and the card, and the last known one offline', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  // The banner archer shoots on targets 1–3, which the demo has partway scored.
  const card = readDemoDb<{ session_id: number; entry_id: number }>(
    `select t.session_id, t.entry_id from target_assignments t join entries e on e.id = t.entry_id
     join users u on u.id = e.user_id where u.email = ? limit 1`,
    DEMO_ARCHER_EMAIL(),
  );
  const page = await signedInPhone(browser, DEMO_ARCHER_EMAIL());
  const onHome = page.getByTestId(`place-${card.session_id}-${card.entry_id}`);
  await expect(onHome).toContainText(/\d+(st|nd|rd|th)( \(tied\))? of \d+ in /, { timeout: 30_000 });
  await expect(onHome).toContainText(/Standing (provisional|signed|final)/);
  await expect(onHome).toContainText(/points? (to the place above|ahead of the place below)/);
  await page.screenshot({ path: '.tmp/screens/place-home.png', fullPage: true });
  await checkA11y(page, 'home with the live place');

  await page.goto(`/card/${card.session_id}/${card.entry_id}`);
  const onCard = page.getByRole('region', { name: 'Your place' });
  await expect(onCard).toContainText(/\d+(st|nd|rd|th)( \(tied\))? of \d+ in /, { timeout: 30_000 });
  await checkA11y(page, 'card with the live place');

  // No signal: the last known place stays, with its time.
  await page.context().setOffline(true);
  await page.reload();
  await expect(onCard).toContainText('Last known, as of', { timeout: 30_000 });
  await expect(onCard).toContainText(/\d+(st|nd|rd|th)( \(tied\))? of \d+ in /);
  await page.screenshot({ path: '.tmp/screens/place-card-offline.png', fullPage: true });
  await checkA11y(page, 'card offline with the last known place');
  await page.context().setOffline(false);

  // An archer whose target has not shot yet: no place, said in words.
  const waiting = demoTarget(6).archers[0]!;
  const other = await signedInPhone(browser, waiting.email);
  await expect(other.getByTestId(`place-${demoTarget(6).sessionId}-${waiting.entry_id}`)).toContainText(
    'No place yet',
    { timeout: 30_000 },
  );
  await checkA11y(other, 'home before any end counts');
});
