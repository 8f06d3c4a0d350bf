import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { APIRequestContext } from '@playwright/test';

/** The operator's key to the caught-mail inbox, made by the test server in its data folder. */
export const operatorKey = (): string =>
  readFileSync(join(process.env.E2E_DATA_DIR!, 'mail-inbox-secret'), 'utf8').trim();

/** The inbox address the server prints at start, as a path for the browser. */
export const operatorInboxPath = (): string => `/operator/mail#key=${operatorKey()}`;

export type CaughtMail = {
  id: number;
  to: string;
  subject: string;
  text: string;
  attachments: { contentType: string }[];
};

/** The newest caught mail to `to` whose subject matches, read with the operator's key; waits up to 20 s. */
export async function operatorMailTo(
  request: APIRequestContext,
  to: string,
  subject?: RegExp,
): Promise<CaughtMail> {
  const headers = { 'X-Operator-Key': operatorKey() };
  for (let i = 0; i < 40; i += 1) {
    const list = (await (await request.get('/api/operator/mail', { headers })).json()) as {
      messages: { id: number; to: string; subject: string }[];
    };
    const found = list.messages.find((m) => m.to === to && (!subject || subject.test(m.subject)));
    if (found)
      return (await (await request.get(`/api/operator/mail/${found.id}`, { headers })).json()) as CaughtMail;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`No mail to ${to} reached the catcher.`);
}
