import { expect, test } from '@playwright/test';
import { DEMO_JUDGES } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { apiPhone, token } from './support/apiPhone';
import { demoTarget, readDemoRows } from './support/demoDb';
import { signedInPhone } from './support/signIn';

/** A compound demo target no other browser test scores (others use 1–4 and 8–12). */
const TARGET = 5;
const PERFECT = ['X', 'X', 'X', 'X', 'X', 'X'];

test("a shoot-off recorded offline reaches the standings when the judge's phone syncs", async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const { code, sessionId, eventId, archers } = demoTarget(TARGET);
  const [a, b] = archers;
  const divisions = readDemoRows<{ division_id: number }>(
    'select distinct division_id from entries where id in (?, ?)',
    a!.entry_id,
    b!.entry_id,
  );
  expect(divisions, 'archers A and B share a division').toHaveLength(1);

  // Both writers agree on a perfect round for A and B: equal totals, 10s and Xs for first place.
  const w1 = apiPhone(request, await token(request, a!.email), 'shootoff-w1');
  const w2 = apiPhone(request, await token(request, b!.email), 'shootoff-w2');
  await w1.join(code, 'writer1');
  await w2.join(code, 'writer2');
  for (const [phone, slot] of [
    [w1, 1],
    [w2, 2],
  ] as const)
    await phone.push(
      [a!, b!].flatMap((archer) =>
        Array.from({ length: 12 }, (_, endIndex) => ({
          kind: 'end.write',
          args: { sessionId, entryId: archer.entry_id, endIndex, slot, arrows: PERFECT, flags: [] },
        })),
      ),
    );

  // The judge opens the shoot-offs from the desk while there is signal.
  const judge = await signedInPhone(browser, DEMO_JUDGES[1]!.email);
  await judge.goto(`/desk/${eventId}`);
  await checkA11y(judge, 'judge desk sessions');
  await judge.getByRole('link', { name: 'Shoot-offs ▸' }).click();
  const rowA = judge.getByTestId(`shootoff-${sessionId}-${a!.entry_id}`);
  const rowB = judge.getByTestId(`shootoff-${sessionId}-${b!.entry_id}`);
  await expect(rowA).toContainText('still level', { timeout: 30_000 });
  await expect(rowB).toContainText('still level');
  await checkA11y(judge, 'shoot-offs');
  // The standings are saved on the phone a moment after they arrive (throttled).
  await judge.waitForFunction(
    (entryId) => (localStorage.getItem('ringcall.query-cache') ?? '').includes(`"entryId":${entryId}`),
    b!.entry_id,
  );

  // Offline: arrow 1 of each is a 9; equal values, so the judge measures: B is closer.
  await judge.context().setOffline(true);
  for (const row of [rowA, rowB]) {
    await row.getByRole('button', { name: /Record arrow 1/ }).click();
    await judge.getByTestId('shootoff-keys').getByRole('button', { name: 'Arrow 9' }).click();
    await expect(row.getByTestId('shootoff-arrow-1')).toContainText('9 ▲ waiting to sync');
  }
  for (const [row, mm] of [
    [rowA, '40'],
    [rowB, '25'],
  ] as const) {
    await row.getByLabel(/distance from the centre/).fill(mm);
    await row.getByRole('button', { name: 'Save distance' }).click();
    await expect(row.getByTestId('shootoff-arrow-1')).toContainText(`9 · ${mm} mm ▲ waiting to sync`);
  }
  await expect(rowB.getByTestId('shootoff-place')).toHaveText('1.');
  await expect(rowA.getByTestId('shootoff-place')).toHaveText('2.');
  await expect(judge.getByTestId('waiting-count')).toContainText('2 shoot-off arrows waiting');
  await checkA11y(judge, 'shoot-offs offline');
  await judge.screenshot({ path: '.tmp/screens/shootoffs-offline.png', fullPage: true });

  // A reload offline keeps them: stored in the phone's outbox, not in the page.
  await judge.reload();
  await expect(rowA.getByTestId('shootoff-arrow-1')).toContainText('9 · 40 mm ▲ waiting to sync', {
    timeout: 20_000,
  });
  await expect(rowB.getByTestId('shootoff-place')).toHaveText('1.');

  // Signal again: the arrows go once and the server's standings settle the tie.
  await judge.context().setOffline(false);
  // The 'online' event starts a round at once, even when one was failing just then (tests/client/syncLoop.test.ts).
  // The margin is for a loaded machine: the round itself takes ~0.1 s here.
  await expect(rowB.getByTestId('shootoff-arrow-1')).toContainText('9 · 25 mm ✓ synced', { timeout: 60_000 });
  await expect(
    judge.getByTestId(`shootoff-group-${sessionId}:${divisions[0]!.division_id}:720`),
  ).toContainText('Settled by the shoot-off', { timeout: 30_000 });
  await expect(judge.getByTestId('sync-line')).toContainText('reached the event server');
  await checkA11y(judge, 'shoot-offs synced');
  await judge.screenshot({ path: '.tmp/screens/shootoffs-synced.png', fullPage: true });
  const stored = readDemoRows<{ entry_id: number }>(
    'select entry_id from shootoff_arrows where session_id = ? and entry_id in (?, ?)',
    sessionId,
    a!.entry_id,
    b!.entry_id,
  );
  // Each arrow and each distance once: four changes, never sent twice.
  expect(stored).toHaveLength(4);

  // The results page (unpublished: the event's people see it) shows the order the shoot-off gave.
  await judge.goto(`/results/${eventId}`);
  const standing = (entryId: number) =>
    judge.locator(`section[aria-labelledby="session-${sessionId}"]`).getByTestId(`standing-${entryId}`);
  await expect(standing(b!.entry_id)).toContainText('after shoot-off', { timeout: 20_000 });
  await expect(standing(b!.entry_id).locator('td').first()).toHaveText('1');
  await expect(standing(a!.entry_id).locator('td').first()).toHaveText('2');
  await checkA11y(judge, 'results after the shoot-off');
  await judge.screenshot({ path: '.tmp/screens/shootoffs-results.png', fullPage: true });
});
