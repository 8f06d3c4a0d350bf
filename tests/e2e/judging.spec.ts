import { expect, test } from '@playwright/test';
import { DEMO_JUDGES, demoArchers } from '../../server/demo/demoPeople';
import { apiPhone, token } from './support/apiPhone';
import { demoTarget } from './support/demoDb';
import { operatorMailTo } from './support/operatorMail';
import { checkA11y } from './support/a11y';
import { signedInPhone } from './support/signIn';

/** A demo target nobody scores in the seeded demo field: four barebow archers, 122 cm face, 12 ends of 6. */
const TARGET = 11;

const END = ['10', '9', '9', '8', '7', '6'];
const TINY_PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

test('a disputed arrow goes to a judge, who rules with a photo and signs; the card is countersigned, mailed and verifies', async ({
  browser,
  request,
}) => {
  test.setTimeout(240_000);
  const { code, sessionId, eventId, archers } = demoTarget(TARGET);
  const people = demoArchers();
  const [w1Email, w2Email, callerEmail] = [people[12]!.email, people[13]!.email, people[14]!.email];
  const w1 = apiPhone(request, await token(request, w1Email), 'w1');
  const w2 = apiPhone(request, await token(request, w2Email), 'w2');
  await w1.join(code, 'writer1');
  await w2.join(code, 'writer2');

  // Every end of every archer, both cards; on end 1 writer 2 has A's third arrow as 8.
  for (const slot of [1, 2] as const) {
    const changes = archers.flatMap((a) =>
      Array.from({ length: 12 }, (_, endIndex) => ({
        kind: 'end.write',
        args: {
          sessionId,
          entryId: a.entry_id,
          endIndex,
          slot,
          arrows: slot === 2 && endIndex === 0 && a.position === 'A' ? ['10', '9', '8', '8', '7', '6'] : END,
          flags: [],
        },
      })),
    );
    await (slot === 1 ? w1 : w2).push(changes);
  }

  // The caller sends the arrow to a judge.
  const caller = await signedInPhone(browser, callerEmail);
  await caller.goto(`/join?code=${code}`);
  await caller.getByRole('radio', { name: /Caller/ }).check();
  await caller.getByRole('button', { name: 'Join target' }).click();
  const mismatch = caller.getByTestId('mismatch-A');
  await expect(mismatch).toBeVisible({ timeout: 20_000 });
  await mismatch.getByRole('button', { name: /Send to a judge/ }).click();
  await mismatch.getByRole('button', { name: 'Settle this end' }).click();
  await expect(caller.getByTestId('state-A')).toContainText('With a judge', { timeout: 20_000 });

  // The judge loads the desk, goes offline and signs every ready end of the target.
  const judge = await signedInPhone(browser, DEMO_JUDGES[0]!.email);
  await judge.goto(`/desk/${eventId}/${sessionId}`);
  await judge.getByRole('button', { name: /Load the targets/ }).click();
  // The overview: one row per target, this target's disputed end counted.
  const row = judge.getByTestId(`desk-target-${TARGET}`);
  await expect(row).toContainText('disputed arrow: 1', { timeout: 30_000 });
  await checkA11y(judge, 'judge desk overview');
  await judge.screenshot({ path: '.tmp/screens/desk-overview.png', fullPage: true });
  await judge.getByRole('combobox', { name: 'Target' }).selectOption(String(TARGET));
  await expect(judge.getByTestId(`desk-dispute-${TARGET}A-1`)).toBeVisible({ timeout: 30_000 });
  await judge.context().setOffline(true);
  await judge.getByRole('button', { name: /Sign all 47 ready ends/ }).click();
  // 47 signatures are stored one after another: give a busy machine time.
  await expect(judge.getByTestId('waiting-count')).toContainText('47 signatures waiting', {
    timeout: 30_000,
  });
  await checkA11y(judge);
  await judge.screenshot({ path: '.tmp/screens/desk-offline.png', fullPage: true });

  // Back online: the signatures go, and the ruling with a photo follows.
  await judge.context().setOffline(false);
  await expect(judge.getByTestId('sync-line')).toContainText('reached the event server', { timeout: 30_000 });
  const dispute = judge.getByTestId(`desk-dispute-${TARGET}A-1`);
  await dispute.getByRole('button', { name: 'Rule on this end' }).click();
  await dispute.getByRole('combobox', { name: 'Arrow 3' }).selectOption('9');
  await dispute.getByLabel('Reason').fill('Line call on arrow 3: the shaft touches the 9 line.');
  await dispute
    .locator('input[type=file]')
    .setInputFiles({ name: 'target.png', mimeType: 'image/png', buffer: TINY_PNG });
  await checkA11y(judge);
  await judge.screenshot({ path: '.tmp/screens/desk-ruling.png', fullPage: true });
  await dispute.getByRole('button', { name: 'Record ruling' }).click();
  const toSign = judge.getByTestId(`desk-to-sign-${TARGET}A-1`);
  await expect(toSign).toBeVisible({ timeout: 30_000 });
  await toSign.getByRole('button', { name: /Sign end/ }).click();
  await expect(judge.getByText('Nothing waits for a judge on this target')).toBeVisible({ timeout: 30_000 });

  // The archer countersigns; the writer who kept the first card signs as scorer.
  const archerA = archers.find((a) => a.position === 'A')!;
  const archer = await signedInPhone(browser, archerA.email);
  await archer.goto('/cards');
  await archer
    .getByRole('link', { name: /Larchmere/ })
    .first()
    .click();
  await expect(archer.getByTestId('card-totals')).toContainText('Total 588');
  await archer.getByRole('button', { name: 'Sign as archer' }).click();
  await expect(archer.getByTestId('card-state')).toContainText('Countersigned', { timeout: 30_000 });
  const scorer = await signedInPhone(browser, w1Email);
  await scorer.goto(`/card/${sessionId}/${archerA.entry_id}`);
  await scorer.getByRole('button', { name: 'Sign as scorer' }).click();
  await expect(scorer.getByTestId('card-state')).toContainText('Final', { timeout: 30_000 });
  await checkA11y(scorer);
  await scorer.screenshot({ path: '.tmp/screens/card-final.png', fullPage: true });

  // The final card arrives by mail with its PDF, and its link verifies as unchanged.
  const mail = await operatorMailTo(request, archerA.email, /final scorecard/);
  expect(mail.attachments.map((a) => a.contentType)).toContain('application/pdf');
  const link = /https?:\/\/\S+\/verify\?sig=\S+/.exec(mail.text)![0];
  await archer.goto(link.replace(/^https?:\/\/[^/]+/, ''));
  await expect(archer.getByTestId('verify-result')).toContainText('Unchanged since it was signed');
  await checkA11y(archer);
  await archer.screenshot({ path: '.tmp/screens/verify.png', fullPage: true });
});
