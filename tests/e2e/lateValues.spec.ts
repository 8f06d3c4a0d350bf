import { expect, test, type APIRequestContext } from '@playwright/test';
import { DEMO_JUDGES, DEMO_ORGANIZER, DEMO_PASSWORD, demoArchers } from '../../server/demo/demoPeople';
import { checkA11y } from './support/a11y';
import { readDemoDb, readDemoRows } from './support/demoDb';
import { signIn } from './support/fieldPhones';

/** A session of its own in the demo event (same divisions and rounds), laid out and with join codes. */
async function newSession(request: APIRequestContext): Promise<{ eventId: number; sessionId: number }> {
  const signIn = await request.post('/api/auth/sign-in', {
    data: { email: DEMO_ORGANIZER.email, password: DEMO_PASSWORD },
  });
  const headers = {
    Authorization: `Bearer ${((await signIn.json()) as { accessToken: string }).accessToken}`,
  };
  const { event_id: eventId } = readDemoDb<{ event_id: number }>(
    'select event_id from event_sessions limit 1',
  );
  const rounds = readDemoRows<{ division_id: number; round_id: string }>(
    'select distinct sd.division_id, sd.round_id from session_divisions sd join event_sessions s on s.id = sd.session_id where s.event_id = ?',
    eventId,
  ).map((r) => ({ divisionId: r.division_id, roundId: r.round_id }));
  const created = await request.post(`/api/events/${eventId}/sessions`, {
    headers,
    data: { name: `Evening ${Date.now() % 10_000}`, startsAt: '2026-12-12T18:00', rounds },
  });
  expect(created.status()).toBe(201);
  const sessionId = ((await created.json()) as { id: number }).id;
  expect(
    (await request.post(`/api/events/${eventId}/sessions/${sessionId}/assign`, { headers })).status(),
  ).toBe(200);
  return { eventId, sessionId };
}

test('a session closed while a phone is offline: its values wait for a judge, who accepts them', async ({
  browser,
  request,
}) => {
  test.setTimeout(180_000);
  const { eventId, sessionId } = await newSession(request);
  const { code } = readDemoDb<{ code: string }>(
    'select code from join_codes where session_id = ? and target_number = 1 and revoked_at is null',
    sessionId,
  );
  const sessionName = readDemoDb<{ name: string }>(
    'select name from event_sessions where id = ?',
    sessionId,
  ).name;

  // A writer joins target 1 and enters archer A's first end with no signal.
  const writer = await signIn(browser, demoArchers()[20]!.email);
  await writer.goto(`/join?code=${code}`);
  await checkA11y(writer, 'join');
  await writer.getByRole('radio', { name: /Writer 1/ }).check();
  await writer.getByRole('button', { name: 'Join target' }).click();
  await expect(writer.getByRole('heading', { name: /Target 1/ })).toBeVisible();
  await writer.context().setOffline(true);
  await writer.getByRole('tab', { name: /^A/ }).click();
  for (const v of ['10', '9', '9', '8', '7', '6'])
    await writer.getByRole('button', { name: `Arrow ${v}`, exact: true }).click();
  // A whole end moves the pad on to archer B: look at A again.
  await writer.getByRole('tab', { name: /^A/ }).click();
  await expect(writer.getByTestId('end-total')).toHaveText('49');

  // The organizer closes the session; before that, the server says target 1 has nothing whole yet.
  const organizer = await signIn(browser, DEMO_ORGANIZER.email);
  await organizer.goto(`/events/${eventId}?part=sessions`);
  const card = organizer.getByRole('listitem').filter({ hasText: sessionName });
  await card.getByRole('button', { name: 'Close session' }).click();
  const check = organizer.getByTestId('close-check');
  await expect(check).toContainText(/Target 1: \d+ ends not on the server from both writers/);
  await checkA11y(organizer, 'close check');
  await organizer.screenshot({ path: '.tmp/screens/close-check.png', fullPage: true });
  await check.getByRole('button', { name: 'Yes, close it' }).click();
  await expect(card.getByRole('button', { name: 'Reopen' })).toBeVisible();

  // Signal returns: the values are not refused but held, and the pad says they wait for a judge.
  await writer.context().setOffline(false);
  const held = writer.getByTestId('held-for-judge');
  await expect(held).toContainText('Waiting for a judge', { timeout: 30_000 });
  await expect(held).toContainText('End 1');
  await expect(writer.getByTestId('end-total')).toHaveText('49');
  await expect(writer.getByText('Not accepted by the event server')).toHaveCount(0);
  await checkA11y(writer, 'pad with values held');
  await writer.screenshot({ path: '.tmp/screens/pad-held.png', fullPage: true });

  // A judge accepts them on the desk.
  const judge = await signIn(browser, DEMO_JUDGES[1]!.email);
  await judge.goto(`/desk/${eventId}/${sessionId}`);
  const late = judge.getByTestId('late-1-1');
  await expect(late).toContainText('Writer 1');
  await expect(late).toContainText('10 9 9 8 7 6');
  await checkA11y(judge, 'desk with late values');
  await judge.screenshot({ path: '.tmp/screens/desk-late-values.png', fullPage: true });
  await late.getByRole('button', { name: /Accept/ }).click();
  await expect(judge.getByTestId('late-values')).toContainText(`accepted by ${DEMO_JUDGES[1]!.name}`);

  // The value now counts on the server, and the pad no longer shows it as waiting.
  const stored = readDemoDb<{ arrows_json: string }>(
    `select e.arrows_json from end_entries e join target_assignments t on t.entry_id = e.entry_id and t.session_id = e.session_id
     where e.session_id = ? and t.target_number = 1 and t.position = 'A' and e.end_index = 0 and e.slot = 1`,
    sessionId,
  );
  expect(JSON.parse(stored.arrows_json)).toEqual(['10', '9', '9', '8', '7', '6']);
  await expect(async () => {
    await writer.reload();
    await expect(writer.getByTestId('held-for-judge')).toHaveCount(0, { timeout: 3_000 });
  }).toPass({ timeout: 30_000 });
  await expect(writer.getByTestId('end-total')).toHaveText('49');
});
