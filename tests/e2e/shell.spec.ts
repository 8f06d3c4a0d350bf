import { expect, test } from '@playwright/test';
import { checkA11y } from './support/a11y';

test('home screen renders on a phone, and again after going offline and reloading', async ({
  page,
  context,
}) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('scorecard');
  await expect(page.getByTestId('connection-badge')).toHaveText(/Online/);
  await expect(page.getByTestId('server-line')).toContainText('version');
  // Wait until the service worker controls the page, so the shell is precached.
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  await checkA11y(page);
  await page.screenshot({ path: '.tmp/screens/home-online.png', fullPage: true });

  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('scorecard');
  await expect(page.getByTestId('connection-badge')).toHaveText(/Offline/);
  // The persisted query cache still knows the server version it saw.
  await expect(page.getByTestId('server-line')).toContainText('No signal');
  await checkA11y(page);
  await page.screenshot({ path: '.tmp/screens/home-offline.png', fullPage: true });
  // Signal back: the app notices by itself (it asks the server now and then while cut off).
  await context.setOffline(false);
  await expect(page.getByTestId('connection-badge')).toHaveText(/Online/, { timeout: 20_000 });
});

test('the manifest is served with the fields and icons an install needs', async ({ page, request }) => {
  await page.goto('/');
  const href = await page.locator('link[rel="manifest"]').getAttribute('href');
  expect(href).toBeTruthy();
  const response = await request.get(href!);
  expect(response.ok()).toBe(true);
  const manifest = (await response.json()) as {
    name: string;
    short_name: string;
    display: string;
    theme_color: string;
    start_url: string;
    icons: { src: string; sizes: string; type: string }[];
  };
  expect(manifest.name).toBe('Ringcall scorecard');
  expect(manifest.short_name).toBe('Ringcall');
  expect(manifest.display).toBe('standalone');
  expect(manifest.theme_color).toMatch(/^#[0-9a-f]{6}$/i);
  expect(manifest.start_url).toBe('/');
  for (const size of ['192x192', '512x512']) {
    const icon = manifest.icons.find((i) => i.sizes === size);
    expect(icon, `icon ${size}`).toBeDefined();
    const png = await request.get(icon!.src);
    expect(png.ok()).toBe(true);
    expect(png.headers()['content-type']).toBe('image/png');
  }
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  const scope = await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.scope);
  expect(scope).toMatch(/\/$/);
});

test('an unknown API address answers the JSON error shape, not the app page', async ({ request }) => {
  const response = await request.get('/api/unknown', { headers: { Accept: 'text/html,application/json' } });
  expect(response.status()).toBe(404);
  expect(response.headers()['content-type']).toContain('application/json');
  const body = (await response.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe('not_found');
  expect(body.error.message).toContain('/api/unknown');
});

test('an unknown screen shows the not-found page inside the app', async ({ page }) => {
  await page.goto('/no-such-screen');
  await expect(page.getByRole('heading', { name: 'Nothing here' })).toBeVisible();
  await checkA11y(page, 'not found');
  await page.getByRole('link', { name: 'Go to start' }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('scorecard');
});
