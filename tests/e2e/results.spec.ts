import { expect, test, type Page } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { apiPhone, token } from './support/apiPhone';
import { demoTarget } from './support/demoDb';

/** A demo target no other browser test scores (the demo field uses 1–3, others 8–12), so it starts at 0. */
const TARGET = 4;
const END = ['10', '9', '9', '8', '7', '6'];
const DESKTOP = {
  viewport: { width: 1920, height: 1080 },
  deviceScaleFactor: 1,
  isMobile: false,
  hasTouch: false,
};

test('a judge signs an end and the public results page shows the new total without a reload; the field screen cycles', async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const { code, sessionId, eventId, archers } = demoTarget(TARGET);
  const [a, b] = archers;
  expect(b, `two archers on target ${TARGET}`).toBeDefined();

  // The organizer publishes the results; until then a stranger is refused.
  expect((await request.get(`/api/results/${eventId}`)).status()).toBe(403);
  // The page says so as news, not as a failure, and offers the event's own people a way in.
  const early = await (await browser.newContext()).newPage();
  await early.goto(`/results/${eventId}`);
  // A status, not an alert (the app's "works without signal" notice may be a status beside it).
  await expect(early.getByRole('status').filter({ hasText: 'not published yet' })).toBeVisible();
  await expect(early.getByRole('alert')).toHaveCount(0);
  const signIn = early.getByRole('link', { name: 'Sign in', exact: true });
  expect((await signIn.boundingBox())!.height).toBeGreaterThanOrEqual(44);
  await checkA11y(early);
  await signIn.click();
  await expect(early).toHaveURL(`/sign-in?next=${encodeURIComponent(`/results/${eventId}`)}`);
  await early.context().close();
  const organizer = await token(request, DEMO_ORGANIZER.email);
  const published = await request.patch(`/api/events/${eventId}/results-settings`, {
    headers: { Authorization: `Bearer ${organizer}` },
    data: { published: true },
  });
  expect(published.status()).toBe(200);

  // A spectator opens the public page on a phone, signed in nowhere.
  const spectator = await (await browser.newContext()).newPage();
  await spectator.goto(`/results/${eventId}`);
  // The archer's row in this session (an event's other sessions list the same archer again).
  const rowOn = (page: Page) =>
    page.locator(`section[aria-labelledby="session-${sessionId}"]`).getByTestId(`standing-${a!.entry_id}`);
  const row = rowOn(spectator);
  await expect(row).toBeVisible({ timeout: 20_000 });
  await expect(row.getByTestId('total')).toHaveText('0');
  await expect(row).toContainText('provisional');
  await checkA11y(spectator, 'public results (phone)');
  await spectator.screenshot({ path: '.tmp/screens/results-phone.png', fullPage: true });

  // The page links its printout, and never loaded the app's layout (sync loop, phone database).
  const pdfHref = await spectator.getByRole('link', { name: 'Print (PDF)' }).getAttribute('href');
  const pdf = await request.get(pdfHref!);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  const scripts = await spectator.evaluate(() =>
    performance.getEntriesByType('resource').map((e) => e.name.split('/').pop()!),
  );
  expect(scripts.filter((name) => /^(AppLayout|db|syncLoop)-.*\.js$/.test(name))).toEqual([]);

  // Both writers enter end 1 of archer A; a judge signs it.
  const w1 = apiPhone(request, await token(request, a!.email), 'results-w1');
  const w2 = apiPhone(request, await token(request, b!.email), 'results-w2');
  await w1.join(code, 'writer1');
  await w2.join(code, 'writer2');
  for (const [phone, slot] of [
    [w1, 1],
    [w2, 2],
  ] as const)
    await phone.push([
      {
        kind: 'end.write',
        args: { sessionId, entryId: a!.entry_id, endIndex: 0, slot, arrows: END, flags: [] },
      },
    ]);
  const judge = apiPhone(request, await token(request, DEMO_JUDGES[0]!.email), 'results-judge');
  await judge.push([
    { kind: 'end.sign', args: { sessionId, entryId: a!.entry_id, endIndex: 0, arrows: END } },
  ]);

  // The open page picks it up by itself (it polls with an ETag).
  await expect(row.getByTestId('total')).toHaveText('49', { timeout: 30_000 });
  await expect(row).toContainText('1/12');

  // Offline, a reload still shows the last copy with its time.
  await spectator.waitForFunction(() => navigator.serviceWorker.controller !== null);
  // The query cache is saved to localStorage a moment after it changes (throttled).
  // Looked for by the archer's own row: another archer of the demo may well have 49 too.
  await spectator.waitForFunction(
    ({ sessionId, entryId }) => {
      const found = (value: unknown, inSession: boolean): boolean => {
        if (!value || typeof value !== 'object') return false;
        const o = value as Record<string, unknown>;
        const here = inSession || o.sessionId === sessionId;
        if (here && o.entryId === entryId && o.total === 49) return true;
        return Object.values(o).some((v) => found(v, here));
      };
      return found(JSON.parse(localStorage.getItem('ringcall.query-cache') ?? 'null'), false);
    },
    { sessionId, entryId: a!.entry_id },
  );
  await spectator.context().setOffline(true);
  await spectator.reload();
  await expect(rowOn(spectator).getByTestId('total')).toHaveText('49', {
    timeout: 20_000,
  });
  await expect(spectator.getByTestId('results-as-of')).toBeVisible();
  await spectator.context().setOffline(false);

  // The same page on a 1920×1080 screen, and the field screen cycling through the divisions.
  const wide = await (await browser.newContext(DESKTOP)).newPage();
  await wide.goto(`/results/${eventId}`);
  await expect(rowOn(wide)).toBeVisible({ timeout: 20_000 });
  await checkA11y(wide, 'public results (1920×1080)');
  await wide.screenshot({ path: '.tmp/screens/results-desktop.png' });

  await wide.goto(`/results/${eventId}/field?seconds=3`);
  const heading = wide.getByTestId('field-division');
  await expect(heading).toBeVisible({ timeout: 20_000 });
  await checkA11y(wide, 'field screen');
  await wide.screenshot({ path: '.tmp/screens/results-field.png' });
  const first = await heading.textContent();
  await expect(heading).not.toHaveText(first ?? '', { timeout: 10_000 });

  const fieldPhone = await (await browser.newContext()).newPage();
  await fieldPhone.goto(`/results/${eventId}/field`);
  await expect(fieldPhone.getByTestId('field-division')).toBeVisible({ timeout: 20_000 });
  await checkA11y(fieldPhone, 'field screen (phone)');
  await fieldPhone.screenshot({ path: '.tmp/screens/results-field-phone.png' });
});
