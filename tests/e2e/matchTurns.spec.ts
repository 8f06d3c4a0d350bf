import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { signedInPhone } from './support/signIn';
import { apiCall, qualificationWriters, setUpSmallEvent } from './support/smallEvent';

/*
 * Alternate shooting in the finals: the organizer sets the bracket's semi-finals and medal matches
 * to alternate; the upper line's archer joins the semi-final on the phone, is asked who shoots
 * first, picks the lower line's archer with no signal, and the pad shows whose arrow is next,
 * changing with every value entered, the arrow clock starting again for each arrow. The judge's
 * match card shows the same turn once the choice has synced.
 */

const ARCHERS = ['Mora Quint', 'Nell Ashby', 'Odo Ferris', 'Pim Harrow'];
const QUALIFICATION = [
  ['10', '10', '10'],
  ['10', '10', '9'],
  ['10', '9', '9'],
  ['9', '9', '9'],
];
const JUDGE = DEMO_JUDGES[0]!;
// Demo accounts the other browser tests do not sign in as.
const FIRST = demoArchers()[13]!;

async function shot(page: Page, name: string) {
  await page.screenshot({ path: `.tmp/screens/match-turns-${name}.png`, fullPage: true });
}

async function brackets(request: APIRequestContext, bearer: string, eventId: number) {
  const res = await request.get(`/api/events/${eventId}/brackets`, {
    headers: { Authorization: `Bearer ${bearer}` },
  });
  return (await res.json()).brackets;
}

async function tap(page: Page, value: string) {
  await page
    .getByRole('group', { name: 'Arrow values' })
    .getByRole('button', { name: `Arrow ${value}`, exact: true })
    .click();
}

test('an alternating semi-final: the writer picks who shoots first and the pad follows the turns', async ({
  browser,
  request,
}) => {
  test.setTimeout(150_000);
  const organizer = await token(request, DEMO_ORGANIZER.email);
  const judge = await token(request, JUDGE.email);
  const { eventId, divisionId, sessionId } = await setUpSmallEvent(
    request,
    { organizer, judge, judgeEmail: JUDGE.email },
    {
      name: 'Alternate finals',
      date: '2026-12-15',
      className: 'Dusk',
      sessionName: 'Qualification',
      roundId: 'match-turns-e2e',
      archers: ARCHERS,
    },
  );
  const { entries, writeEnds } = await qualificationWriters(
    request,
    { organizer, judge },
    sessionId,
    'match-turns',
    (name) => QUALIFICATION[ARCHERS.indexOf(name)]!,
  );
  await writeEnds(entries);
  const seedOne = entries.find((e) => e.name === ARCHERS[0])!.entry_id;
  await apiCall(request, organizer, 'patch', `/api/events/${eventId}/entries/${seedOne}`, {
    email: FIRST.email,
  });
  const made = await apiCall(request, organizer, 'post', `/api/events/${eventId}/brackets`, {
    sessionId,
    divisionId,
    size: 4,
  });
  const semi = (made.brackets[0].matches as { id: number; round: number; slot: number }[]).find(
    (m) => m.round === 0 && m.slot === 0,
  )!.id;

  // The organizer sets the bracket's semi-finals and medal matches to alternate.
  const org = await signedInPhone(browser, DEMO_ORGANIZER.email);
  await org.goto(`/events/${eventId}?part=eliminations`);
  const setting = org.getByLabel('Matches shot alternately');
  await expect(setting).toHaveValue('never');
  await setting.selectOption('semi-finals');
  await expect(setting).toBeEnabled();
  await expect(setting).toHaveValue('semi-finals');
  const code = (await org.getByTestId(`match-code-${semi}`).locator('span').innerText()).trim();
  await checkA11y(org, 'eliminations: matches shot alternately');
  await shot(org, 'organizer-setting');
  expect((await brackets(request, organizer, eventId))[0].alternate).toBe('semi-finals');

  // The upper line's archer joins and is asked who shoots first: two large keys.
  const pad = await signedInPhone(browser, FIRST.email);
  await pad.goto('/join/match');
  await pad.getByLabel('Match join code').fill(code);
  await pad.getByRole('button', { name: 'Join the match' }).click();
  const ask = pad.getByTestId('who-shoots-first');
  await expect(ask).toContainText('Who shoots first?');
  await expect(ask).toContainText('Mora Quint, the higher-ranked archer, decides');
  for (const name of [ARCHERS[0]!, ARCHERS[3]!]) {
    const box = await ask.getByRole('button', { name }).boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(44);
  }
  await expect(pad.getByRole('group', { name: 'Arrow values' })).toHaveCount(0);
  await checkA11y(pad, 'match pad: who shoots first');
  await shot(pad, 'who-shoots-first');

  // No signal at the target: the choice and the arrows wait in the outbox, the turns follow them.
  await pad.context().setOffline(true);
  // The lower line's archer starts; the turn changes with every value entered.
  await ask.getByRole('button', { name: ARCHERS[3]! }).click();
  const next = pad.getByTestId('next-arrow');
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[3]}`);
  await expect(pad.getByText(`${ARCHERS[3]} shoots first in end 1 (▲ waiting to sync).`)).toBeVisible();
  await pad.getByRole('button', { name: /Start the arrow clock/ }).click();
  await expect(pad.getByTestId('arrow-clock')).toContainText('s left for this arrow');
  await tap(pad, '9');
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[0]}`);
  // The clock starts again for the next archer's arrow.
  await expect(pad.getByTestId('arrow-clock')).toContainText(/^(20|19) s left for this arrow/);
  await tap(pad, '10');
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[3]}`);
  const draft = pad.getByTestId('match-draft');
  await expect(draft).toContainText(`${ARCHERS[0]}: 10 · ·`);
  await expect(draft).toContainText(`${ARCHERS[3]}: 9 · ·`);
  await checkA11y(pad, 'match pad: next arrow');
  await shot(pad, 'next-arrow');
  // An undo takes back the last arrow in turn.
  await pad.getByRole('button', { name: /Undo/ }).click();
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[0]}`);
  await expect(draft).toContainText(`${ARCHERS[3]}: 9 · ·`);
  for (const v of ['10', '8', '10', '9']) await tap(pad, v);
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[0]}`);
  await tap(pad, '10');
  // End 1 complete (Mora 30, Pim 26): the archer behind, Pim, starts end 2.
  await expect(pad.getByRole('heading', { name: 'Set 2' })).toBeVisible();
  await expect(next).toHaveText(`Next arrow: ${ARCHERS[3]}`);
  await pad.context().setOffline(false);

  // The judge's match card, once the choice reached the server: the same first shooter for end 1.
  await expect
    .poll(async () => {
      const now = await brackets(request, judge, eventId);
      return (now[0].matches as { id: number; firstShooter: string | null }[]).find((x) => x.id === semi)!
        .firstShooter;
    })
    .toBe('b');
  const desk = await signedInPhone(browser, JUDGE.email);
  await desk.goto(`/desk/${eventId}/matches/${semi}`);
  await expect(desk.getByTestId('next-arrow')).toHaveText(`Next arrow: ${ARCHERS[3]}`);
  await expect(desk.getByRole('button', { name: `${ARCHERS[0]} first instead` })).toBeVisible();
  await checkA11y(desk, 'judge: match card, next arrow');
  await shot(desk, 'judge-next-arrow');
});
