import type { NetworkInterfaceInfo } from 'node:os';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resolveLinkAddress } from '../../server/linkAddress';
import { waitForMail } from './support/mail';
import { startTestServer, TEST_LINK_ADDRESS, type TestServer } from './support/testServer';
import { setUpEvent } from './support/eventSetup';

const nic = (address: string, internal: boolean, family: 'IPv4' | 'IPv6' = 'IPv4') =>
  ({ address, internal, family, netmask: '', mac: '', cidr: null }) as NetworkInterfaceInfo;
const lo = { lo: [nic('127.0.0.1', true), nic('::1', true, 'IPv6')] };

describe('the address links use', () => {
  it('is PUBLIC_URL when set (without a trailing slash)', () => {
    expect(
      resolveLinkAddress({ publicUrl: 'https://scores.example.org/', host: '0.0.0.0', port: 3000 }, lo),
    ).toEqual({ url: 'https://scores.example.org', from: 'PUBLIC_URL', phonesCanOpen: true });
    expect(
      resolveLinkAddress({ publicUrl: 'http://localhost:3000', host: '0.0.0.0', port: 3000 }, lo)
        .phonesCanOpen,
    ).toBe(false);
  });

  it("is this machine's first address on the local network, never loopback, when the server listens on all", () => {
    const interfaces = {
      ...lo,
      eth0: [nic('fe80::1', false, 'IPv6'), nic('192.168.1.20', false)],
      wlan0: [nic('10.0.0.5', false)],
    };
    expect(resolveLinkAddress({ publicUrl: undefined, host: '0.0.0.0', port: 3000 }, interfaces)).toEqual({
      url: 'http://192.168.1.20:3000',
      from: 'network',
      phonesCanOpen: true,
    });
  });

  it('is flagged when phones cannot open it: no network at all, or the server listens on loopback only', () => {
    expect(resolveLinkAddress({ publicUrl: undefined, host: '0.0.0.0', port: 3000 }, lo)).toEqual({
      url: 'http://localhost:3000',
      from: 'none',
      phonesCanOpen: false,
    });
    expect(resolveLinkAddress({ publicUrl: undefined, host: '127.0.0.1', port: 4000 }, lo)).toEqual({
      url: 'http://127.0.0.1:4000',
      from: 'HOST',
      phonesCanOpen: false,
    });
    expect(
      resolveLinkAddress({ publicUrl: undefined, host: '192.168.1.20', port: 80 }, lo).phonesCanOpen,
    ).toBe(true);
  });
});

describe('a forged Host header never reaches a mail or a printout', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(async () => {
    await server.close();
  });
  const FORGED = 'evil.example';
  const forged = { Host: FORGED, 'X-Forwarded-Host': FORGED, 'X-Forwarded-Proto': 'https' };

  it('invitation mail', async () => {
    const setup = await setUpEvent(server.app, server.db);
    const to = `forged.invite.${Date.now()}@example.org`;
    const res = await request(server.app)
      .post(`/api/events/${setup.eventId}/staff`)
      .set(setup.organizer.auth)
      .set(forged)
      .send({ email: to, role: 'judge' });
    expect(res.status).toBe(201);
    const mail = await waitForMail(server.db, to);
    expect(mail.text_body).toContain(`${TEST_LINK_ADDRESS.url}/invite?token=`);
    expect(mail.raw).not.toContain(FORGED);
  });

  it('confirmation mail, at sign-up and sent again', async () => {
    const email = `forged.verify.${Date.now()}@example.org`;
    const signUp = await request(server.app)
      .post('/api/auth/sign-up')
      .set(forged)
      .send({ email, password: 'correct horse battery', displayName: 'Forged Host' });
    expect(signUp.status).toBe(201);
    await waitForMail(server.db, email);
    await request(server.app)
      .post('/api/me/send-verification')
      .set('Authorization', `Bearer ${signUp.body.accessToken}`)
      .set(forged)
      .expect(202);
    let mails = await server.db('caught_mail').where({ mail_to: email });
    for (let i = 0; i < 100 && mails.length < 2; i += 1) {
      await new Promise((r) => setTimeout(r, 50));
      mails = await server.db('caught_mail').where({ mail_to: email });
    }
    expect(mails.length).toBe(2);
    for (const m of mails) {
      expect(m.text_body).toContain(`${TEST_LINK_ADDRESS.url}/verify-email?token=`);
      expect(m.raw).not.toContain(FORGED);
    }
  });

  it('the join links of the printed targets, with the address they use', async () => {
    const setup = await setUpEvent(server.app, server.db, [{ bowStyle: 'recurve', className: 'Women' }]);
    const divisionId = setup.divisions['Recurve Women']!;
    await setup.api('post', '/entries', { name: 'Forged Host Archer', divisionId });
    const sessionId = (
      await setup.api('post', '/sessions', {
        name: 'Morning',
        startsAt: '2026-12-12T09:00',
        rounds: [{ divisionId, roundId: '70m' }],
      })
    ).body.id;
    await setup.api('post', `/sessions/${sessionId}/assign`, {});
    const list = await request(server.app)
      .get(`/api/events/${setup.eventId}/sessions/${sessionId}/targets`)
      .set(setup.organizer.auth)
      .set(forged);
    expect(list.status).toBe(200);
    expect(list.body.targets[0].joinCode.joinUrl).toMatch(
      new RegExp(`^${TEST_LINK_ADDRESS.url}/join\\?code=`),
    );
    expect(list.body.linkAddress).toEqual(TEST_LINK_ADDRESS);
    expect(list.text).not.toContain(FORGED);
  });
});
