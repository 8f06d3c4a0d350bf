import { randomUUID } from 'node:crypto';
import type { ArrowValue } from '../../src/core';
import type { Mutation, PullResponse, PushResponse } from '../../src/contract/sync';
import type { BenchField, BenchWriter } from './syncField';
import type { jsonClient } from './jsonClient';

/** The end every archer shoots, tapped highest first as a writer reads it out. */
const END: ArrowValue[] = ['X', '10', '9', '9', '8', '7'];

/** A writer phone: its pushes in order, each one archer's end as six taps, and its pull cursor. */
export type PadPhone = { writer: BenchWriter; clientId: string; pushes: Mutation[][]; cursor: number };

/** 'one': the push carries the pull cursor and its answer the pull (this version); 'two': push, then pull. */
export type RoundTrips = 'one' | 'two';

/**
 * The phones of the chosen writers as the pad fills them: end by end, archer by archer, one
 * end.write change per tap holding the end as typed so far (src/local/outbox.ts recordChange),
 * and one push per archer's end (the sync loop waits for a pause in typing).
 */
export function padPhones(
  field: BenchField,
  ends: number,
  chosen: (writer: BenchWriter) => boolean,
  prefix: string,
): PadPhone[] {
  return field.writers.filter(chosen).map((writer) => {
    const archers = field.archers.filter((a) => a.target === writer.target);
    const pushes: Mutation[][] = [];
    let seq = 0;
    for (let endIndex = 0; endIndex < ends; endIndex += 1) {
      for (const archer of archers) {
        pushes.push(
          END.map((_, tap) => ({
            id: randomUUID(),
            seq: (seq += 1),
            at: new Date().toISOString(),
            kind: 'end.write' as const,
            args: {
              sessionId: field.sessionId,
              entryId: archer.entryId,
              endIndex,
              slot: writer.slot,
              arrows: END.slice(0, tap + 1),
              flags: [],
            },
          })),
        );
      }
    }
    return { writer, clientId: `${prefix}-${writer.target}-${writer.slot}`, pushes, cursor: 0 };
  });
}

/**
 * One round of the phone's sync loop (src/local/syncEngine.ts) for its push number `index`:
 * the push, then pulls until nothing more waits. With 'one' the push asks for the pull too, and
 * a separate pull is sent only when more is waiting than one answer holds.
 */
export async function syncRound(
  http: ReturnType<typeof jsonClient>,
  phone: PadPhone,
  trips: RoundTrips,
  index = 0,
): Promise<{ applied: number; requests: number }> {
  const token = phone.writer.token;
  const body = {
    clientId: phone.clientId,
    mutations: phone.pushes[index]!,
    ...(trips === 'one' ? { cursor: phone.cursor } : {}),
  };
  const pushed = await http.post('/api/sync/push', token, body);
  if (pushed.status !== 200) throw new Error(`push ${pushed.status}: ${JSON.stringify(pushed.body)}`);
  const answer = pushed.body as PushResponse & { pull?: PullResponse };
  let requests = 1;
  let more = true;
  if (answer.pull) {
    phone.cursor = answer.pull.cursor;
    more = answer.pull.hasMore;
  }
  while (more) {
    const pulled = await http.get(`/api/sync/pull?cursor=${phone.cursor}`, token);
    if (pulled.status !== 200) throw new Error(`pull ${pulled.status}: ${JSON.stringify(pulled.body)}`);
    const page = pulled.body as PullResponse;
    phone.cursor = page.cursor;
    more = page.hasMore;
    requests += 1;
  }
  return { applied: answer.results.filter((r) => r.status === 'applied').length, requests };
}
