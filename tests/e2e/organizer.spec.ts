import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { DEMO_ARCHER_EMAIL, DEMO_ORGANIZER, DEMO_PASSWORD } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { operatorInboxPath, operatorMailTo } from './support/operatorMail';

/** Every screen the walk looks at is also checked with axe-core. */
const shot = async (page: Page, name: string) => {
  await checkA11y(page, name);
  await page.screenshot({ path: `.tmp/screens/organizer-${name}.png`, fullPage: true });
};

/** Pages of a PDF: pdfkit writes each page object uncompressed as `/Type /Page`. */
const pdfPages = (file: string) =>
  (
    readFileSync(file)
      .toString('latin1')
      .match(/\/Type\s*\/Page(?![a-z])/g) ?? []
  ).length;

async function signIn(page: Page, email: string, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // Signed in once the phone has saved who it is (a reload reads it from there).
  await page.waitForFunction(
    (address) => (localStorage.getItem('ringcall.me') ?? '').includes(address),
    email,
  );
}

const csv = (rows: string[]) => ({
  name: 'entries.csv',
  mimeType: 'text/csv',
  buffer: Buffer.from(['name,club,email,division', ...rows].join('\n')),
});
const ARCHERS = [
  'Aoife Brennan,Kestrel Vale,,Recurve Women',
  'Bettina Holm,Kestrel Vale,,Recurve Women',
  'Carys Wyn,Millrace,,Recurve Women',
  'Dagny Vik,Millrace,,Recurve Women',
  'Emrys Cole,Stonebridge,emrys@example.org,Compound Men',
];

test('an organizer builds an event from nothing to printed scorecards and an invited judge', async ({
  page,
  request,
}) => {
  // axe-core checks every screen of the walk: more than the default minute on a busy machine.
  test.setTimeout(180_000);
  const stamp = Date.now();
  const email = `organizer.${stamp}@example.org`;
  const password = 'a long steady draw';
  const eventName = `Wyvern Cup ${stamp}`;

  // Sign up through the app's own screen, coming back to the event list.
  await page.goto('/sign-up?next=/events');
  await page.getByLabel('Your name').fill('Morwenna Tregear');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('heading', { name: 'Your events' })).toBeVisible();
  await expect(page.getByTestId('no-events')).toBeVisible();
  await shot(page, '01-no-events');

  // Create the event; the overview opens on the first step: divisions.
  await page.getByLabel('Event name').fill(eventName);
  await page.getByLabel('Venue').fill('Tregear meadow');
  await page.getByLabel('First day').fill('2027-05-08');
  await page.getByLabel('Last day').fill('2027-05-08');
  await page.getByLabel('Time zone').selectOption('Europe/London');
  await page.getByRole('button', { name: 'Create event' }).click();
  await expect(page.getByRole('heading', { level: 1, name: eventName })).toBeVisible();
  await expect(page.getByTestId('no-divisions')).toBeVisible();
  await shot(page, '02-new-event');

  for (const [style, className] of [
    ['recurve', 'Women'],
    ['compound', 'Men'],
  ]) {
    await page.getByLabel('Bow style').last().selectOption(style!);
    await page.getByLabel('Class').last().fill(className!);
    await page.getByRole('button', { name: 'Add division' }).click();
    await expect(
      page.getByText(`${style![0]!.toUpperCase()}${style!.slice(1)} ${className}`, { exact: true }),
    ).toBeVisible();
  }

  // A session: each division's round defaults to the catalog round for its bow style.
  await page.getByRole('link', { name: /Sessions & rounds/ }).click();
  await page.getByLabel('Session name').fill('Qualification');
  await page.getByLabel('Start').fill('2027-05-08T09:30');
  await expect(page.getByLabel('Recurve Women')).toHaveValue('70m');
  await expect(page.getByLabel('Compound Men')).toHaveValue('50m-compound');
  await page.getByRole('button', { name: 'Add session' }).click();
  await expect(page.getByRole('heading', { name: 'Qualification' })).toBeVisible();
  await shot(page, '03-session');

  // Entries by CSV: two bad rows; one is corrected in place, the other dropped, then the list imports.
  await page.getByRole('link', { name: /Entry list/ }).click();
  await expect(page.getByTestId('no-entries')).toBeVisible();
  await page
    .getByTestId('csv-file')
    .setInputFiles(
      csv([...ARCHERS, 'Fintan Roe,Stonebridge,,Longbow Gents', 'Gwilym Fox,,gwilym-at-example,Nowhere']),
    );
  const fintan = page.getByTestId('csv-row-7');
  const gwilym = page.getByTestId('csv-row-8');
  await expect(fintan).toContainText('There is no division "Longbow Gents"');
  await expect(gwilym).toContainText('"gwilym-at-example" is not an e-mail address');
  await expect(page.getByTestId('csv-counts')).toHaveText('5 ready · 2 need fixing · 0 dropped');
  await expect(page.getByRole('button', { name: /^Import/ })).toBeDisabled();
  await page.getByLabel('Only rows with problems').check();
  await expect(page.getByTestId('csv-row-2')).toBeHidden();
  await shot(page, '04-csv-problem');

  await fintan.getByLabel('Division').selectOption('Compound Men');
  await expect(fintan).toContainText('Ready');
  await expect(page.getByTestId('csv-counts')).toHaveText('6 ready · 1 needs fixing · 0 dropped');
  await page.getByRole('button', { name: 'Drop row 8' }).click();
  await expect(page.getByTestId('csv-counts')).toHaveText('6 ready · 0 need fixing · 1 dropped');
  await page.getByLabel('Only rows with problems').uncheck();
  await expect(gwilym).toContainText('Dropped');
  await shot(page, '04-csv-corrected');
  await page.getByRole('button', { name: 'Import 6 archers' }).click();
  await expect(page.getByText('Imported 6 archers.')).toBeVisible();
  await expect(page.getByRole('region', { name: 'Recurve Women' }).getByRole('listitem')).toHaveCount(4);
  await shot(page, '05-imported');

  // Targets: automatic layout, then one archer moved by hand.
  await page.getByRole('link', { name: 'Targets & printing' }).click();
  await page.getByRole('link', { name: 'Open targets of Qualification' }).click();
  await expect(page.getByTestId('no-targets')).toBeVisible();
  await page.getByRole('button', { name: 'Assign targets automatically' }).click();
  await expect(page.getByTestId('target-1')).toContainText('Dagny Vik');
  await expect(page.getByTestId('target-2')).toContainText('Fintan Roe');
  await expect(page.getByTestId('target-2')).toContainText('2 faces, one per archer');
  await expect(page.getByTestId('target-1').getByTestId('join-code')).toHaveText(/^[A-Z2-9]{6}$/);
  // This test server listens on 127.0.0.1 only: the paper's address is one no phone can open, and the
  // printing part says so, with the way to set another.
  await expect(page.getByTestId('link-address')).toContainText(
    `Phones cannot open the address on the paper: ${new URL(page.url()).origin}`,
  );
  await expect(page.getByTestId('link-address')).toContainText('PUBLIC_URL');
  await checkA11y(page, 'targets and printing');
  await shot(page, '06-assigned');

  await page.getByRole('button', { name: 'Move or swap Dagny Vik' }).click();
  await expect(page.getByLabel('Archer', { exact: true })).toHaveValue(/\d+/);
  await page.getByLabel('Target', { exact: true }).fill('3');
  await page.getByLabel('Position', { exact: true }).selectOption('A');
  await page.getByRole('button', { name: 'Move here' }).click();
  await expect(page.getByTestId('target-3')).toContainText('Dagny Vik');
  await expect(page.getByTestId('target-1')).not.toContainText('Dagny Vik');
  // Moving a compound archer onto a recurve target is shown as a conflict, not refused.
  await page.getByRole('button', { name: 'Move or swap Emrys Cole' }).click();
  // The form still holds the last archer moved until it has taken this one.
  await expect(page.getByLabel('Archer', { exact: true }).locator('option:checked')).toHaveText(/Emrys Cole/);
  await page.getByLabel('Target', { exact: true }).fill('3');
  await page.getByLabel('Position', { exact: true }).selectOption('B');
  await page.getByRole('button', { name: 'Move here' }).click();
  await expect(page.getByTestId('conflicts')).toContainText('Target 3 mixes rounds or faces');
  await shot(page, '07-moved-conflict');
  await page.getByRole('button', { name: 'Move or swap Emrys Cole' }).click();
  await page.getByLabel('Position', { exact: true }).selectOption('C');
  await page.getByLabel('Target', { exact: true }).fill('2');
  await page.getByRole('button', { name: 'Move here' }).click();
  await expect(page.getByTestId('conflicts')).toHaveCount(0);

  // The scorecards PDF: one page per archer.
  const [cards] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Scorecards (PDF)' }).click(),
  ]);
  expect(pdfPages((await cards.path())!)).toBe(6);
  const [sheets] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Target sheets (PDF)' }).click(),
  ]);
  expect(pdfPages((await sheets.path())!)).toBe(3);

  // Invite a judge: the invitation waits, and its mail is in the catcher.
  const judge = `judge.${stamp}@example.org`;
  await page.getByRole('link', { name: `← ${eventName}` }).click();
  await page.getByRole('link', { name: /Staff/ }).click();
  await page.getByLabel('E-mail').fill(judge);
  await page.getByLabel('Role').selectOption('judge');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${judge}.`)).toBeVisible();
  await expect(page.getByTestId('pending-invitation')).toContainText(judge);
  await shot(page, '08-staff');

  // The invitation reaches the catcher, where only the server's operator reads it.
  const mail = await operatorMailTo(
    request,
    judge,
    new RegExp(`You are invited to be a judge at ${eventName}`),
  );
  expect(mail.text).toMatch(/\/invite\?token=/);
  await page.goto(operatorInboxPath());
  await expect(
    page.getByRole('button', { name: new RegExp(`You are invited to be a judge at ${eventName}`) }),
  ).toBeVisible();
});

test('an archer, or someone with no role, cannot open the organizer screens', async ({ page }) => {
  await signIn(page, DEMO_ARCHER_EMAIL(), '/events/1');
  await expect(page.getByTestId('not-organizer')).toContainText(
    "Only the event's organizers can change its setup.",
  );
  await shot(page, '09-archer-refused');
  await page.goto('/events/1/sessions/1/targets');
  await expect(page.getByTestId('not-organizer')).toContainText(
    "Only the event's organizers can change its setup.",
  );
  await expect(page.getByRole('button', { name: 'Assign targets automatically' })).toHaveCount(0);

  const stranger = await page.request.post('/api/auth/sign-up', {
    data: {
      email: `stranger.${Date.now()}@example.org`,
      password: 'quiet hands on the bow',
      displayName: 'Stray Visitor',
    },
  });
  expect(stranger.status()).toBe(201);
  await page.reload();
  await expect(page.getByTestId('not-organizer')).toContainText(
    "Only the event's organizers can change its setup.",
  );
});

test.describe('on a laptop', () => {
  test.use({
    viewport: { width: 1280, height: 900 },
    isMobile: false,
    hasTouch: false,
    deviceScaleFactor: 1,
  });

  test('the demo organizer sees all 36 archers on 12 targets, swaps two and swaps them back', async ({
    page,
  }) => {
    await signIn(page, DEMO_ORGANIZER.email, '/events/1/sessions/1/targets');
    await expect(page.getByRole('heading', { level: 1 })).toContainText('Targets · Saturday qualification');
    await expect(page.getByRole('list', { name: 'Targets' }).locator('> li')).toHaveCount(12);
    await expect(page.getByTestId('conflicts')).toHaveCount(0);
    const first = await page.getByTestId('target-1').getByTestId('archer-name').first().textContent();
    const second = await page.getByTestId('target-2').getByTestId('archer-name').first().textContent();

    const swapWith = async (spot: string, name: string) => {
      const option = await page
        .getByLabel('Swap with')
        .locator('option', { hasText: `${spot} · ${name}` })
        .textContent();
      await page.getByLabel('Swap with').selectOption({ label: option! });
      await page.getByRole('button', { name: 'Swap places' }).click();
    };
    await page.getByRole('button', { name: `Move or swap ${first}`, exact: true }).click();
    await swapWith('2A', second!);
    await expect(page.getByTestId('target-1')).toContainText(second!);
    await expect(page.getByTestId('target-2')).toContainText(first!);
    await page.screenshot({ path: '.tmp/screens/organizer-10-laptop-targets.png', fullPage: true });

    // Put them back, so other tests find the demo layout as seeded.
    await page.getByRole('button', { name: `Move or swap ${first}`, exact: true }).click();
    await swapWith('1A', second!);
    await expect(page.getByTestId('target-1')).toContainText(first!);
    await expect(page.getByTestId('target-2')).toContainText(second!);

    await page.goto('/events/1?part=sessions');
    // The demo event's first session (another test may have added one).
    await expect(page.getByText('36 archers on 12 targets').first()).toBeVisible();
    await page.screenshot({ path: '.tmp/screens/organizer-11-laptop-sessions.png', fullPage: true });
  });
});
