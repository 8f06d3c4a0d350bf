import { expect, test, type Page } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { signedInPhone } from './support/signIn';
import { apiCall, qualificationWriters, setUpSmallEvent } from './support/smallEvent';

/*
 * Two writers at a match's target: the two archers of a semi-final join it with the match's code
 * on their own phones and write both lines' arrows each end with the pad's keys. An end they wrote
 * alike counts; one they wrote differently goes to the judge's match card, where the judge settles
 * it. The judge signs a set, then the match, both archers countersign, and the winner moves on to
 * the final.
 */

const ARCHERS = ['Ilse Quarry', 'Jory Pellam', 'Kes Marlow', 'Lio Fenwick'];
const QUALIFICATION = [
  ['10', '10', '10'],
  ['10', '10', '9'],
  ['10', '9', '9'],
  ['9', '9', '9'],
];
const JUDGE = DEMO_JUDGES[1]!;
// Demo accounts the other browser tests do not sign in as.
const [FIRST, FOURTH] = [demoArchers()[7]!, demoArchers()[8]!];

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `.tmp/screens/match-writers-${name}.png`, fullPage: true });
}

/** Taps one end on a writer's pad: the upper line's three arrows, then the lower line's. */
async function tapEnd(page: Page, values: string) {
  const keys = page.getByRole('group', { name: 'Arrow values' });
  for (const v of values.split(' '))
    await keys.getByRole('button', { name: `Arrow ${v}`, exact: true }).click();
}

test('two archers score their match on their phones, the judge settles a mismatch, signs, and both countersign', async ({
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
      name: 'Match writers',
      date: '2026-12-14',
      className: 'Evening',
      sessionName: 'Qualification',
      roundId: 'match-writers-e2e',
      archers: ARCHERS,
    },
  );
  const { entries, writeEnds } = await qualificationWriters(
    request,
    { organizer, judge },
    sessionId,
    'match-writers',
    (name) => QUALIFICATION[ARCHERS.indexOf(name)]!,
  );
  await writeEnds(entries);
  // Seeds 1 and 4 have accounts: their entries carry their addresses.
  for (const [name, archer] of [
    [ARCHERS[0]!, FIRST],
    [ARCHERS[3]!, FOURTH],
  ] as const) {
    const entryId = entries.find((e) => e.name === name)!.entry_id;
    await apiCall(request, organizer, 'patch', `/api/events/${eventId}/entries/${entryId}`, {
      email: archer.email,
    });
  }
  const made = await apiCall(request, organizer, 'post', `/api/events/${eventId}/brackets`, {
    sessionId,
    divisionId,
    size: 4,
  });
  type M = { id: number; round: number; slot: number; bronze: boolean };
  const matches = made.brackets[0].matches as M[];
  const semi = matches.find((m) => m.round === 0 && m.slot === 0)!.id;
  const final = matches.find((m) => m.round === 1 && !m.bronze)!.id;

  // The organizer's eliminations show the match's join code.
  const org = await signedInPhone(browser, DEMO_ORGANIZER.email);
  await org.goto(`/events/${eventId}?part=eliminations`);
  const codeLine = org.getByTestId(`match-code-${semi}`);
  await expect(codeLine).toBeVisible();
  const code = (await codeLine.locator('span').innerText()).trim();
  expect(code).toMatch(/^[A-Z0-9]{6}$/);
  // A scorer is named by the e-mail of an account: an address without one is refused in words.
  const other = org.getByTestId(`open-match-${matches.find((m) => m.round === 0 && m.slot === 1)!.id}`);
  await other.getByText('Scorers instead of the archers').click();
  await other.getByLabel('Scorer’s e-mail').fill('nobody@ringcall.example');
  await other.getByRole('button', { name: 'Name the scorer' }).click();
  await expect(other).toContainText('No account has the email nobody@ringcall.example');
  await checkA11y(org, 'eliminations: match join code');
  await shot(org, 'organizer-code');

  // Both archers join on their own phones.
  const pads: Page[] = [];
  for (const archer of [FIRST, FOURTH]) {
    const page = await signedInPhone(browser, archer.email);
    await page.goto('/join');
    await page.getByRole('link', { name: /Join it with the match’s code/ }).click();
    await page.getByLabel('Match join code').fill(code.toLowerCase());
    if (pads.length === 0) {
      await checkA11y(page, 'join your match');
      await shot(page, 'join-match');
    }
    await page.getByRole('button', { name: 'Join the match' }).click();
    await expect(page.getByRole('heading', { name: 'Match pad' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Set 1' })).toBeVisible();
    // Scoring happens here: the range cautions are shown, deferring to the judges.
    await expect(page.getByRole('complementary', { name: 'Range safety' })).toContainText(
      "The event's judges and the governing body's rules always decide.",
    );
    pads.push(page);
  }
  const [padA, padB] = pads as [Page, Page];
  await checkA11y(padA, 'match pad');
  const key = await padA.getByRole('button', { name: 'Arrow 10', exact: true }).boundingBox();
  expect(key!.height).toBeGreaterThanOrEqual(44);

  // End 1: written alike (in another order on the second phone): it counts.
  await tapEnd(padA, '10 10 10 9 9 9');
  await tapEnd(padB, '10 10 10 9 9 9');
  for (const pad of pads) {
    await expect(pad.getByTestId('writer-end-1')).toContainText('Both writers agree', { timeout: 30_000 });
    // In the set system each end is a set, as on the card's table.
    await expect(pad.getByTestId('writer-end-1')).toContainText('Set 1: ');
    await expect(pad.getByTestId('score-a')).toContainText('2');
  }
  await shot(padA, 'pad-end-1-agreed');

  // End 2: the second writer has a 9 where the first has a 10: the judge is asked.
  await tapEnd(padA, '10 10 10 9 9 9');
  await tapEnd(padB, '10 10 9 9 9 9');
  await expect(padA.getByTestId('writer-end-2')).toContainText('The writers differ: sent to the judge', {
    timeout: 30_000,
  });
  await checkA11y(padA, 'match pad: mismatch');
  await shot(padA, 'pad-end-2-mismatch');

  const desk = await signedInPhone(browser, JUDGE.email);
  await desk.goto(`/desk/${eventId}/matches/${semi}`);
  const differ = desk.getByTestId('differ-end-2');
  await expect(differ).toContainText('Writer 1');
  await expect(differ).toContainText('(differs)');
  await checkA11y(desk, 'judge: writers differ');
  await shot(desk, 'judge-writers-differ');
  await differ.getByRole('button', { name: 'Writer 1 is right' }).click();
  await expect(desk.getByTestId('writers-differ')).toHaveCount(0, { timeout: 30_000 });
  await expect(desk.getByTestId('score-a')).toContainText('4', { timeout: 30_000 });
  await expect(padB.getByTestId('writer-end-2')).toContainText('Settled by the judge', { timeout: 30_000 });

  // The judge signs set 1 on the match card; the writers' pads say so.
  const ends = desk.getByTestId('match-ends');
  const signKey = await ends.getByRole('button', { name: 'Sign set 1' }).boundingBox();
  expect(signKey!.height).toBeGreaterThanOrEqual(44);
  await ends.getByRole('button', { name: 'Sign set 1' }).click();
  await expect(desk.getByTestId('end-signature-1')).toContainText('✓ signed by the judge', {
    timeout: 30_000,
  });
  await expect(ends.getByRole('button', { name: 'Sign set 1' })).toHaveCount(0);
  await expect(ends.getByRole('button', { name: 'Sign set 2' })).toBeVisible();
  await checkA11y(desk, 'judge: set 1 signed');
  await shot(desk, 'judge-set-1-signed');
  await expect(padA.getByTestId('writer-end-1')).toContainText('signed by the judge', { timeout: 30_000 });
  await shot(padA, 'pad-set-1-signed');

  // End 3 alike: the match is over; the judge signs.
  await tapEnd(padA, '10 9 9 9 9 8');
  await tapEnd(padB, '9 10 9 8 9 9');
  await expect(desk.getByTestId('match-over')).toContainText('Ilse Quarry wins 6–0', { timeout: 30_000 });
  await desk.getByRole('button', { name: 'Sign the match' }).click();
  await expect(desk.getByTestId('match-signed')).toContainText('Signed. The bracket has moved on.', {
    timeout: 30_000,
  });

  // Both archers countersign after the judge.
  for (const pad of pads) {
    const over = pad.getByTestId('match-over');
    await expect(over.getByTestId('judge-signed')).toBeVisible({ timeout: 30_000 });
    await over.getByRole('button', { name: 'Countersign the match card' }).click();
    await expect(over).toContainText('You countersigned', { timeout: 30_000 });
  }
  await expect(padA.getByTestId('countersigned-by')).toContainText('Ilse Quarry and Lio Fenwick', {
    timeout: 30_000,
  });
  await checkA11y(padA, 'match pad: countersigned');
  await shot(padA, 'pad-countersigned');

  // The bracket moved on: the winner is in the final, the card shows both countersignatures.
  const after = await (
    await request.get(`/api/events/${eventId}/brackets`, { headers: { Authorization: `Bearer ${judge}` } })
  ).json();
  const all = after.brackets[0].matches as (M & {
    sides: { a?: { archers: { name: string }[] } };
    countersignedBy: number[];
  })[];
  expect(all.find((m) => m.id === final)!.sides.a!.archers[0]!.name).toBe('Ilse Quarry');
  expect(all.find((m) => m.id === semi)!.countersignedBy).toHaveLength(2);
});
