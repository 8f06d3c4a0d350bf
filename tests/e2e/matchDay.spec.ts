import { expect, test, type Page } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { signedInPhone } from './support/signIn';
import { qualificationWriters, setUpSmallEvent } from './support/smallEvent';

/*
 * The afternoon in the app: the organizer creates a four-archer bracket on the event screen (first
 * refused while an archer still has an end to shoot), places the semi-finals on targets; the judge
 * scores one semi-final (seeds 1 and 4) offline on the phone, reloads, signs, goes online and the bracket moves
 * on; the other semi-final goes 5–5 and is decided by a shoot-off arrow marked closer.
 * Its own event (a one-end custom round), so no other spec's targets or divisions are touched.
 */

const ARCHERS = ['Mara Thistle', 'Nils Ashdown', 'Oona Brack', 'Pim Ledger'];
const QUALIFICATION = [
  ['10', '10', '10'],
  ['10', '10', '9'],
  ['10', '9', '9'],
  ['9', '9', '9'],
];
const JUDGE = DEMO_JUDGES[1]!;

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `.tmp/screens/match-day-${name}.png`, fullPage: true });
}

/** One end on the judge's keys: the upper line's three arrows, then the lower line's, then save. */
async function enterEnd(page: Page, endNumber: number, a: string, b: string) {
  const keys = page.getByRole('group', { name: 'Arrow values' });
  for (const v of `${a} ${b}`.split(' '))
    await keys.getByRole('button', { name: `Arrow ${v}`, exact: true }).click();
  await page.getByRole('button', { name: `Save end ${endNumber}` }).click();
  await expect(page.getByTestId(`match-end-${endNumber}`)).toBeVisible();
}

test('the organizer creates a bracket, the judge scores matches offline on the phone and signs', async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const organizer = await token(request, DEMO_ORGANIZER.email);
  const judge = await token(request, JUDGE.email);

  const { eventId, divisionId, sessionId } = await setUpSmallEvent(
    request,
    { organizer, judge, judgeEmail: JUDGE.email },
    {
      name: 'Match day',
      date: '2026-12-13',
      className: 'Afternoon',
      sessionName: 'Morning qualification',
      roundId: 'match-day-e2e',
      archers: ARCHERS,
    },
  );
  const { entries: archers, writeEnds } = await qualificationWriters(
    request,
    { organizer, judge },
    sessionId,
    'match-day',
    (name) => QUALIFICATION[ARCHERS.indexOf(name)]!,
  );
  // Pim Ledger has not shot yet.
  await writeEnds(archers.slice(0, 3));

  // The organizer opens Eliminations on the event screen: the server refuses while Pim still shoots.
  const org = await signedInPhone(browser, DEMO_ORGANIZER.email);
  await org.goto(`/events/${eventId}?part=eliminations`);
  const part = org.getByTestId(`eliminations-${divisionId}`);
  await expect(part.getByLabel('Match format')).toHaveValue('sets');
  await part.getByLabel('Archers in the bracket').selectOption('everyone');
  await part.getByRole('button', { name: /Create the bracket/ }).click();
  await expect(part.getByTestId('bracket-refusal')).toContainText(/end/i);
  await checkA11y(org, 'eliminations: refused');
  await shot(org, 'organizer-refused');

  await writeEnds(archers.slice(3));
  await part.getByRole('button', { name: /Create the bracket/ }).click();
  await expect(part).toContainText('4 archers, bracket of 4, set system');
  const brackets = await (
    await request.get(`/api/events/${eventId}/brackets`, {
      headers: { Authorization: `Bearer ${organizer}` },
    })
  ).json();
  const matches = brackets.brackets[0].matches as {
    id: number;
    round: number;
    slot: number;
    bronze: boolean;
  }[];
  const idOf = (round: number, slot: number, bronze = false) =>
    matches.find((m) => m.round === round && m.slot === slot && m.bronze === bronze)!.id;
  const [semi1, semi2, final] = [idOf(0, 0), idOf(0, 1), idOf(1, 0)];
  for (const [id, target] of [
    [semi1, 5],
    [semi2, 6],
  ] as const) {
    const row = part.getByTestId(`open-match-${id}`);
    await row.getByRole('textbox', { name: /Target for/ }).fill(String(target));
    await row.getByRole('button', { name: 'Place on target' }).click();
    await expect(row).toContainText(`on target ${target}`);
  }
  await checkA11y(org, 'eliminations: bracket');
  await shot(org, 'organizer-bracket');

  // The judge opens the matches from the judge desk.
  const desk = await signedInPhone(browser, JUDGE.email);
  await desk.goto(`/desk/${eventId}`);
  await desk.getByRole('link', { name: 'Matches ▸' }).click();
  await expect(desk.getByTestId(`desk-match-${semi1}`)).toContainText('Target 5');
  await checkA11y(desk, 'judge: matches');
  await shot(desk, 'judge-matches');
  await desk.getByTestId(`desk-match-${semi1}`).click();
  await expect(desk.getByRole('heading', { name: 'Set 1' })).toBeVisible();
  // The keys are big enough for a thumb.
  const key = await desk.getByRole('button', { name: 'Arrow 10', exact: true }).boundingBox();
  expect(key!.width).toBeGreaterThanOrEqual(44);
  expect(key!.height).toBeGreaterThanOrEqual(44);
  await checkA11y(desk, 'judge: match card');

  // Offline: three sets to Mara, stored on the phone.
  await desk.context().setOffline(true);
  await enterEnd(desk, 1, '10 10 10', '9 9 9');
  await expect(desk.getByTestId('match-end-1')).toContainText('waiting to sync');
  await expect(desk.getByTestId('score-a')).toContainText('2');
  await enterEnd(desk, 2, '10 10 9', '9 9 9');
  await expect(desk.getByTestId('outlook-a')).toContainText('Winning the next set wins the match.');
  await expect(desk.getByTestId('outlook-b')).toContainText('Must not lose the next set.');
  await shot(desk, 'judge-offline-set-2');
  await enterEnd(desk, 3, '10 9 9', '9 9 8');
  await expect(desk.getByTestId('match-over')).toContainText('Mara Thistle wins 6–0');
  await checkA11y(desk, 'judge: match over');
  await desk.getByRole('button', { name: 'Sign the match' }).click();
  await expect(desk.getByTestId('match-signed')).toContainText('waiting to reach the event server');

  // Reloaded offline: the card is still there, from the phone.
  await desk.reload();
  await expect(desk.getByTestId('match-end-3')).toContainText('waiting to sync');
  await expect(desk.getByTestId('match-signed')).toContainText('waiting to reach the event server');
  await shot(desk, 'judge-offline-reloaded');

  // Online: the changes reach the server, the match is signed and Mara is in the final.
  await desk.context().setOffline(false);
  await expect(desk.getByTestId('match-signed')).toContainText('Signed. The bracket has moved on.', {
    timeout: 30_000,
  });
  await expect(desk.getByTestId('match-end-1')).toContainText('synced');
  await shot(desk, 'judge-signed');
  const afterFirst = await (
    await request.get(`/api/events/${eventId}/brackets`, { headers: { Authorization: `Bearer ${judge}` } })
  ).json();
  const finalMatch = afterFirst.brackets[0].matches.find((m: { id: number }) => m.id === final);
  expect(finalMatch.sides.a.archers[0].name).toBe('Mara Thistle');

  // The other semi-final: 5–5, one arrow each, both 9, Oona's marked closer.
  await desk.getByRole('link', { name: '◂ Matches' }).click();
  await desk.getByTestId(`desk-match-${semi2}`).click();
  await enterEnd(desk, 1, '10 10 10', '9 9 9');
  await enterEnd(desk, 2, '9 9 9', '10 10 10');
  await enterEnd(desk, 3, '10 10 10', '9 9 9');
  await enterEnd(desk, 4, '9 9 9', '10 10 10');
  await expect(desk.getByTestId('outlook-a')).toContainText('A tied set means a shoot-off.');
  await enterEnd(desk, 5, '9 9 9', '9 9 9');
  const shootOff = desk.getByTestId('match-shoot-off');
  await expect(shootOff).toBeVisible();
  for (const v of ['9', '9']) await shootOff.getByRole('button', { name: `Arrow ${v}`, exact: true }).click();
  await checkA11y(desk, 'judge: shoot-off');
  await shot(desk, 'judge-shoot-off');
  await shootOff.getByRole('button', { name: 'Oona Brack closer' }).click();
  await expect(desk.getByTestId('match-over')).toContainText('Oona Brack wins 5–5 in the shoot-off');
  await desk.getByRole('button', { name: 'Sign the match' }).click();
  await expect(desk.getByTestId('match-signed')).toContainText('Signed. The bracket has moved on.', {
    timeout: 30_000,
  });
  await shot(desk, 'judge-shoot-off-signed');

  // The final is open on the judge's list with both archers.
  await desk.getByRole('link', { name: '◂ Matches' }).click();
  await expect(desk.getByTestId(`desk-match-${final}`)).toContainText(
    'Mara Thistle (1) against Oona Brack (3)',
  );
  await checkA11y(desk, 'judge: final open');
  await shot(desk, 'judge-final-open');

  // The organizer places the final on target 5 (free again), moves it to 7, and records Pim's
  // no-show in the bronze match: Nils goes through.
  const bronze = idOf(1, 0, true);
  await org.reload();
  const finalRow = part.getByTestId(`open-match-${final}`);
  await finalRow.getByRole('textbox', { name: /Target for/ }).fill('5');
  await finalRow.getByRole('button', { name: 'Place on target' }).click();
  await expect(finalRow).toContainText('on target 5');
  await finalRow.getByRole('textbox', { name: /Target for/ }).fill('7');
  await finalRow.getByRole('button', { name: 'Move' }).click();
  await expect(finalRow).toContainText('on target 7');
  const bronzeRow = part.getByTestId(`open-match-${bronze}`);
  await bronzeRow.getByText('Withdrawal or no-show').click();
  await bronzeRow.getByLabel('Who does not shoot').selectOption({ label: 'Pim Ledger (4)' });
  await bronzeRow.getByLabel('Why').selectOption('no-show');
  await checkA11y(org, 'eliminations: walkover');
  await bronzeRow.getByRole('button', { name: 'Record it: Nils Ashdown (2) goes through' }).click();
  await expect(part.getByTestId(`open-match-${bronze}`)).toHaveCount(0);
  await expect(finalRow).toBeVisible();
  await shot(org, 'organizer-final-placed');
});
