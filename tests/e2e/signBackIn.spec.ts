import { expect, test, type APIRequestContext } from '@playwright/test';
import { DEMO_ORGANIZER, DEMO_PASSWORD, demoArchers } from '../../server/demo/demoPeople';
import { token } from './support/apiPhone';
import { checkA11y } from './support/a11y';
import { demoTarget } from './support/demoDb';
import { joinTarget } from './support/fieldPhones';
import { signedInPhone } from './support/signIn';

/** A target other tests score on: writer 1 is freed for this one first, as an organizer would. */
const TARGET = 10;

async function freeWriter1(request: APIRequestContext) {
  const { eventId, sessionId } = demoTarget(TARGET);
  const headers = { Authorization: `Bearer ${await token(request, DEMO_ORGANIZER.email)}` };
  const members = `/api/events/${eventId}/sessions/${sessionId}/targets/${TARGET}/members`;
  const group = (await (await request.get(members, { headers })).json()) as {
    userId: number;
    task: string;
  }[];
  for (const member of group.filter((m) => m.task === 'writer1')) {
    const freed = await request.put(`${members}/${member.userId}`, { headers, data: { task: 'none' } });
    expect(freed.status()).toBe(200);
  }
}

/**
 * A writer's sign-in runs out while values wait on the phone: the pad says so, signing back in
 * from there brings the writer back to the pad, and what waited is sent without a reload.
 */
test('values waiting when the sign-in ran out are sent once the writer signs back in from the pad', async ({
  browser,
  request,
}) => {
  test.setTimeout(120_000);
  await freeWriter1(request);
  const writer = demoArchers()[26]!;
  const page = await signedInPhone(browser, writer.email);
  await joinTarget(page, demoTarget(TARGET).code, /Writer 1/, TARGET);
  const padPath = new URL(page.url()).pathname;

  await page.context().setOffline(true);
  await page.getByRole('button', { name: 'Arrow 9', exact: true }).click();
  await expect(page.getByTestId('waiting-count')).toBeVisible();
  // The sign-in runs out (no refresh cookie any more) and the app is opened again (its short-lived
  // token was only in the page's memory), then the signal returns.
  await page.context().clearCookies();
  await page.reload();
  await expect(page.getByTestId('waiting-count')).toBeVisible();
  await page.context().setOffline(false);

  const signBackIn = page.getByRole('link', { name: 'Sign back in to send them' });
  await expect(signBackIn).toBeVisible({ timeout: 15_000 });
  await expect(page.getByTestId('sync-line')).toContainText('kept on this phone');
  await checkA11y(page);
  await page.screenshot({ path: '.tmp/screens/pad-sign-back-in.png', fullPage: true });
  const box = (await signBackIn.boundingBox())!;
  expect(box.height).toBeGreaterThanOrEqual(44);

  await signBackIn.click();
  await page.getByLabel('E-mail').fill(writer.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(new RegExp(`${padPath}$`), { timeout: 15_000 });
  await expect(page.getByTestId('sync-line')).toHaveText(
    '✓ Everything on this phone has reached the event server.',
    { timeout: 15_000 },
  );
  await expect(page.getByTestId('waiting-count')).toHaveCount(0);
});

test('a sign-in link that names another site as its next page brings the person home instead', async ({
  page,
}) => {
  for (const next of ['https://evil.example/x', '//evil.example/x']) {
    await page.context().clearCookies();
    await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
    await page.getByLabel('E-mail').fill(demoArchers()[27]!.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByTestId('signed-in-name')).toBeVisible({ timeout: 15_000 });
    expect(new URL(page.url()).pathname).toBe('/');
  }
});
