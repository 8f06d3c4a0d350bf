import { expect, test, type Browser, type Page } from '@playwright/test';
import { devices } from '@playwright/test';
import { DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { readDemoDb } from './support/demoDb';
import { phoneStorage } from './support/phoneStorage';
import { signInHere } from './support/signIn';

/*
 * One phone, handed from person to person on the field: nobody ever sees what the person before
 * them saw, on screen or in the browser's storage, with or without a sign-out between them.
 */

const shot = (page: Page, name: string) =>
  page.screenshot({ path: `.tmp/screens/shared-phone-${name}.png`, fullPage: true });

/** The banner archer's card (targets 1–3 are partway scored in the demo), and an archer far from it. */
function demoFacts() {
  const banner = demoArchers()[0]!;
  const card = readDemoDb<{ session_id: number; entry_id: number; target_number: number }>(
    `select t.session_id, t.entry_id, t.target_number from target_assignments t join entries e on e.id = t.entry_id
     where e.email = ?`,
    banner.email,
  );
  const code = readDemoDb<{ code: string }>(
    'select code from join_codes where session_id = ? and target_number = ? and revoked_at is null',
    card.session_id,
    card.target_number,
  ).code;
  const other = readDemoDb<{ email: string; name: string }>(
    `select e.email, e.name from target_assignments t join entries e on e.id = t.entry_id
     where t.session_id = ? and t.target_number = 9 and e.user_id is not null order by t.position limit 1`,
    card.session_id,
  );
  return { banner, card, code, other };
}

/** The organizer looks at the setup screens, the banner archer's card, and follows her target. */
async function organizerLooksAround(browser: Browser) {
  const { banner, card, code } = demoFacts();
  const page = await (await browser.newContext({ ...devices['Pixel 7'] })).newPage();
  await signInHere(page, DEMO_ORGANIZER.email);
  await checkA11y(page, 'organizer home');
  await shot(page, '1-organizer-home');
  await page.getByRole('link', { name: /Larchmere.*Set up/ }).click();
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.goto('/events/1?part=entries');
  await expect(page.getByText(banner.email).first()).toBeVisible({ timeout: 15_000 });
  await page.goto(`/card/${card.session_id}/${card.entry_id}`);
  await expect(page.getByRole('heading', { name: banner.name })).toBeVisible();
  await checkA11y(page, 'organizer viewing a card');
  await page.goto(`/join?code=${code}`);
  await page.getByRole('radio', { name: /Following/ }).check();
  await page.getByRole('button', { name: 'Join target' }).click();
  await expect(page.getByTestId('end-number')).toBeVisible();
  // The organizer's data is on the phone now (so the checks below can fail).
  await expect
    .poll(async () => {
      const stored = await phoneStorage(page);
      return stored.local.includes(banner.name) && stored.tables.cardRecords!.length > 0;
    })
    .toBe(true);
  return page;
}

/** Nothing of the organizer's, nor of the banner archer's card, is stored or on screen. */
async function expectNothingOfTheOrganizer(page: Page) {
  const { banner, card } = demoFacts();
  const stored = await phoneStorage(page);
  for (const text of [DEMO_ORGANIZER.email, DEMO_ORGANIZER.name, banner.email, banner.name])
    expect(stored.local, `localStorage holds "${text}"`).not.toContain(text);
  for (const table of ['cardRecords', 'settlements', 'rulings', 'endSignatures', 'cardSignatures'])
    expect(stored.tables[table], table).toEqual([]);
  expect(JSON.stringify(stored.tables.targets)).not.toContain(banner.name);
  const organizerId = readDemoDb<{ id: number }>(
    'select id from users where email = ?',
    DEMO_ORGANIZER.email,
  ).id;
  expect(JSON.stringify(stored.tables.meta)).not.toContain(`"pullCursor:${organizerId}"`);

  await page.goto('/');
  await expect(page.getByRole('heading', { name: 'Events you organize' })).toHaveCount(0);
  await expect(page.getByText('Scan the join code on your target sheet')).toBeVisible();
  await checkA11y(page, 'next person home, offline');
  await shot(page, '3-next-person-home-offline');
  await page.goto(`/card/${card.session_id}/${card.entry_id}`);
  await expect(page.getByRole('alert')).toBeVisible({ timeout: 15_000 });
  await expect(page.getByTestId('card-totals')).toHaveCount(0);
  await expect(page.locator('main')).not.toContainText(banner.name);
  await page.goto('/events/1?part=entries');
  await expect(page.locator('main')).toBeVisible();
  await page.waitForTimeout(1_000);
  await expect(page.locator('main')).not.toContainText(banner.email);
  await checkA11y(page, 'next person on the setup screen, offline');
  await page.goto(`/pad/${card.session_id}/${card.target_number}`);
  await expect(
    page.getByRole('heading', { name: `This phone has not joined target ${card.target_number}` }),
  ).toBeVisible();
}

test('after the organizer signs out, the next person offline finds none of their data', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const page = await organizerLooksAround(browser);
  await page.goto('/');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await checkA11y(page, 'signed out');
  await shot(page, '2-signed-out');

  await signInHere(page, demoFacts().other.email);
  await page.context().setOffline(true);
  await expectNothingOfTheOrganizer(page);
});

test("when another person signs in after the organizer's sign-in ran out, the organizer's data goes first", async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const page = await organizerLooksAround(browser);
  // The sign-in runs out (no refresh cookie any more): the phone still holds the organizer's data.
  await page.context().clearCookies();
  await page.goto('/');
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible({ timeout: 15_000 });

  await signInHere(page, demoFacts().other.email);
  await page.context().setOffline(true);
  await expectNothingOfTheOrganizer(page);
});
