import type { Db } from '../../../server/db';

type CaughtRow = { id: number; mail_to: string; subject: string; text_body: string; raw: string };

/**
 * The newest caught mail to `to` (newer than `afterId`), waiting briefly: SMTP delivery to the
 * catcher is asynchronous.
 */
export async function waitForMail(db: Db, to: string, timeoutMs = 5_000, afterId = 0): Promise<CaughtRow> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const row = (await db('caught_mail')
      .where({ mail_to: to })
      .where('id', '>', afterId)
      .orderBy('id', 'desc')
      .first()) as CaughtRow | undefined;
    if (row) return row;
    if (Date.now() > until) throw new Error(`No mail to ${to} arrived within ${timeoutMs} ms.`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
