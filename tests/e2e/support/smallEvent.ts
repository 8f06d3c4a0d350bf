import { expect, type APIRequestContext } from '@playwright/test';
import { apiPhone } from './apiPhone';
import { readDemoRows } from './demoDb';
import { operatorMailTo } from './operatorMail';

/** One API call with a bearer token, failing the test with the answer when it is refused. */
export async function apiCall(
  request: APIRequestContext,
  bearer: string,
  method: 'post' | 'put' | 'patch',
  path: string,
  data: object,
) {
  const res = await request[method](path, { headers: { Authorization: `Bearer ${bearer}` }, data });
  expect(res.status(), `${method} ${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json();
}

/** A one-end recurve round of 3 arrows at 18 m, so a qualification is one push per writer. */
export const oneEndRound = (id: string) => ({
  id,
  name: 'One end',
  venue: 'outdoor',
  distances: [
    { label: '18 m', distanceM: 18, faceId: 'full-122', arrows: 3, arrowsPerEnd: 3, secondsPerEnd: 120 },
  ],
  bowStyles: ['recurve'],
});

/**
 * A small event of its own, built through the API (so no other spec's data is touched): the
 * demo judge invited and accepted from the mail, one recurve division, one session of a one-end
 * round, the archers entered, targets assigned and join codes made.
 */
export async function setUpSmallEvent(
  request: APIRequestContext,
  people: { organizer: string; judge: string; judgeEmail: string },
  spec: {
    name: string;
    date: string;
    className: string;
    sessionName: string;
    roundId: string;
    archers: string[];
  },
) {
  const { organizer, judge, judgeEmail } = people;
  const event = await apiCall(request, organizer, 'post', '/api/events', {
    name: `${spec.name} ${Date.now() % 10_000}`,
    startsOn: spec.date,
    endsOn: spec.date,
    timeZone: 'UTC',
  });
  const eventId = event.id as number;
  await apiCall(request, organizer, 'post', `/api/events/${eventId}/staff`, {
    email: judgeEmail,
    role: 'judge',
  });
  const invitation = await operatorMailTo(request, judgeEmail, new RegExp(event.name as string));
  const inviteToken = decodeURIComponent(/invite\?token=([^\s]+)/.exec(invitation.text)![1]!);
  await apiCall(request, judge, 'post', '/api/invitations/accept', { token: inviteToken });
  const division = await apiCall(request, organizer, 'post', `/api/events/${eventId}/divisions`, {
    bowStyle: 'recurve',
    className: spec.className,
  });
  const session = await apiCall(request, organizer, 'post', `/api/events/${eventId}/sessions`, {
    name: spec.sessionName,
    startsAt: `${spec.date}T09:00`,
    rounds: [{ divisionId: division.id, customRound: oneEndRound(spec.roundId) }],
  });
  const sessionId = session.id as number;
  for (const name of spec.archers)
    await apiCall(request, organizer, 'post', `/api/events/${eventId}/entries`, {
      name,
      divisionId: division.id,
    });
  await apiCall(request, organizer, 'post', `/api/events/${eventId}/sessions/${sessionId}/assign`, {});
  await apiCall(request, organizer, 'post', `/api/events/${eventId}/sessions/${sessionId}/join-codes`, {});
  return { eventId, divisionId: division.id as number, sessionId };
}

/**
 * The two writers of a small event's qualification, on phones driven through the API (the
 * organizer as writer 1, the judge as writer 2, on every target): `writeEnds` writes the one end
 * of the given archers alike on both, so it is agreed.
 */
export async function qualificationWriters(
  request: APIRequestContext,
  people: { organizer: string; judge: string },
  sessionId: number,
  phoneName: string,
  arrowsOf: (archerName: string) => string[],
) {
  const entries = readDemoRows<{ entry_id: number; name: string }>(
    `select t.entry_id, e.name from target_assignments t join entries e on e.id = t.entry_id
     where t.session_id = ? order by e.name`,
    sessionId,
  );
  const codes = readDemoRows<{ code: string }>(
    'select code from join_codes where session_id = ? and revoked_at is null',
    sessionId,
  );
  const writers = ([1, 2] as const).map((slot) => ({
    slot,
    phone: apiPhone(request, slot === 1 ? people.organizer : people.judge, `${phoneName}-w${slot}`),
  }));
  for (const { slot, phone } of writers) for (const c of codes) await phone.join(c.code, `writer${slot}`);
  const writeEnds = async (list: typeof entries) => {
    for (const { slot, phone } of writers)
      await phone.push(
        list.map((a) => ({
          kind: 'end.write',
          args: { sessionId, entryId: a.entry_id, endIndex: 0, slot, arrows: arrowsOf(a.name), flags: [] },
        })),
      );
  };
  return { entries, writeEnds };
}
