import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { getRound } from '../../src/core';
import { signAccessToken } from '../../server/auth/tokens';
import { migrate, openDb } from '../../server/db';
import { nowIso } from '../../server/time';

export const BENCH_SECRET = new TextEncoder().encode('bench-secret-bench-secret-bench-secret');

export type BenchArcher = { entryId: number; target: number };
export type BenchWriter = { userId: number; token: string; target: number; slot: 1 | 2 };
export type BenchField = {
  eventId: number;
  sessionId: number;
  archers: BenchArcher[];
  writers: BenchWriter[];
};

/**
 * A day's field written straight into a fresh database: one recurve division on the 70 m round,
 * `targets` targets of four archers, and two writers per target who joined it.
 */
export async function createBenchField(file: string, targets: number): Promise<BenchField> {
  const db = openDb(file);
  await migrate(db);
  const at = nowIso();
  const id = async (table: string, row: object) =>
    ((await db(table).insert(row).returning('id'))[0] as { id: number }).id;
  const organizer = await id('users', {
    email: 'organizer@bench.example',
    display_name: 'Bench Organizer',
    created_at: at,
    email_verified_at: at,
  });
  const eventId = await id('events', {
    name: 'Bench Day',
    venue: 'Field',
    starts_on: '2026-12-12',
    ends_on: '2026-12-12',
    created_by: organizer,
    created_at: at,
    updated_at: at,
  });
  await db('event_roles').insert({
    event_id: eventId,
    user_id: organizer,
    role: 'organizer',
    created_at: at,
  });
  const divisionId = await id('divisions', {
    event_id: eventId,
    bow_style: 'recurve',
    class_name: 'Open',
    name: 'Recurve Open',
  });
  const sessionId = await id('event_sessions', {
    event_id: eventId,
    name: 'Qualification',
    starts_at: '2026-12-12T09:00',
  });
  await db('session_divisions').insert({
    session_id: sessionId,
    division_id: divisionId,
    round_id: '70m',
    round_json: JSON.stringify(getRound('70m')),
  });

  const archers: BenchArcher[] = [];
  const writers: BenchWriter[] = [];
  for (let target = 1; target <= targets; target += 1) {
    for (const position of ['A', 'B', 'C', 'D']) {
      const entryId = await id('entries', {
        event_id: eventId,
        division_id: divisionId,
        name: `Archer ${target}${position}`,
        club: 'Bench Club',
        created_at: at,
      });
      await db('target_assignments').insert({
        session_id: sessionId,
        entry_id: entryId,
        target_number: target,
        position,
      });
      archers.push({ entryId, target });
    }
    for (const slot of [1, 2] as const) {
      const userId = await id('users', {
        email: `writer${target}.${slot}@bench.example`,
        display_name: `Writer ${slot} of ${target}`,
        created_at: at,
        email_verified_at: at,
      });
      await db('target_members').insert({
        session_id: sessionId,
        target_number: target,
        user_id: userId,
        task: `writer${slot}`,
        joined_at: at,
      });
      writers.push({ userId, token: (await signAccessToken(BENCH_SECRET, userId)).token, target, slot });
    }
  }
  await db.destroy();
  return { eventId, sessionId, archers, writers };
}

/**
 * Starts bench/support/syncServerChild.ts on the database file and waits for its port. With
 * `BENCH_SERVER_PROFILE=<folder>` the child writes a V8 CPU profile there when it stops (Node
 * refuses `--cpu-prof` in NODE_OPTIONS, so it has to be passed here).
 */
export const startServerChild = (file: string) => startChild('./syncServerChild.ts', [file]);

/** Starts bench/support/bareServerChild.ts, the floor: a bare node:http server answering pushes. */
export const startBareServerChild = () => startChild('./bareServerChild.ts', []);

async function startChild(
  name: string,
  args: string[],
): Promise<{
  port: number;
  child: ChildProcess;
  /** CPU time (user + system) the server has used so far, in ms. */
  cpuMs: () => Promise<number>;
  stop: () => Promise<void>;
}> {
  const script = fileURLToPath(new URL(name, import.meta.url));
  const profile = process.env.BENCH_SERVER_PROFILE;
  const profiling = profile ? ['--cpu-prof', '--cpu-prof-dir', profile] : [];
  const child = spawn(process.execPath, [...profiling, '--import', 'tsx', script, ...args], {
    stdio: ['ignore', 'pipe', 'inherit', 'ipc'],
  });
  const firstLine = await new Promise<string>((resolve, reject) => {
    const lines = createInterface({ input: child.stdout! });
    lines.once('line', resolve);
    child.once('exit', (code) =>
      reject(new Error(`The server child exited with ${code} before it listened.`)),
    );
  });
  const { port } = JSON.parse(firstLine) as { port: number };
  const cpuMs = () =>
    new Promise<number>((resolve) => {
      child.once('message', (usage) => {
        const { user, system } = usage as NodeJS.CpuUsage;
        resolve((user + system) / 1000);
      });
      child.send('cpu');
    });
  const stop = () =>
    new Promise<void>((resolve) => {
      child.once('exit', () => resolve());
      child.kill('SIGTERM');
    });
  return { port, child, cpuMs, stop };
}
