import { expect, test, type Locator, type Page } from '@playwright/test';
import { DEMO_EVENT, DEMO_ORGANIZER, DEMO_PASSWORD } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { readDemoDb } from './support/demoDb';

/*
 * Two ways in for someone new: an invited judge who creates her account from the invitation,
 * and a volunteer who scans a target's QR code and is on the pad one screen later.
 */

/** A demo target nobody scores in the seeded field, nor in the other browser tests. */
const TARGET = 11;

/** Every link a person must tap is at least 44 px tall. */
async function expectTappable(links: Locator) {
  for (const link of await links.all()) {
    const box = await link.boundingBox();
    expect(box?.height, (await link.textContent()) ?? '').toBeGreaterThanOrEqual(44);
  }
}

/** The newest caught mail to `to` whose body holds `path`, waiting for the catcher. */
async function linkInMail(page: Page, to: string, path: string): Promise<string> {
  let link: string | undefined;
  await expect(async () => {
    const row = readDemoDb<{ text_body: string } | undefined>(
      'select text_body from caught_mail where mail_to = ? order by id desc limit 1',
      to,
    );
    link = new RegExp(`https?://\\S+${path.replace('?', '\\?')}\\S+`).exec(row?.text_body ?? '')?.[0];
    expect(link).toBeTruthy();
  }).toPass({ timeout: 10_000 });
  return new URL(link!).pathname + new URL(link!).search;
}

test('an invited judge creates her account from the invitation and is told she is now a judge of the event', async ({
  page,
  request,
}) => {
  const judge = `new.judge.${Date.now()}@example.org`;
  const session = await (
    await request.post('/api/auth/sign-in', {
      data: { email: DEMO_ORGANIZER.email, password: DEMO_PASSWORD },
    })
  ).json();
  const invited = await request.post('/api/events/1/staff', {
    headers: { Authorization: `Bearer ${session.accessToken}` },
    data: { email: judge, role: 'judge' },
  });
  expect(invited.status()).toBe(201);

  await page.goto(await linkInMail(page, judge, '/invite?token='));
  await expect(page.getByRole('heading', { name: 'Your invitation' })).toBeVisible();
  await checkA11y(page, 'invitation, signed out');
  await page.getByRole('link', { name: 'Create an account' }).click();

  await expect(page.getByRole('heading', { name: 'Create your account' })).toBeVisible();
  await checkA11y(page, 'sign-up from an invitation');
  await page.getByLabel('Your name').fill('Oona Marsh');
  await page.getByLabel('E-mail').fill(judge);
  await page.getByLabel('Password').fill('steady on the line');
  await page.getByRole('button', { name: 'Create account' }).click();

  await expect(page.getByText(`You are now a judge of ${DEMO_EVENT.name}.`)).toBeVisible();
  await expect(page.getByRole('alert')).toHaveCount(0);
  await expect(page.getByRole('link', { name: 'Open the judge desk' })).toBeVisible();
  await page.screenshot({ path: '.tmp/screens/invitation-accepted.png', fullPage: true });
  await checkA11y(page, 'invitation accepted');
});

test('a newcomer scans a target QR code, gives name, e-mail and password on one screen, and is on the pad', async ({
  page,
}) => {
  const { code } = readDemoDb<{ code: string }>(
    'select code from join_codes where target_number = ? and revoked_at is null',
    TARGET,
  );
  await page.goto(`/join?code=${code}`);
  await expect(page.getByRole('heading', { name: 'Join your target' })).toBeVisible();
  await expect(page.getByLabel('Join code')).toHaveValue(code);
  await expectTappable(page.locator('main a'));
  await page.screenshot({ path: '.tmp/screens/join-newcomer.png', fullPage: true });
  await checkA11y(page, 'join as a newcomer');

  await page.getByLabel('Your name').fill('Tove Brand');
  await page.getByLabel('E-mail').fill(`volunteer.${Date.now()}@example.org`);
  await page.getByLabel('Password').fill('holding the clipboard');
  await page.getByRole('radio', { name: /Following/ }).check();
  await page.getByRole('button', { name: 'Create account and join' }).click();

  await expect(page.getByRole('heading', { name: new RegExp(`Target ${TARGET}`) })).toBeVisible();
  await expect(page).toHaveURL(new RegExp(`/pad/\\d+/${TARGET}$`));
  await page.screenshot({ path: '.tmp/screens/join-newcomer-pad.png', fullPage: true });
  await checkA11y(page, 'pad after joining');
});

test('someone who forgot the password gets a link, sets a new one and is signed in', async ({ page }) => {
  const email = `forgetful.${Date.now()}@example.org`;
  const made = await page.request.post('/api/auth/sign-up', {
    data: { email, password: 'remembered once upon', displayName: 'Fenna Holt' },
  });
  expect(made.status()).toBe(201);
  await page.goto('/sign-in');
  await expectTappable(page.locator('main a'));
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await checkA11y(page, 'forgot password');
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send me a link' }).click();
  await expect(page.getByText(`If ${email} has a Ringcall account`)).toBeVisible();

  await page.goto(await linkInMail(page, email, '/reset-password?token='));
  await checkA11y(page, 'choose a new password');
  await page.getByLabel('New password').fill('remembered this time');
  await page.getByRole('button', { name: 'Save my password' }).click();
  await expect(page.getByText('Your password is set and you are signed in as Fenna Holt')).toBeVisible();
  await page.goto('/');
  await expect(page.getByTestId('signed-in-name')).toHaveText('Fenna Holt');
});
