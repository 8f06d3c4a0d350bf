import { expect, test } from '@playwright/test';
import { checkA11y } from './support/a11y';
import { operatorInboxPath } from './support/operatorMail';

test('a person creates an account, sees it on the home screen, signs out and back in', async ({ page }) => {
  const email = `new.archer.${Date.now()}@example.org`;
  await page.goto('/');
  await page.getByRole('link', { name: 'Create account' }).click();
  await page.getByLabel('Your name').fill('Noor Pennock');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('password');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('alert')).toContainText('most common');
  await checkA11y(page, 'sign-up with a problem');
  await page.getByLabel('Password').fill('a steady anchor point');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByTestId('signed-in-name')).toHaveText('Noor Pennock');
  await expect(page.getByText('Confirm your e-mail address')).toBeVisible();
  await checkA11y(page);
  await page.screenshot({ path: '.tmp/screens/home-signed-in.png', fullPage: true });

  // A reload keeps the person signed in (refresh cookie), with no password typed again.
  await page.reload();
  await expect(page.getByTestId('signed-in-name')).toHaveText('Noor Pennock');

  // Signing out in one tab signs out the app's other tabs too.
  const otherTab = await page.context().newPage();
  await otherTab.goto('/');
  await expect(otherTab.getByTestId('signed-in-name')).toHaveText('Noor Pennock');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await expect(otherTab.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await otherTab.close();
  await page.reload();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();

  await page.getByRole('link', { name: 'Sign in' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('not my password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('not right');
  await checkA11y(page, 'sign-in with a problem');
  await page.getByLabel('Password').fill('a steady anchor point');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-name')).toHaveText('Noor Pennock');
});

test('the confirmation mail reaches the catcher; only the operator reads it, and its link confirms the address', async ({
  page,
  request,
}) => {
  const email = `to.confirm.${Date.now()}@example.org`;
  const signUp = await request.post('/api/auth/sign-up', {
    data: { email, password: 'loose and relaxed', displayName: 'Yuki Quarrie' },
  });
  expect(signUp.status()).toBe(201);

  // An organizer has no way into the caught mail: no entry on the home screen, and no key.
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('organizer@ringcall.example');
  await page.getByLabel('Password').fill('larchmere-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-name')).toHaveText('Priya Castellan');
  await expect(page.getByRole('link', { name: 'Caught mail' })).toHaveCount(0);
  await page.goto('/operator/mail');
  await expect(page.getByLabel('Inbox key')).toBeVisible();
  await checkA11y(page, 'operator inbox, asking for the key');
  await page.getByLabel('Inbox key').fill('a guess at the key of this server');
  await page.getByRole('button', { name: 'Open the inbox' }).click();
  await expect(page.getByRole('alert')).toContainText('only for the person running this server');
  await expect(page.getByText('Confirm your e-mail address for Ringcall')).toHaveCount(0);

  // The operator opens the address the server printed at start; the key leaves the address bar.
  await page.goto(operatorInboxPath());
  await expect(page).toHaveURL(/\/operator\/mail$/);
  await page
    .getByRole('button', { name: new RegExp(`Confirm your e-mail address for Ringcall\\s+To ${email}`) })
    .click();
  const link = page.getByRole('link', { name: /verify-email\?token=/ });
  await expect(link).toBeVisible();
  await checkA11y(page, 'operator inbox, one message');
  await page.screenshot({ path: '.tmp/screens/caught-mail.png', fullPage: true });
  await link.click();
  await expect(page.getByText('Your address is confirmed')).toBeVisible();
});
