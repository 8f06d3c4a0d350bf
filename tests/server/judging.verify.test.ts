import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { CompactSign, compactVerify, createLocalJWKSet, generateKeyPair, type JSONWebKeySet } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CardView, VerifyResult } from '../../src/contract/judging';
import { startTestServer, TEST_LINK_ADDRESS, type TestServer } from './support/testServer';
import { waitForMail } from './support/mail';
import {
  ADA_EMAIL,
  agreeEnds,
  expectApplied,
  pushOne,
  setUpJudging,
  signEnds,
  twelveEnds,
  type JudgingField,
} from './support/judging';
import { sendFinalCard, mailFinalCards } from '../../server/services/judging/finalCard';
import { SIGNING_KEY_FILE, loadSigningKeys } from '../../server/services/signing/serverKeys';

/*
 * Signatures that can be checked: the server signs ends and cards with its own key (ES256),
 * publishes the public key, and verification recomputes the signed content from the database
 * as it is now, so any change after signing shows. The final card is mailed as a PDF with the
 * verification link.
 */

let server: TestServer;
let j: JudgingField;
let total: number;
let archerJws: string;
let endJws: string;
const PHONE_AT = '2026-01-01T08:00:00.000Z';

const verify = async (sig: string): Promise<VerifyResult> => {
  const res = await request(server.app).get('/api/verify').query({ sig });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as VerifyResult;
};
const card = async (): Promise<CardView> =>
  (await request(server.app).get(`/api/cards/${j.sessionId}/${j.ada.entryId}`).set(j.people.ada.auth)).body;

beforeAll(async () => {
  server = await startTestServer();
  j = await setUpJudging(server);
  await agreeEnds(j, j.ada.entryId, twelveEnds());
  expectApplied(await signEnds(server, j, j.ada.entryId, [...Array(12).keys()]));
  total = (await card()).totals.total;
  const sign = (role: 'archer' | 'scorer') => ({
    sessionId: j.sessionId,
    entryId: j.ada.entryId,
    role,
    total,
  });
  // Ada's phone clock is wrong: the signature keeps it, labelled, beside the server's time.
  expectApplied([await pushOne(j.phones.ada, { ...j.phones.ada.signCard(sign('archer')), at: PHONE_AT })]);
  expectApplied([await pushOne(j.phones.writer2, j.phones.writer2.signCard(sign('scorer')))]);
  const view = await card();
  archerJws = view.signatures.find((s) => s.role === 'archer')!.jws;
  endJws = (await server.db('end_signatures').where({ entry_id: j.ada.entryId, end_index: 4 }).first()).jws;
});
afterAll(async () => {
  await server.close();
});

describe('the public key', () => {
  it('is published at /.well-known/jwks.json, public, cached for an hour, and checks the signatures', async () => {
    const res = await request(server.app).get('/.well-known/jwks.json');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=3600');
    const jwks = res.body as JSONWebKeySet;
    expect(jwks.keys).toHaveLength(1);
    expect(jwks.keys[0]).toMatchObject({ kty: 'EC', crv: 'P-256', alg: 'ES256', use: 'sig' });
    expect(jwks.keys[0]).not.toHaveProperty('d');
    const keySet = createLocalJWKSet(jwks);
    for (const jws of [archerJws, endJws]) {
      const { payload, protectedHeader } = await compactVerify(jws, keySet);
      expect(protectedHeader).toMatchObject({ alg: 'ES256', kid: jwks.keys[0]!.kid });
      expect(JSON.parse(new TextDecoder().decode(payload))).toHaveProperty('hash');
    }
  });
});

describe('the signing key', () => {
  it('is kept in the data folder (owner only) or given as SIGNING_KEY_JWK, and a bad one stops the start', async () => {
    const file = join(server.dir, SIGNING_KEY_FILE);
    expect(statSync(file).mode & 0o077).toBe(0);
    const fromEnv = await loadSigningKeys('/nonexistent', readFileSync(file, 'utf8'));
    expect(fromEnv.kid).toBe(server.signingKeys.kid);
    await expect(loadSigningKeys(server.dir, '{not json')).rejects.toThrow(
      /SIGNING_KEY_JWK is not valid JSON/,
    );
    await expect(loadSigningKeys(server.dir, JSON.stringify(fromEnv.publicJwk))).rejects.toThrow(
      /must be a private EC P-256 key/,
    );
  });
});

describe('verification', () => {
  it('a countersigned card verifies as unchanged, with its totals and signers', async () => {
    const result = await verify(archerJws);
    expect(result).toMatchObject({
      signatureValid: true,
      kind: 'card',
      unchanged: true,
      superseded: false,
      event: 'Field Shoot',
      archer: 'Ada Fletcher',
      division: 'Recurve Women',
      totals: { total },
    });
    if (!result.signatureValid) throw new Error('unreachable');
    expect(result.message).toMatch(/unchanged since it was signed/);
    expect(result.signers).toEqual([
      { name: 'Ada Fletcher', role: 'archer' },
      { name: 'Wyn Two', role: 'scorer' },
      { name: 'Field Judge', role: 'judge' },
    ]);
    expect(await verify(endJws)).toMatchObject({ signatureValid: true, kind: 'end', unchanged: true });
  });

  it('shows a card as changed when one arrow is changed in the database after signing', async () => {
    const where = { entry_id: j.ada.entryId, end_index: 4 };
    const signed = await server.db('end_signatures').where(where).first();
    await server
      .db('end_signatures')
      .where({ id: signed.id })
      .update({ arrows_json: '["X","10","9","9","8","8"]' });
    const changed = await verify(archerJws);
    expect(changed).toMatchObject({ signatureValid: true, unchanged: false, superseded: false });
    if (changed.signatureValid) expect(changed.message).toMatch(/changed after it was signed/);
    expect(await verify(endJws)).toMatchObject({ signatureValid: true, unchanged: false });
    await server.db('end_signatures').where({ id: signed.id }).update({ arrows_json: signed.arrows_json });
    expect(await verify(archerJws)).toMatchObject({ unchanged: true });

    // The writers' records under a signed end count too: they no longer decide what was signed.
    const entries = await server.db('end_entries').where(where);
    await server.db('end_entries').where(where).update({ arrows_json: '["10","10","9","9","8","7"]' });
    expect(await verify(archerJws)).toMatchObject({ signatureValid: true, unchanged: false });
    expect(await verify(endJws)).toMatchObject({ signatureValid: true, unchanged: false });
    for (const e of entries)
      await server.db('end_entries').where({ id: e.id }).update({ arrows_json: e.arrows_json });

    // So does the card itself: the archer's name as entered.
    await server.db('entries').where({ id: j.ada.entryId }).update({ name: 'Ada Fletcher-Smith' });
    expect(await verify(archerJws)).toMatchObject({ unchanged: false });
    await server.db('entries').where({ id: j.ada.entryId }).update({ name: 'Ada Fletcher' });
    expect(await verify(archerJws)).toMatchObject({ unchanged: true });
  });

  it('the signing time is the server’s, with the phone’s own clock beside it', async () => {
    const [, payload] = archerJws.split('.');
    const claim = JSON.parse(Buffer.from(payload!, 'base64url').toString());
    expect(claim.phoneAt).toBe(PHONE_AT);
    expect(Date.now() - Date.parse(claim.at)).toBeLessThan(5 * 60_000);
    const result = await verify(archerJws);
    expect(result).toMatchObject({ signedAt: claim.at, phoneAt: PHONE_AT });
    const view = await card();
    expect(view.signatures.find((s) => s.role === 'archer')).toMatchObject({
      at: claim.at,
      phoneAt: PHONE_AT,
    });
  });

  it('covers everything printed on the card: renaming the event, its dates, the session, the club or moving the target shows what changed', async () => {
    const entry = { id: j.ada.entryId };
    const place = { session_id: j.sessionId, entry_id: j.ada.entryId };
    const edits: [string, string, () => Promise<unknown>, () => Promise<unknown>][] = [
      [
        'Event',
        'Field Shoot',
        () => server.db('events').where({ id: j.field.eventId }).update({ name: 'Field Shoot 2027' }),
        () => server.db('events').where({ id: j.field.eventId }).update({ name: 'Field Shoot' }),
      ],
    ];
    const event = await server.db('events').where({ id: j.field.eventId }).first();
    const session = await server.db('event_sessions').where({ id: j.sessionId }).first();
    const ada = await server.db('entries').where(entry).first();
    const assignment = await server.db('target_assignments').where(place).first();
    edits.push(
      [
        'Event dates',
        `${event.starts_on} – ${event.ends_on}`,
        () => server.db('events').where({ id: event.id }).update({ ends_on: '2027-12-31' }),
        () => server.db('events').where({ id: event.id }).update({ ends_on: event.ends_on }),
      ],
      [
        'Session',
        session.name,
        () => server.db('event_sessions').where({ id: session.id }).update({ name: 'Renamed' }),
        () => server.db('event_sessions').where({ id: session.id }).update({ name: session.name }),
      ],
      [
        'Session start',
        session.starts_at,
        () => server.db('event_sessions').where({ id: session.id }).update({ starts_at: '2027-01-01T09:00' }),
        () => server.db('event_sessions').where({ id: session.id }).update({ starts_at: session.starts_at }),
      ],
      [
        'Club',
        ada.club,
        () => server.db('entries').where(entry).update({ club: 'Other Bowmen' }),
        () => server.db('entries').where(entry).update({ club: ada.club }),
      ],
      [
        'Place',
        `target ${assignment.target_number}${assignment.position}`,
        () => server.db('target_assignments').where(place).update({ target_number: 9 }),
        () =>
          server.db('target_assignments').where(place).update({ target_number: assignment.target_number }),
      ],
    );
    for (const [what, signed, change, undo] of edits) {
      await change();
      const result = await verify(archerJws);
      expect(result, what).toMatchObject({ signatureValid: true, unchanged: false });
      if (result.signatureValid) {
        expect(result.changes?.map((c) => [c.what, c.signed])).toEqual([[what, signed]]);
        expect(result.message).toMatch(/changed after it was signed/);
      }
      await undo();
    }
    expect(await verify(archerJws)).toMatchObject({ unchanged: true });
  });

  it('a final card whose archer was later taken off the target still verifies, against what was signed', async () => {
    const place = { session_id: j.sessionId, entry_id: j.ada.entryId };
    const assignment = await server.db('target_assignments').where(place).first();
    await server.db('target_assignments').where(place).delete();
    const result = await verify(archerJws);
    expect(result).toMatchObject({
      signatureValid: true,
      unchanged: true,
      archer: 'Ada Fletcher',
      event: 'Field Shoot',
      totals: { total },
    });
    if (result.signatureValid) expect(result.message).toMatch(/no target in this session any more/);
    const { id: _id, ...row } = assignment;
    await server.db('target_assignments').insert(row);
    expect(await verify(archerJws)).toMatchObject({ unchanged: true });
  });

  it('a garbled, foreign or unsigned token is not a valid signature, with a message', async () => {
    const [header, payload, signature] = archerJws.split('.');
    const flipped = `${header}.${payload}.${signature!.startsWith('A') ? 'B' : 'A'}${signature!.slice(1)}`;
    const { privateKey } = await generateKeyPair('ES256');
    const foreign = await new CompactSign(
      new TextEncoder().encode(Buffer.from(payload!, 'base64url').toString()),
    )
      .setProtectedHeader({ alg: 'ES256', typ: 'ringcall-card' })
      .sign(privateKey);
    const unsigned = `${Buffer.from(JSON.stringify({ alg: 'none' })).toString('base64url')}.${payload}.`;
    const tampered = `${header}.${Buffer.from(
      JSON.stringify({
        ...JSON.parse(Buffer.from(payload!, 'base64url').toString()),
        totals: { total: 720 },
      }),
    ).toString('base64url')}.${signature}`;
    for (const sig of [flipped, foreign, unsigned, tampered, 'not-a-signature', 'x'.repeat(5000)]) {
      const result = await verify(sig);
      expect(result.signatureValid, sig.slice(0, 40)).toBe(false);
      expect(result.message).toMatch(/^This is not a valid signature of this Ringcall server: .+\./);
    }
    const missing = await request(server.app).get('/api/verify');
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/Give the signature to check/);
  });
});

describe('the final card', () => {
  it('is mailed to the archer as a PDF, with the verification link that checks as unchanged', async () => {
    const mail = await waitForMail(server.db, ADA_EMAIL);
    expect(mail.subject).toBe('Your final scorecard: Field Shoot, Qualification');
    const parsed = await simpleParser(mail.raw);
    expect(parsed.text).toContain(`${TEST_LINK_ADDRESS.url}/verify?sig=${archerJws}`);
    expect(parsed.attachments).toHaveLength(1);
    const pdf = parsed.attachments[0]!;
    expect(pdf.contentType).toBe('application/pdf');
    expect(pdf.filename).toBe('final-card-ada-fletcher.pdf');
    expect(pdf.content.subarray(0, 5).toString()).toBe('%PDF-');
    const link = new URL(parsed.text!.match(/https?:\/\/\S+\/verify\?sig=\S+/)![0]);
    expect(await verify(link.searchParams.get('sig')!)).toMatchObject({
      signatureValid: true,
      unchanged: true,
    });
    // The attempt is recorded just after the mail server took it.
    for (let i = 0; i < 50 && !(await server.db('card_mailings').first('id')); i += 1)
      await new Promise((r) => setTimeout(r, 20));
    const mailed = await server.db('card_mailings').where({ entry_id: j.ada.entryId });
    expect(mailed).toMatchObject([{ email: ADA_EMAIL, status: 'sent', error: null }]);
  });

  it('organizers can send it again; a failing mail server loses no signature', async () => {
    const before = (await server.db('caught_mail').max({ id: 'id' }).first())!.id as number;
    const res = await request(server.app)
      .post(`/api/cards/${j.sessionId}/${j.ada.entryId}/send`)
      .set(j.field.organizer.auth)
      .set({ Host: 'evil.example', 'X-Forwarded-Host': 'evil.example' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ sentTo: ADA_EMAIL });
    // The link in the mail is the server's own address, not the one the request claimed.
    const again = await waitForMail(server.db, ADA_EMAIL, 5_000, before);
    expect(again.text_body).toContain(`${TEST_LINK_ADDRESS.url}/verify?sig=`);
    expect(again.raw).not.toContain('evil.example');
    // Sent again by a person, it counts against the mail limits (tests/server/limits.test.ts).
    expect(await server.db('sent_mail').where({ kind: 'card', sent_by: j.field.organizer.id })).toHaveLength(
      1,
    );

    const failing = { send: async () => Promise.reject(new Error('connection refused')) };
    await expect(
      sendFinalCard(server.db, failing, j.sessionId, j.ada.entryId, 'http://field.example'),
    ).rejects.toMatchObject({ status: 502, message: expect.stringMatching(/did not take the card/) });
    // After a push, failures are only recorded and logged, never thrown.
    await expect(
      mailFinalCards(server.db, failing, [{ sessionId: j.sessionId, entryId: j.ada.entryId }], 'http://x'),
    ).resolves.toBeUndefined();
    const failed = await server.db('card_mailings').where({ entry_id: j.ada.entryId, status: 'failed' });
    expect(failed).toHaveLength(2);
    expect(failed[0].error).toBe('connection refused');
    expect(
      await server.db('card_signatures').where({ entry_id: j.ada.entryId }).whereNull('superseded_at'),
    ).toHaveLength(2);

    const cards = await request(server.app)
      .get(`/api/events/${j.field.eventId}/sessions/${j.sessionId}/cards`)
      .set(j.field.organizer.auth);
    expect(cards.body.cards.find((c: { entryId: number }) => c.entryId === j.ada.entryId)).toMatchObject({
      final: true,
      archerSigned: true,
      scorerSigned: true,
      signedEnds: 12,
      totalEnds: 12,
      total,
    });
  }, 60_000); // three PDFs of a final card: slow on a loaded machine

  it('a later ruling supersedes the card: verification says so', async () => {
    expectApplied([
      await pushOne(
        j.phones.judge,
        j.phones.judge.rule({
          sessionId: j.sessionId,
          entryId: j.ada.entryId,
          endIndex: 2,
          arrows: ['X', 'X', '10', '9', '7', '1'],
          reason: 'The M was a 1 on the edge of the face',
        }),
      ),
    ]);
    const result = await verify(archerJws);
    expect(result).toMatchObject({ signatureValid: true, unchanged: false, superseded: true });
    if (result.signatureValid)
      expect(result.message).toMatch(/A judge corrected this card after it was signed/);
  });
});
