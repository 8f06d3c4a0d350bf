import { expect, test, type Page } from '@playwright/test';
import { demoArchers } from '../../server/demo/demoPeople';
import { readDemoDb } from './support/demoDb';
import { signedInPhone } from './support/signIn';
import { checkA11y } from './support/a11y';

/** A demo target nobody scores in the seeded demo field (that uses targets 1–3). */
const TARGET = 9;

async function join(page: Page, code: string, task: RegExp, target = TARGET) {
  await page.goto(`/join?code=${code}`);
  await page.getByRole('radio', { name: task }).check();
  await page.getByRole('button', { name: 'Join target' }).click();
  await expect(page.getByRole('heading', { name: new RegExp(`Target ${target}`) })).toBeVisible();
}

/** Taps one archer's end on the pad; values are called highest first. */
async function enterEnd(page: Page, position: string, values: string[]) {
  await page.getByRole('tab', { name: new RegExp(`^${position}`) }).click();
  for (const v of values)
    await page.getByRole('button', { name: v === 'M' ? 'Miss (M)' : `Arrow ${v}`, exact: true }).click();
}

const CALLED: Record<string, string[]> = {
  A: ['X', '10', '9', '9', '8', '7'],
  B: ['10', '9', '9', '8', '7', '6'],
  C: ['9', '8', '8', '7', '5', 'M'],
  D: ['X', 'X', '10', '9', '9', '9'],
};

test('two writers score an end offline, the cross-check finds the one difference, the caller settles it', async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const { code, session_id: sessionId } = readDemoDb<{ code: string; session_id: number }>(
    'select code, session_id from join_codes where target_number = ? and revoked_at is null',
    TARGET,
  );
  const archers = demoArchers();
  const writer1 = await signedInPhone(browser, archers[0]!.email);
  const writer2 = await signedInPhone(browser, archers[1]!.email);
  const caller = await signedInPhone(browser, archers[2]!.email);
  await join(writer1, code, /Writer 1/);
  await join(writer2, code, /Writer 2/);
  await join(caller, code, /Caller/);
  await checkA11y(writer1);
  await writer1.screenshot({ path: '.tmp/screens/pad-empty.png', fullPage: true });

  for (const page of [writer1, writer2]) await page.context().setOffline(true);
  for (const position of ['A', 'B', 'C', 'D']) {
    await enterEnd(writer1, position, CALLED[position]!);
    // Writer 2 mishears B's third arrow: 8 instead of 9.
    await enterEnd(writer2, position, position === 'B' ? ['10', '9', '8', '8', '7', '6'] : CALLED[position]!);
  }
  await expect(writer1.getByTestId('waiting-count')).toHaveText('· 4 ends waiting');
  await checkA11y(writer1);
  await writer1.screenshot({ path: '.tmp/screens/pad-offline.png', fullPage: true });

  // Reload with no signal: the entries are still there, on the end the writer was on.
  for (const page of [writer1, writer2]) {
    await page.reload();
    await expect(page.getByTestId('end-number')).toContainText('End 1');
    await page.getByRole('tab', { name: /^A/ }).click();
    await expect(page.getByTestId('end-total')).toHaveText('53');
  }
  await writer1.getByRole('tab', { name: /^B/ }).click();
  await expect(writer1.getByTestId('end-total')).toHaveText('49');
  await writer2.getByRole('tab', { name: /^B/ }).click();
  await expect(writer2.getByTestId('end-total')).toHaveText('48');

  // Signal returns: the phones send on the browser's "online" event, without a tap.
  for (const page of [writer1, writer2]) await page.context().setOffline(false);
  for (const page of [writer1, writer2]) {
    await expect(page.getByTestId('sync-line')).toContainText('reached the event server', {
      timeout: 20_000,
    });
  }
  // Pull the other writer's card: the mismatch shows on both phones at arrow 3 of B.
  for (const page of [writer1, writer2]) {
    await page.reload();
    await page.getByRole('tab', { name: /^B/ }).click();
    await expect(page.getByTestId('cross-check')).toContainText('differ at arrow 3', { timeout: 20_000 });
  }
  await checkA11y(writer2);
  await writer2.screenshot({ path: '.tmp/screens/pad-mismatch.png', fullPage: true });

  await caller.reload();
  const mismatch = caller.getByTestId('mismatch-B');
  await expect(mismatch).toBeVisible({ timeout: 20_000 });
  await checkA11y(caller);
  await caller.screenshot({ path: '.tmp/screens/caller-mismatch.png', fullPage: true });
  await mismatch.getByRole('button', { name: '9', exact: true }).click();
  await mismatch.getByRole('button', { name: 'Settle this end' }).click();
  await expect(caller.getByTestId('state-B')).toContainText('Settled', { timeout: 20_000 });

  for (const page of [writer1, writer2]) {
    await page.reload();
    // If the settlement reached the phone before the pad opened, end 1 needs no one and the pad opens on end 2.
    await expect(page.getByTestId('end-number')).toContainText(/End [12] /);
    if ((await page.getByTestId('end-number').textContent())?.startsWith('End 2 ')) {
      await page.getByRole('button', { name: 'Previous end' }).click();
    }
    await page.getByRole('tab', { name: /^B/ }).click();
    await expect(page.getByTestId('cross-check')).toContainText('Settled by the caller: 10 9 9 8 7 6', {
      timeout: 20_000,
    });
  }
  await checkA11y(writer2);
  await writer2.screenshot({ path: '.tmp/screens/pad-settled.png', fullPage: true });

  // The server's card says the same.
  const settled = readDemoDb<{ arrows_json: string }>(
    `select s.arrows_json from end_settlements s join target_assignments t on t.entry_id = s.entry_id and t.session_id = s.session_id
     where s.session_id = ? and t.target_number = ? and t.position = 'B' and s.end_index = 0`,
    sessionId,
    TARGET,
  );
  expect(JSON.parse(settled.arrows_json)).toEqual(['10', '9', '9', '8', '7', '6']);
});

test('a value the phone could not save is not shown as entered, and the writer is told', async ({
  browser,
}) => {
  const target = 10;
  const { code } = readDemoDb<{ code: string }>(
    'select code from join_codes where target_number = ? and revoked_at is null',
    target,
  );
  const writer = await signedInPhone(browser, demoArchers()[3]!.email);
  await join(writer, code, /Writer 1/, target);
  await enterEnd(writer, 'A', ['X']);
  await expect(writer.getByTestId('end-total')).toHaveText('10');
  // The X is stored (and sent) before storage breaks: the first tap's write waits for the phone's
  // database to open, and broken sooner, it would refuse the X too (rightly shown as not entered).
  await expect(writer.getByTestId('sync-line')).toContainText('reached the event server', {
    timeout: 20_000,
  });
  // The phone's storage refuses the next write, as when it is full.
  await writer.evaluate(() => {
    IDBObjectStore.prototype.add = () => {
      throw new DOMException('The storage on this phone is full.', 'QuotaExceededError');
    };
  });
  await writer.getByRole('button', { name: 'Arrow 9', exact: true }).click();
  await expect(writer.getByRole('alert')).toContainText(
    'The last value was not saved on this phone (The storage on this phone is full.)',
  );
  await checkA11y(writer);
  await writer.screenshot({ path: '.tmp/screens/pad-not-saved.png', fullPage: true });
  await expect(writer.getByTestId('end-total')).toHaveText('10');
  await writer.context().close();
});
