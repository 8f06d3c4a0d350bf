import type { Db } from '../../db';
import { nowIso } from '../../time';
import { refuseOverWindow, type Window } from './window';

export type MailKind = 'invite' | 'verify' | 'card' | 'results';
type Counted = 'sent_by' | 'event_id' | 'recipient';
type Rule = Window & { per: Counted[]; says: (within: string, wait: string, to: string) => string };

/**
 * What one person, one event or one address may cause in mail. Enough for a club inviting its
 * judges and re-sending a few cards; far too little to use the server to flood a mailbox.
 */
export const MAIL_RULES: Record<MailKind, Rule[]> = {
  invite: [
    {
      per: ['sent_by'],
      max: 20,
      minutes: 60,
      says: (w, wait) => `You have sent 20 invitations in the last ${w}. Send more in ${wait}.`,
    },
    {
      per: ['event_id'],
      max: 40,
      minutes: 60,
      says: (w, wait) => `This event has sent 40 invitations in the last ${w}. Send more in ${wait}.`,
    },
    {
      per: ['event_id', 'recipient'],
      max: 3,
      minutes: 60,
      says: (w, wait, to) =>
        `${to} was invited 3 times in the last ${w}. Ask them to look for the mail (also in spam), or invite again in ${wait}.`,
    },
    {
      // Across events too, so making events does not open a way to flood one mailbox.
      per: ['recipient'],
      max: 10,
      minutes: 60,
      says: (w, wait, to) =>
        `${to} has received 10 invitations in the last ${w}. Invite them again in ${wait}.`,
    },
  ],
  verify: [
    {
      per: ['sent_by'],
      max: 4,
      minutes: 60,
      says: (w, wait) =>
        `A confirmation mail went to you 4 times in the last ${w}. Look for the newest one (also in spam), or ask again in ${wait}.`,
    },
  ],
  card: [
    {
      per: ['event_id', 'recipient'],
      max: 3,
      minutes: 60,
      says: (w, wait, to) => `This card went to ${to} 3 times in the last ${w}. Send it again in ${wait}.`,
    },
    {
      per: ['event_id'],
      max: 200,
      minutes: 60,
      says: (w, wait) => `This event has sent 200 cards again in the last ${w}. Send more in ${wait}.`,
    },
  ],
  // One row per "send results" (a mail to every entrant): a few corrections an hour, no more.
  results: [
    {
      per: ['event_id'],
      max: 3,
      minutes: 60,
      says: (w, wait) =>
        `The results of this event went to its archers 3 times in the last ${w}. Send them again in ${wait}.`,
    },
  ],
};

/**
 * Counts a mail a person asked for against the limits, and records it, in one transaction (so
 * requests arriving together cannot all slip under a limit). Call it before sending; a mail
 * over a limit is refused with 429 and a sentence that says when to try again.
 */
export async function reserveMail(
  db: Db,
  mail: { kind: MailKind; sentBy: number; eventId: number | null; recipient: string },
): Promise<void> {
  const values: Record<Counted, string | number | null> = {
    sent_by: mail.sentBy,
    event_id: mail.eventId,
    recipient: mail.recipient,
  };
  await db.transaction(async (trx) => {
    for (const rule of MAIL_RULES[mail.kind]) {
      const rows = trx('sent_mail').where({ kind: mail.kind });
      for (const column of rule.per) rows.where(column, values[column]);
      await refuseOverWindow(rows, 'at', rule, (within, wait) => rule.says(within, wait, mail.recipient));
    }
    await trx('sent_mail').insert({
      kind: mail.kind,
      sent_by: mail.sentBy,
      event_id: mail.eventId,
      recipient: mail.recipient,
      at: nowIso(),
    });
  });
}
