import { expect, test, type Locator } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { demoTarget } from './support/demoDb';
import { joinTarget, phoneOf } from './support/fieldPhones';
import { signedInPhone } from './support/signIn';

/** A demo target no other browser test scores. */
const TARGET = 6;
const END = ['10', '9', '9', '8', '7', '6'];
const MISHEARD = ['10', '9', '9', '8', '7', '5'];

/** The six boxes of an end sit on one line: they all share the same top offset. */
async function expectOneLine(list: Locator) {
  const tops = await list
    .locator(':scope > li')
    .evaluateAll((items) => items.map((li) => Math.round(li.getBoundingClientRect().top)));
  expect(tops).toHaveLength(6);
  expect(new Set(tops).size, `tops of the six arrows: ${tops.join(', ')}`).toBe(1);
}

test('six-arrow rows stay on one line at 412 px; a writer leaves a task, an organizer reassigns one and a judge frees one', async ({
  browser,
  request,
}) => {
  test.setTimeout(240_000);
  const { code, sessionId, eventId, archers } = demoTarget(TARGET);
  const people = demoArchers();
  const [one, two, three] = [people[26]!, people[27]!, people[28]!];
  const writer1 = await signedInPhone(browser, one.email);
  const writer2 = await signedInPhone(browser, two.email);
  const caller = await signedInPhone(browser, three.email);
  await joinTarget(writer1, code, /Writer 1/, TARGET);
  await joinTarget(writer2, code, /Writer 2/, TARGET);
  await joinTarget(caller, code, /Caller/, TARGET);
  expect(caller.viewportSize()?.width).toBe(412);

  // The first end through the API: A's cards differ in the last arrow, the others agree.
  const write = (slot: 1 | 2, entryId: number, arrows: string[]) => ({
    kind: 'end.write',
    args: { sessionId, entryId, endIndex: 0, slot, arrows, flags: [] },
  });
  await (await phoneOf(request, one.email)).push(archers.map((a) => write(1, a.entry_id, END)));
  await (
    await phoneOf(request, two.email)
  ).push(archers.map((a) => write(2, a.entry_id, a.position === 'A' ? MISHEARD : END)));

  // The caller's mismatch: both writers' six values on one line each.
  await caller.reload();
  const mismatch = caller.getByTestId('mismatch-A');
  await expect(mismatch).toBeVisible({ timeout: 45_000 });
  await expectOneLine(mismatch.getByRole('list', { name: "Writer 1's values" }));
  await expectOneLine(mismatch.getByRole('list', { name: "Writer 2's values" }));
  await caller.screenshot({ path: '.tmp/screens/tasks-caller-six-arrows.png', fullPage: true });
  await checkA11y(caller, 'caller with a six-arrow mismatch');

  // The judge desk: A's mismatch shows both writers' six values, each on one line.
  const judge = await signedInPhone(browser, DEMO_JUDGES[1]!.email);
  await judge.goto(`/desk/${eventId}/${sessionId}`);
  await judge.getByRole('button', { name: /Load the targets/ }).click();
  await judge.getByRole('combobox', { name: 'Target' }).selectOption(String(TARGET));
  const deskMismatch = judge.getByTestId(`desk-mismatch-${TARGET}A-1`);
  await expect(deskMismatch).toBeVisible({ timeout: 30_000 });
  await expectOneLine(deskMismatch.getByRole('list', { name: 'Writer 1' }));
  await expectOneLine(deskMismatch.getByRole('list', { name: 'Writer 2' }));
  await judge.screenshot({ path: '.tmp/screens/tasks-desk-six-arrows.png', fullPage: true });
  await checkA11y(judge, 'judge desk with six-arrow ends');

  // Writer 2 leaves the task from the pad and is back home without the target.
  await writer2.getByRole('button', { name: 'Leave this task' }).click();
  await checkA11y(writer2, 'leave the task: asked to confirm');
  await writer2.getByRole('button', { name: 'Yes, leave it' }).click();
  await expect(writer2).toHaveURL(/\/$/);
  await expect(writer2.getByRole('heading', { name: 'Your targets' })).toBeVisible();
  await expect(writer2.getByRole('link', { name: new RegExp(`Target ${TARGET}`) })).toHaveCount(0);
  await checkA11y(writer2, 'home after leaving');

  // The organizer, on the session's targets screen, gives writer 2's free task to the caller.
  const organizer = await signedInPhone(browser, DEMO_ORGANIZER.email);
  await organizer.goto(`/events/${eventId}/sessions/${sessionId}/targets`);
  await organizer.getByLabel('Target to look at').selectOption(String(TARGET));
  const group = organizer.getByTestId('target-group');
  await expect(group).not.toContainText(two.name);
  await group.getByRole('combobox', { name: new RegExp(three.name) }).selectOption('writer2');
  await expect(group.getByRole('combobox', { name: new RegExp(three.name) })).toHaveValue('writer2');
  await organizer.screenshot({ path: '.tmp/screens/tasks-organizer-reassigned.png', fullPage: true });
  await checkA11y(organizer, 'organizer reassigning a task');

  // The caller's phone takes the new task when the pad opens again.
  await caller.reload();
  await expect(caller.getByTestId('task-changed')).toContainText('you are now writer 2', { timeout: 30_000 });
  await expect(caller.getByRole('heading', { name: new RegExp(`Target ${TARGET}`) })).toContainText(
    'Writer 2',
  );
  await expect(caller.getByRole('tablist', { name: 'Archers in card order' })).toBeVisible();
  await checkA11y(caller, 'pad after the task changed');

  // A judge frees writer 1's task; writer 1's phone learns it and can remove the target.
  await judge.reload();
  await judge.getByRole('combobox', { name: 'Target' }).selectOption(String(TARGET));
  await judge
    .getByTestId('target-group')
    .getByRole('combobox', { name: new RegExp(one.name) })
    .selectOption('none');
  await expect(judge.getByTestId('target-group')).not.toContainText(one.name);
  await writer1.reload();
  await expect(writer1.getByTestId('task-removed')).toContainText('took you off target', { timeout: 30_000 });
  await writer1.screenshot({ path: '.tmp/screens/tasks-writer-freed.png', fullPage: true });
  await checkA11y(writer1, 'pad after the task was freed');
  await writer1.getByRole('button', { name: `Remove target ${TARGET} from this phone` }).click();
  await expect(writer1.getByRole('heading', { name: 'Your targets' })).toBeVisible();
  await expect(writer1.getByRole('link', { name: new RegExp(`Target ${TARGET}`) })).toHaveCount(0);
});
