import { expect, test } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import type { CardView } from '../../src/contract/judging';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { demoTarget } from './support/demoDb';
import { phoneOf } from './support/fieldPhones';
import { signedInPhone } from './support/signIn';

/** A demo target no other browser test scores. */
const TARGET = 7;
const END = ['10', '9', '9', '8', '7', '6'];

test("the organizer's card board shows each card's state and the targets behind, and sends a final card again", async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const { code, sessionId, eventId, archers } = demoTarget(TARGET);
  const archer = archers[0]!;
  const [one, two] = demoArchers()
    .filter((p) => !archers.some((a) => a.email === p.email))
    .slice(29, 31);
  // One card made final through the API: both writers, a judge on every end, both signatures.
  const w1 = await phoneOf(request, one!.email);
  const w2 = await phoneOf(request, two!.email);
  await w1.join(code, 'writer1');
  await w2.join(code, 'writer2');
  const organizerAuth = { Authorization: `Bearer ${await token(request, DEMO_ORGANIZER.email)}` };
  const cardOf = async () =>
    (await (
      await request.get(`/api/cards/${sessionId}/${archer.entry_id}`, { headers: organizerAuth })
    ).json()) as CardView;
  const ends = (await cardOf()).ends;
  for (const [slot, phone] of [
    [1, w1],
    [2, w2],
  ] as const)
    await phone.push(
      ends.map((e) => ({
        kind: 'end.write',
        args: { sessionId, entryId: archer.entry_id, endIndex: e.endIndex, slot, arrows: END, flags: [] },
      })),
    );
  await (
    await phoneOf(request, DEMO_JUDGES[0]!.email)
  ).push(
    ends.map((e) => ({
      kind: 'end.sign',
      args: { sessionId, entryId: archer.entry_id, endIndex: e.endIndex, arrows: END },
    })),
  );
  const total = (await cardOf()).totals.total;
  const sign = (role: 'archer' | 'scorer') => ({
    kind: 'card.sign',
    args: { sessionId, entryId: archer.entry_id, role, total },
  });
  await (await phoneOf(request, archer.email)).push([sign('archer')]);
  await w1.push([sign('scorer')]);

  // The organizer reaches the board from the session's targets.
  const organizer = await signedInPhone(browser, DEMO_ORGANIZER.email);
  await organizer.goto(`/events/${eventId}/sessions/${sessionId}/targets`);
  await organizer.getByRole('link', { name: /Card board/ }).click();
  await expect(organizer.getByRole('heading', { level: 1 })).toContainText('Card board');
  const card = organizer.getByTestId(`board-card-${archer.entry_id}`);
  await expect(card).toContainText('12 of 12 ends in · 12 signed by a judge');
  await expect(card).toContainText(/Final · (mailed|not mailed)/);
  // The final card's mail goes out after the push: the board shows it once read again.
  await expect(async () => {
    await organizer.reload();
    await expect(card).toContainText('Final · mailed', { timeout: 2_000 });
  }).toPass({ timeout: 30_000 });
  await expect(organizer.getByTestId('targets-behind')).toContainText(`Target ${TARGET}: 0 ends in`);
  const other = organizer.getByTestId(`board-card-${archers[1]!.entry_id}`);
  await expect(other).toContainText('12 open ends · 0 signed');
  await organizer.screenshot({ path: '.tmp/screens/card-board.png', fullPage: true });
  await checkA11y(organizer, 'card board');

  await card.getByRole('button', { name: /Send the final card again/ }).click();
  await expect(card).toContainText(`Sent to ${archer.email}`);
  await checkA11y(organizer, 'card board after sending again');

  // An archer and a judge are not shown the board.
  for (const email of [archer.email, DEMO_JUDGES[0]!.email]) {
    const page = await signedInPhone(browser, email);
    await page.goto(`/events/${eventId}/sessions/${sessionId}/cards`);
    await expect(page.getByTestId('not-organizer')).toBeVisible();
    await checkA11y(page, 'card board refused');
  }
});
