import request from 'supertest';
import type { Express } from 'express';
import type { EventRole } from '../../../src/contract/auth';
import type { Db } from '../../../server/db';
import { signAccessToken } from '../../../server/auth/tokens';
import { grantRole } from '../../../server/services/accounts';
import { nowIso } from '../../../server/time';

export const TEST_SECRET = new TextEncoder().encode('test-secret-test-secret-test-secret-0123');

export type TestPerson = { id: number; email: string; token: string; auth: { Authorization: string } };

let counter = 0;

/** Creates a verified account directly in the database and a valid access token for it. */
export async function makePerson(db: Db, name = 'Test Person'): Promise<TestPerson> {
  counter += 1;
  const email = `person${counter}.${Date.now()}@ringcall.example`;
  const [row] = await db('users')
    .insert({
      email,
      display_name: name,
      password_hash: null,
      email_verified_at: nowIso(),
      created_at: nowIso(),
    })
    .returning('id');
  const id = (row as { id: number }).id;
  const { token } = await signAccessToken(TEST_SECRET, id);
  return { id, email, token, auth: { Authorization: `Bearer ${token}` } };
}

/** Creates an event owned by `organizer` directly in the database. */
export async function makeEvent(db: Db, organizer: TestPerson, name = 'Test Shoot'): Promise<number> {
  const at = nowIso();
  const [row] = await db('events')
    .insert({
      name,
      venue: 'Test field',
      starts_on: '2026-12-12',
      ends_on: '2026-12-12',
      time_zone: 'UTC',
      created_by: organizer.id,
      created_at: at,
      updated_at: at,
    })
    .returning('id');
  const eventId = (row as { id: number }).id;
  await grantRole(db, eventId, organizer.id, 'organizer');
  return eventId;
}

export async function giveRole(db: Db, eventId: number, person: TestPerson, role: EventRole): Promise<void> {
  await grantRole(db, eventId, person.id, role);
}

/** Signs up through the API (real password hashing at the test cost) and returns the session body. */
export async function signUpViaApi(
  app: Express,
  email: string,
  password = 'correct horse battery',
  displayName = 'Api Person',
) {
  const res = await request(app).post('/api/auth/sign-up').send({ email, password, displayName });
  return res;
}
