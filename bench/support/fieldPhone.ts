/**
 * What the browser benchmarks share: the real server on a fresh demo database in a child
 * process, and a phone (Chromium, Pixel 7) signed in as a demo archer and joined to a target as
 * writer 1, so the pad opens with its data on the phone.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import Database from 'better-sqlite3';
import type { Page } from '@playwright/test';
import { DEMO_PASSWORD, demoArchers } from '../../server/demo/demoPeople';

export type BenchServer = { base: string; dir: string; child: ChildProcess };

export async function startBenchServer(port: number, dir: string): Promise<BenchServer> {
  const base = `http://127.0.0.1:${port}`;
  const answers = () =>
    fetch(`${base}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
  // Another server on the port would be measured instead of this one.
  if (await answers()) throw new Error(`Port ${port} is taken by another server; stop it first.`);
  rmSync(dir, { recursive: true, force: true });
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/e2e/support/startTestServer.ts'], {
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', DATA_DIR: dir, MAIL_CATCHER_PORT: '0' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  for (let i = 0; ; i += 1) {
    if (await answers()) return { base, dir, child };
    // Seeding the demo takes ~30 s when the machine is busy.
    if (i > 300) throw new Error('The bench server did not start.');
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The demo's open join code of a target. */
export function joinCode({ dir }: BenchServer, targetNumber: number): string {
  const db = new Database(`${dir}/ringcall.sqlite`, { readonly: true });
  try {
    const row = db
      .prepare('select code from join_codes where target_number = ? and revoked_at is null')
      .get(targetNumber) as { code: string };
    return row.code;
  } finally {
    db.close();
  }
}

/** Signs in as the given demo archer, joins the target as writer 1 and waits for the pad. */
export async function joinAsWriter(page: Page, server: BenchServer, archer: number, targetNumber: number) {
  await page.goto(`${server.base}/sign-in`);
  await page.getByLabel('E-mail').fill(demoArchers()[archer]!.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-name').waitFor();
  await page.goto(`${server.base}/join?code=${joinCode(server, targetNumber)}`);
  await page.getByRole('radio', { name: /Writer 1/ }).check();
  await page.getByRole('button', { name: 'Join target' }).click();
  await page.getByTestId('end-number').waitFor();
}
