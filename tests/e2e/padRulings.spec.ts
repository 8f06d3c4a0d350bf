import { expect, test } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import type { CardView } from '../../src/contract/judging';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { readDemoDb, readDemoRows } from './support/demoDb';
import { joinTarget, phoneOf } from './support/fieldPhones';
import { signedInPhone } from './support/signIn';

function targetOf(target: number) {
  const { code, session_id: sessionId } = readDemoDb<{ code: string; session_id: number }>(
    'select code, session_id from join_codes where target_number = ? and revoked_at is null',
    target,
  );
  const archers = readDemoRows<{ entry_id: number; position: string; email: string | null }>(
    `select t.entry_id, t.position, u.email from target_assignments t join entries e on e.id = t.entry_id
     left join users u on u.id = e.user_id where t.session_id = ? and t.target_number = ? order by t.position`,
    sessionId,
    target,
  );
  return { code, sessionId, archers };
}

const END = ['10', '9', '9', '8', '7', '6'];

test('a flag reaches the caller and stops the pull; a ruling reaches both pads with its totals; "10" typed on a keyboard is one arrow', async ({
  browser,
  request,
}) => {
  test.setTimeout(240_000);
  const TARGET = 12;
  const { code, sessionId, archers } = targetOf(TARGET);
  const people = demoArchers();
  const writer1 = await signedInPhone(browser, people[20]!.email);
  const writer2 = await signedInPhone(browser, people[21]!.email);
  const caller = await signedInPhone(browser, people[22]!.email);
  await joinTarget(writer1, code, /Writer 1/, TARGET);
  await joinTarget(writer2, code, /Writer 2/, TARGET);
  await joinTarget(caller, code, /Caller/, TARGET);

  // Writer 1 types A's end on a keyboard: "1" then "0" is one arrow of 10.
  await writer1.getByRole('tab', { name: /^A/ }).click();
  for (const key of ['1', '0', '9', '9', '8', '7', 'm']) await writer1.keyboard.press(key);
  // A full end moves the pad on to the next archer: come back to A.
  await writer1.getByRole('tab', { name: /^A/ }).click();
  await expect(writer1.getByTestId('end-total')).toHaveText('43');
  await expect(writer1.getByRole('list', { name: 'Your values for this end' })).toContainText(
    '10998 7M'.replace(' ', ''),
  );
  // …and marks the miss as a bounce-out.
  await writer1.getByRole('tab', { name: /^A/ }).click();
  await writer1.getByRole('button', { name: 'Arrow 6: M' }).click();
  await writer1.getByRole('button', { name: /Bounce-out/ }).click();
  await checkA11y(writer1, 'writer 1 pad');

  // Writer 2 and the other archers' cards come through the API.
  const w1 = await phoneOf(request, people[20]!.email);
  const w2 = await phoneOf(request, people[21]!.email);
  const a = archers.find((x) => x.position === 'A')!;
  const write = (slot: 1 | 2, entryId: number, arrows: string[]) => ({
    kind: 'end.write',
    args: { sessionId, entryId, endIndex: 0, slot, arrows, flags: [] },
  });
  const others = archers.filter((x) => x.position !== 'A');
  await w1.push(others.map((x) => write(1, x.entry_id, END)));
  await w2.push([
    write(2, a.entry_id, ['10', '9', '9', '8', '7', 'M']),
    ...others.map((x) => write(2, x.entry_id, END)),
  ]);

  // The caller sees the flag and is told not to pull.
  await expect(writer1.getByTestId('sync-line')).toContainText('reached the event server', {
    timeout: 30_000,
  });
  await caller.reload();
  await expect(caller.getByTestId('state-A')).toContainText('Bounce-out on arrow 6', { timeout: 45_000 });
  await expect(caller.getByTestId('pull-advice')).toContainText('Do not pull yet');
  await expect(caller.getByTestId('pull-advice')).not.toContainText('arrows can be pulled');
  await caller.screenshot({ path: '.tmp/screens/caller-flag.png', fullPage: true });
  await checkA11y(caller, 'caller with a flag');
  // Writer 2's pad shows writer 1's flag too.
  await writer2.reload();
  await writer2.getByRole('tab', { name: /^A/ }).click();
  await expect(writer2.getByTestId('end-flags')).toContainText('Bounce-out on arrow 6', { timeout: 30_000 });

  // A judge rules: the bounce-out left a 7.
  const judge = await phoneOf(request, DEMO_JUDGES[0]!.email);
  await judge.push([
    {
      kind: 'end.rule',
      args: {
        sessionId,
        entryId: a.entry_id,
        endIndex: 0,
        arrows: ['10', '9', '9', '8', '7', '7'],
        reason: 'Bounce-out: the hole in the 7 ring is unmarked',
      },
    },
  ]);

  for (const page of [writer1, writer2]) {
    await page.reload();
    // Once the ruling is on the phone, end 1 needs no one and the pad opens on end 2.
    await expect(page.getByTestId('end-number')).toContainText(/End [12] /);
    if ((await page.getByTestId('end-number').textContent())?.startsWith('End 2 '))
      await page.getByRole('button', { name: 'Previous end' }).click();
    await page.getByRole('tab', { name: /^A/ }).click();
    await expect(page.getByTestId('end-state')).toContainText('Ruled by a judge', { timeout: 30_000 });
    await expect(page.getByTestId('end-total')).toHaveText('50');
    await expect(page.getByTestId('running-total')).toHaveText('50');
    await expect(page.getByTestId('rulings')).toContainText('Bounce-out: the hole in the 7 ring is unmarked');
    await expect(page.getByTestId('rulings')).toContainText(`judge ${DEMO_JUDGES[0]!.name}`);
    // A ruled end is locked on the pad, as the server would refuse a change.
    await expect(
      page.getByText('A judge has ruled on this end. Only a judge can change it now.'),
    ).toBeVisible();
    await checkA11y(page, 'pad with a ruling');
  }
  await writer2.screenshot({ path: '.tmp/screens/pad-ruled.png', fullPage: true });
  await caller.reload();
  await expect(caller.getByTestId('end-number')).toContainText(/End [12] /);
  if ((await caller.getByTestId('end-number').textContent())?.startsWith('End 2 '))
    await caller.getByRole('button', { name: 'Previous end' }).click();
  await expect(caller.getByTestId('pull-advice')).toContainText('arrows can be pulled', { timeout: 30_000 });
  await caller.screenshot({ path: '.tmp/screens/caller-ruled.png', fullPage: true });
  await checkA11y(caller, 'caller after the ruling');
});

test('the sign button does not come back after signing, even after a reload before the server answers', async ({
  browser,
  request,
}) => {
  test.setTimeout(240_000);
  const TARGET = 8;
  const { code, sessionId, archers } = targetOf(TARGET);
  const archer = archers.find((x) => x.email)!;
  const people = demoArchers();
  const w1 = await phoneOf(request, people[24]!.email);
  const w2 = await phoneOf(request, people[25]!.email);
  await w1.join(code, 'writer1');
  await w2.join(code, 'writer2');
  const organizer = { Authorization: `Bearer ${await token(request, DEMO_ORGANIZER.email)}` };
  const card = (await (
    await request.get(`/api/cards/${sessionId}/${archer.entry_id}`, { headers: organizer })
  ).json()) as CardView;
  for (const [slot, phone] of [
    [1, w1],
    [2, w2],
  ] as const)
    await phone.push(
      card.ends.map((e) => ({
        kind: 'end.write',
        args: { sessionId, entryId: archer.entry_id, endIndex: e.endIndex, slot, arrows: END, flags: [] },
      })),
    );
  const judge = await phoneOf(request, DEMO_JUDGES[0]!.email);
  await judge.push(
    card.ends.map((e) => ({
      kind: 'end.sign',
      args: { sessionId, entryId: archer.entry_id, endIndex: e.endIndex, arrows: END },
    })),
  );

  const page = await signedInPhone(browser, archer.email!);
  await page.goto(`/card/${sessionId}/${archer.entry_id}`);
  await checkA11y(page, 'card before signing');
  await page.getByRole('button', { name: 'Sign as archer' }).click();
  await expect(page.getByTestId('own-signature')).toBeVisible();
  await expect(page.getByTestId('sync-line')).toContainText('reached the event server', { timeout: 30_000 });
  // The card's server copy is slow to come back: the phone's own record must say it is signed.
  await page.route('**/api/cards/**', () => undefined);
  await page.reload();
  await expect(page.getByTestId('own-signature')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Sign as archer' })).toHaveCount(0);
  await page.screenshot({ path: '.tmp/screens/card-signed-reload.png', fullPage: true });
  await checkA11y(page, 'card after signing');
});
