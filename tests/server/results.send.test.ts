import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { agreeEnds, setUpJudging, twelveEnds, type JudgingField } from './support/judging';
import { waitForMail } from './support/mail';
import { TEST_LINK_ADDRESS, startTestServer, type TestServer } from './support/testServer';

let server: TestServer;
let j: JudgingField;
const BEA_EMAIL = 'bea.quill@ringcall.example';

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  // Ada has an address (set up with her account); Bea gets one on her entry; the others have none.
  await server
    .db('entries')
    .where({ id: j.field.archer(1, 'B').entryId })
    .update({ email: BEA_EMAIL });
  await agreeEnds(j, j.ada.entryId, twelveEnds());
});
afterAll(() => server.close());

const send = (auth = j.field.organizer.auth, body: object = {}) =>
  request(server.app).post(`/api/events/${j.field.eventId}/results/send`).set(auth).send(body);
const publish = (published: boolean) =>
  request(server.app)
    .patch(`/api/events/${j.field.eventId}/results-settings`)
    .set(j.field.organizer.auth)
    .send({ published });

describe('send results', () => {
  it('is for the event’s organizers only', async () => {
    expect(
      (await request(server.app).post(`/api/events/${j.field.eventId}/results/send`).send({})).status,
    ).toBe(401);
    for (const who of [j.field.judge, j.people.ada, j.people.stranger]) {
      const res = await send(who.auth);
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/Only an event organizer/);
    }
    expect((await send(j.field.organizer.auth, { everyone: true })).status).toBe(400);
  });

  it('waits until the results are published, since the mail links to the public page', async () => {
    const res = await send();
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Publish the results first/);
    expect(await server.db('caught_mail')).toHaveLength(0);
  });

  it('mails each entrant with an address their own place and the link to the page', async () => {
    expect((await publish(true)).status).toBe(200);
    const res = await send();
    expect(res.status).toBe(200);
    // Six archers on the field: Ada and Bea have an address.
    expect(res.body).toEqual({ sent: 2, withoutAddress: 4, failed: 0 });
    const ada = await waitForMail(server.db, j.ada.email);
    expect(ada.subject).toMatch(/^Results: /);
    expect(ada.text_body).toMatch(/Hello Ada Fletcher/);
    expect(ada.text_body).toMatch(/Qualification, Recurve Women: place 1 of 3, total \d+ \(provisional/);
    expect(ada.text_body).toContain(`${TEST_LINK_ADDRESS.url}/results/${j.field.eventId}`);
    const bea = await waitForMail(server.db, BEA_EMAIL);
    expect(bea.text_body).toMatch(/Hello Bea Quill/);
    expect(bea.text_body).toMatch(/Recurve Women: shared place 2 of 3, total 0/);
  });

  it('allows a few sends an hour per event, then says when to send again', async () => {
    expect((await send()).status).toBe(200);
    expect((await send()).status).toBe(200);
    const fourth = await send();
    expect(fourth.status).toBe(429);
    expect(fourth.body.error.message).toMatch(
      /went to its archers 3 times in the last hour. Send them again in/,
    );
    // The catcher stores mail as it arrives: three sends, three mails, none for the refused fourth.
    await expect
      .poll(async () => (await server.db('caught_mail').where({ mail_to: BEA_EMAIL })).length)
      .toBe(3);
  });
});
