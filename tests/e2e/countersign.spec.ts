import { expect, test, type Page } from '@playwright/test';
import { DEMO_JUDGES, DEMO_PASSWORD } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { readDemoDb } from './support/demoDb';

const shot = (page: Page, name: string) =>
  page.screenshot({ path: `.tmp/screens/countersign-${name}.png`, fullPage: true });

/** The demo card its archer has countersigned and no scorer has signed yet, and a writer who kept it. */
function cardAndScorer() {
  const card = readDemoDb<{ session_id: number; entry_id: number; name: string; target_number: number }>(
    `select c.session_id, c.entry_id, e.name, ta.target_number from card_signatures c
     join entries e on e.id = c.entry_id
     join target_assignments ta on ta.session_id = c.session_id and ta.entry_id = c.entry_id
     where c.role = 'archer' and c.superseded_at is null and not exists (
       select 1 from card_signatures s where s.session_id = c.session_id and s.entry_id = c.entry_id
       and s.role = 'scorer' and s.superseded_at is null)
     order by c.id limit 1`,
  );
  const scorer = readDemoDb<{ email: string }>(
    `select u.email from target_members m join users u on u.id = m.user_id
     where m.session_id = ? and m.target_number = ? and m.task in ('writer1', 'writer2')
     and m.user_id <> (select coalesce(user_id, 0) from entries where id = ?) order by m.task limit 1`,
    card.session_id,
    card.target_number,
    card.entry_id,
  );
  return { card, scorer };
}

test('the scorer finds the card to sign on the home screen, signs it offline, and is warned before signing out with it unsent', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const { card, scorer } = cardAndScorer();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(scorer.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);

  // An archer's home: targets and cards; creating an event is a small link, the mail catcher is not there.
  await expect(page.getByRole('heading', { name: 'Your scorecards' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Events you organize' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Caught mail' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'My events' })).toHaveCount(0);
  const create = page.getByRole('link', { name: 'Create an event' });
  expect((await create.boundingBox())!.height).toBeGreaterThanOrEqual(44);

  const toSign = page.getByRole('list', { name: 'Cards to sign as scorer' });
  const link = toSign.getByRole('link', { name: new RegExp(card.name) });
  await expect(link).toContainText('Ready for your signature');
  expect((await link.boundingBox())!.height).toBeGreaterThanOrEqual(44);
  await checkA11y(page, 'scorer home');
  await shot(page, '1-home');
  await link.click();
  await expect(page.getByRole('heading', { name: card.name })).toBeVisible();
  await checkA11y(page, 'card to sign');

  // Signed with no signal: the signature waits on the phone.
  await page.context().setOffline(true);
  await page.getByRole('button', { name: 'Sign as scorer' }).click();
  await expect(page.getByText('The signature is saved on this phone')).toBeVisible();
  await page.getByRole('link', { name: 'Ringcall' }).click();
  await page.getByRole('button', { name: 'Sign out' }).click();
  const warning = page.getByTestId('sign-out-warning');
  await expect(warning).toContainText(`Your signature on ${card.name}'s card`);
  await expect(warning.getByRole('button', { name: 'Save waiting changes as a file' })).toBeVisible();
  await checkA11y(page, 'sign-out warning');
  await shot(page, '2-sign-out-warning');
  await warning.getByRole('button', { name: 'Stay signed in' }).click();
  await expect(page.getByTestId('signed-in-name')).toBeVisible();

  // Back online the signature goes; the card is final and leaves the list.
  await page.context().setOffline(false);
  await page.goto(`/card/${card.session_id}/${card.entry_id}`);
  await expect(page.getByTestId('card-state')).toContainText('Final', { timeout: 30_000 });
  await page.goto('/');
  await expect(page.getByTestId('signed-in-name')).toBeVisible();
  await expect(page.getByRole('link', { name: new RegExp(card.name) })).toHaveCount(0);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
});

test("a judge's home leads to the judge desk of their event, not to setup or cards", async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(DEMO_JUDGES[0]!.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  const desk = page.getByRole('link', { name: /Larchmere.*Judge desk/ });
  await expect(desk).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Events you organize' })).toHaveCount(0);
  await expect(page.getByRole('heading', { name: 'Cards to sign as scorer' })).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Caught mail' })).toHaveCount(0);
  await checkA11y(page, 'judge home');
  await shot(page, '3-judge-home');
  await desk.click();
  await expect(page).toHaveURL(/\/desk\/1$/);
});
