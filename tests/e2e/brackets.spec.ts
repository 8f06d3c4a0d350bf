import { expect, test } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { token } from './support/apiPhone';
import { apiCall, qualificationWriters, setUpSmallEvent } from './support/smallEvent';

/*
 * A four-archer bracket seen on a spectator's phone: qualification shot through the field loop
 * (one end of a short custom round), the bracket seeded by the organizer, matches recorded and
 * signed by a judge through the API, the page showing scores, a shoot-off waiting for the judge,
 * the bracket moving on and the final places.
 */

const ARCHERS = ['Ines Arbour', 'Jonah Quill', 'Kit Fairway', 'Lena Marsh'];
const QUALIFICATION = [
  ['10', '10', '10'],
  ['10', '10', '9'],
  ['10', '9', '9'],
  ['9', '9', '9'],
];

test('a spectator follows a four-archer bracket to its final places on a phone', async ({
  browser,
  request,
}) => {
  test.setTimeout(120_000);
  const organizer = await token(request, DEMO_ORGANIZER.email);
  const judge = await token(request, DEMO_JUDGES[1]!.email);

  // The organizer sets up a small event: one division, a one-end round, four archers.
  const { eventId, divisionId, sessionId } = await setUpSmallEvent(
    request,
    { organizer, judge, judgeEmail: DEMO_JUDGES[1]!.email },
    {
      name: 'Bracket evening',
      date: '2026-12-12',
      className: 'Evening',
      sessionName: 'Evening qualification',
      roundId: 'bracket-e2e',
      archers: ARCHERS,
    },
  );
  await apiCall(request, organizer, 'patch', `/api/events/${eventId}/results-settings`, { published: true });

  // Two writers enter each archer's end, the same values: agreed ends make the standings.
  const { entries, writeEnds } = await qualificationWriters(
    request,
    { organizer, judge },
    sessionId,
    'bracket',
    (name) => QUALIFICATION[ARCHERS.indexOf(name)]!,
  );
  await writeEnds(entries);

  // Seeded 1 Ines … 4 Lena; semi-finals 1–4 and 2–3.
  let body = await apiCall(request, organizer, 'post', `/api/events/${eventId}/brackets`, {
    sessionId,
    divisionId,
    size: 'everyone',
  });
  const match = (round: number, slot: number, bronze = false) =>
    (body.brackets[0].matches as { id: number; round: number; slot: number; bronze: boolean }[]).find(
      (m) => m.round === round && m.slot === slot && m.bronze === bronze,
    )!.id;
  const sets = async (id: number, list: [string, string][]) => {
    for (const [i, [a, b]] of list.entries())
      body = await apiCall(request, judge, 'put', `/api/events/${eventId}/matches/${id}/ends/${i}`, {
        a: a.split(' '),
        b: b.split(' '),
      });
  };
  const straight: [string, string][] = Array.from({ length: 3 }, () => ['10 10 10', '9 9 9']);
  await sets(match(0, 0), straight);
  body = await apiCall(request, judge, 'post', `/api/events/${eventId}/matches/${match(0, 0)}/sign`, {});
  await sets(match(0, 1), [
    ['10 10 10', '9 9 9'],
    ['9 9 9', '10 10 10'],
    ['10 10 10', '9 9 9'],
    ['9 9 9', '10 10 10'],
    ['9 9 9', '9 9 9'],
  ]);
  body = await apiCall(request, judge, 'put', `/api/events/${eventId}/matches/${match(0, 1)}/shoot-off`, {
    a: { value: '10' },
    b: { value: '10' },
  });

  // A spectator, signed in nowhere, opens the brackets from the public results page.
  const page = await (await browser.newContext()).newPage();
  await page.goto(`/results/${eventId}`);
  await page.getByRole('link', { name: 'Eliminations' }).click();
  await expect(page.getByRole('heading', { name: 'Eliminations', level: 1 })).toBeVisible();
  const semi = page.getByTestId(`match-${match(0, 0)}`);
  await expect(semi.getByTestId('side-a')).toContainText('Ines Arbour');
  await expect(semi.getByTestId('side-a')).toContainText('won');
  await expect(semi.getByTestId('side-a')).toContainText('6');
  await expect(page.getByTestId(`match-${match(0, 1)}`)).toContainText(
    'Shoot-off: the judge decides which arrow is closer',
  );
  await expect(page.getByTestId(`match-${match(1, 0)}`).getByTestId('side-a')).toContainText('Ines Arbour');
  await checkA11y(page, 'brackets (phone)');
  await page.screenshot({ path: '.tmp/screens/brackets-semis.png', fullPage: true });

  // The field screen on a projector cycles from the standings to the bracket's current round.
  const projector = await (await browser.newContext({ viewport: { width: 1920, height: 1080 } })).newPage();
  await projector.goto(`/results/${eventId}/field?seconds=3`);
  // The standings come first.
  await expect(projector.getByTestId('field-division')).toBeVisible();
  await expect(projector.getByTestId('field-division')).not.toContainText('eliminations');
  await expect(projector.getByText('Ines Arbour')).toBeVisible();
  await checkA11y(projector, 'field screen standings (1080p)');
  await projector.screenshot({ path: '.tmp/screens/field-standings.png' });
  await expect(projector.getByTestId('field-division')).toContainText('eliminations', { timeout: 10_000 });
  const fieldSemi = projector.getByTestId(`field-match-${match(0, 0)}`);
  await expect(fieldSemi.getByTestId('field-side-a')).toContainText('Ines Arbour');
  await expect(fieldSemi.getByTestId('field-side-a')).toContainText('won');
  await expect(fieldSemi.getByTestId('field-side-a')).toContainText('6');
  await expect(projector.getByTestId(`field-match-${match(0, 1)}`)).toContainText(
    'Shoot-off: the judge decides which arrow is closer',
  );
  await expect(projector.getByText('Semi-finals · set points')).toBeVisible();
  await checkA11y(projector, 'field screen bracket (1080p)');
  await projector.screenshot({ path: '.tmp/screens/field-bracket-semis.png' });

  // The judge marks Kit's arrow closer and signs; the final and bronze are shot; places follow.
  body = await apiCall(request, judge, 'put', `/api/events/${eventId}/matches/${match(0, 1)}/shoot-off`, {
    a: { value: '10' },
    b: { value: '10', closer: true },
  });
  body = await apiCall(request, judge, 'post', `/api/events/${eventId}/matches/${match(0, 1)}/sign`, {});
  await sets(match(1, 0), straight);
  body = await apiCall(request, judge, 'post', `/api/events/${eventId}/matches/${match(1, 0)}/sign`, {});
  body = await apiCall(
    request,
    organizer,
    'post',
    `/api/events/${eventId}/matches/${match(1, 0, true)}/walkover`,
    {
      side: 'b',
      reason: 'no-show',
    },
  );
  await page.reload();
  const places = page.getByTestId('final-places');
  await expect(places).toContainText('1. Ines Arbour');
  await expect(places).toContainText('2. Kit Fairway');
  await expect(places).toContainText('3. Lena Marsh');
  await expect(places).toContainText('4. Jonah Quill');
  await expect(page.getByTestId(`match-${match(1, 0, true)}`)).toContainText('Walkover (no-show)');
  await checkA11y(page, 'brackets with final places (phone)');
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Print the brackets (PDF)' }).click();
  expect((await download).suggestedFilename()).toBe(`eliminations-${eventId}.pdf`);
  await page.screenshot({ path: '.tmp/screens/brackets-places.png', fullPage: true });

  // Every match decided: the field screen shows the final places instead of a round.
  await projector.reload();
  await expect(projector.getByTestId('field-places')).toBeVisible({ timeout: 10_000 });
  const fieldPlaces = projector.getByTestId('field-places');
  await expect(fieldPlaces.getByRole('listitem')).toHaveText([
    /^1\.\s*Ines Arbour/,
    /^2\.\s*Kit Fairway/,
    /^3\.\s*Lena Marsh/,
    /^4\.\s*Jonah Quill/,
  ]);
  await checkA11y(projector, 'field screen final places (1080p)');
  await projector.screenshot({ path: '.tmp/screens/field-bracket-places.png' });
});
