import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../../server/db';
import { makeEvent, makePerson, type TestPerson } from './people';

/** Counts the page objects of a PDF (pdfkit writes them uncompressed: `/Type /Page`). */
export const pdfPageCount = (pdf: Buffer): number =>
  (pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-z])/g) ?? []).length;

/** Supertest collects binary answers (PDF, CSV) into a Buffer with this parser. */
export function binary(res: request.Response, done: (err: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  const stream = res as unknown as NodeJS.ReadableStream;
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

export type SetUpEvent = {
  organizer: TestPerson;
  eventId: number;
  divisions: Record<string, number>;
  api: (
    method: 'get' | 'post' | 'put' | 'patch' | 'delete',
    path: string,
    body?: object,
  ) => Promise<request.Response>;
};

/** An event with an organizer, made through the API where it matters: divisions by name. */
export async function setUpEvent(
  app: Express,
  db: Db,
  divisions: { bowStyle: 'recurve' | 'compound' | 'barebow'; className: string }[] = [],
): Promise<SetUpEvent> {
  const organizer = await makePerson(db, 'Olwen Organizer');
  const eventId = await makeEvent(db, organizer);
  const api: SetUpEvent['api'] = (method, path, body) => {
    const req = request(app)[method](`/api/events/${eventId}${path}`).set(organizer.auth);
    return body ? req.send(body) : req;
  };
  const ids: Record<string, number> = {};
  for (const d of divisions) {
    const res = await api('post', '/divisions', d);
    if (res.status !== 201) throw new Error(`division: ${res.status} ${JSON.stringify(res.body)}`);
    ids[res.body.name] = res.body.id;
  }
  return { organizer, eventId, divisions: ids, api };
}

/** Adds archers by form: `count` per division, named "<Division> archer <n>". */
export async function addArchers(
  setup: SetUpEvent,
  division: string,
  count: number,
  prefix = division,
): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 1; i <= count; i += 1) {
    const res = await setup.api('post', '/entries', {
      name: `${prefix} archer ${i}`,
      club: 'Test Club',
      divisionId: setup.divisions[division],
    });
    if (res.status !== 201) throw new Error(`entry: ${res.status} ${JSON.stringify(res.body)}`);
    ids.push(res.body.id);
  }
  return ids;
}
