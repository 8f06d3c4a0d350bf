import { cardTotals, isTen, isX, type ArrowValue } from '../../../src/core';
import type { CardSendResult } from '../../../src/contract/judging';
import type { Db } from '../../db';
import type { Mailer } from '../../mail/mailer';
import { conflict, HttpError } from '../../http/httpError';
import { nowIso } from '../../time';
import { reserveMail } from '../limits/mailLimits';
import { PrintDocument } from '../printouts/pdfDocument';
import { scorecardPage, type FilledCard } from '../printouts/scorecards';
import { isFinal, loadCard, type CardData } from './cardData';
import { listInWords } from './endWords';

/** The public page a final card's QR code leads to (the app's /verify screen). */
export const verifyUrl = (baseUrl: string, jws: string): string => `${baseUrl}/verify?sig=${jws}`;

/** "12 Dec 2026, 10:42 (Europe/London)": a signature time in the event's own time zone. */
export function timeInEvent(iso: string, timeZone: string): string {
  const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(
    new Date(iso),
  );
  return `${when} (${timeZone})`;
}

const counts = (values: readonly ArrowValue[]) => ({
  tens: values.filter(isTen).length,
  xs: values.filter(isX).length,
});

/** The final card as a PDF: the printed scorecard's look, filled in, with both signatures and the verification QR code. */
export async function finalCardPdf(card: CardData, baseUrl: string): Promise<Buffer> {
  const { archer: archerSigned, scorer } = card.signatures;
  if (!archerSigned || !scorer) throw new Error('Only a final card is printed as one.');
  const totals = cardTotals(
    card.round,
    card.facts.ends.map((e) => e?.arrows),
  );
  const ends: FilledCard['ends'] = new Map();
  for (const end of totals.ends) {
    if (!end.values) continue;
    ends.set(end.index, {
      arrows: end.values,
      total: end.total!,
      runningTotal: end.runningTotal!,
      ...counts(end.values),
      signedBy: card.ends[end.index]?.stored.signature?.signedByName ?? null,
    });
  }
  const judges = [...new Set(card.ends.flatMap((e) => e.stored.signature?.signedByName ?? []))];
  const url = verifyUrl(baseUrl, archerSigned.jws);
  const filled: FilledCard = {
    title: 'Final card',
    ends,
    distances: totals.distances.map((d) => ({ total: d.total, tens: d.tens, xs: d.xs })),
    totals: { total: totals.total, tens: totals.tens, xs: totals.xs, hits: totals.hits },
    signatures: [
      {
        label: 'Archer',
        name: archerSigned.name,
        at: timeInEvent(archerSigned.signed_at, card.event.timeZone),
      },
      { label: 'Scorer', name: scorer.name, at: timeInEvent(scorer.signed_at, card.event.timeZone) },
    ],
    judgesLine: `All ${card.ends.length} ends signed by a judge (${listInWords(judges)}).`,
    verify: { url },
  };
  const pdf = new PrintDocument(
    `Final card · ${card.archer.name} · ${card.event.name} · ${card.session.name}`,
  );
  scorecardPage(
    pdf,
    {
      event: { name: card.event.name, venue: card.event.venue },
      session: { name: card.session.name, startsAt: card.session.startsAt },
    },
    {
      entryId: card.archer.entryId,
      name: card.archer.name,
      club: card.archer.club,
      divisionName: card.archer.division,
      round: card.round,
      targetNumber: card.archer.targetNumber,
      position: card.archer.position,
    },
    filled,
  );
  return pdf.toBuffer();
}

/** Where a final card is mailed: the entry's address, else the linked account's. */
async function cardAddress(db: Db, card: CardData): Promise<string | null> {
  if (card.archer.email) return card.archer.email;
  if (card.archer.userId === null) return null;
  const user = await db('users').where({ id: card.archer.userId }).first('email');
  return (user?.email as string | undefined) ?? null;
}

const fileName = (name: string) =>
  `final-card-${
    name
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/gi, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'archer'
  }.pdf`;

/**
 * Mails a final card as a PDF to its archer and records the attempt. Throws an HttpError a
 * person can act on when the card is not final, has no address, or the mail server refuses.
 */
export async function sendFinalCard(
  db: Db,
  mailer: Mailer,
  sessionId: number,
  entryId: number,
  baseUrl: string,
  /** Who asked for it again (counted against the mail limits); absent when the last signature sends it. */
  requestedBy?: number,
): Promise<CardSendResult> {
  const card = await loadCard(db, sessionId, entryId);
  if (!isFinal(card))
    throw conflict(
      `${card.archer.name}'s card is not final yet: it needs the archer's and the scorer's signatures.`,
    );
  const to = await cardAddress(db, card);
  if (!to)
    throw conflict(
      `${card.archer.name} has no e-mail address. Add one in the entry list, then send the card again.`,
    );
  if (requestedBy !== undefined)
    await reserveMail(db, { kind: 'card', sentBy: requestedBy, eventId: card.event.id, recipient: to });
  const pdf = await finalCardPdf(card, baseUrl);
  const url = verifyUrl(baseUrl, card.signatures.archer!.jws);
  const t = cardTotals(
    card.round,
    card.facts.ends.map((e) => e?.arrows),
  );
  const record = (status: 'sent' | 'failed', error: string | null) =>
    db('card_mailings').insert({
      session_id: sessionId,
      entry_id: entryId,
      email: to,
      status,
      error,
      at: nowIso(),
    });
  try {
    await mailer.send({
      to,
      subject: `Your final scorecard: ${card.event.name}, ${card.session.name}`,
      text: [
        `Hello ${card.archer.name},`,
        '',
        `Your scorecard from ${card.session.name} at ${card.event.name} is final. A judge signed every end, ` +
          `you countersigned it and ${card.signatures.scorer!.name} signed it as scorer.`,
        '',
        `${card.round.name}: total ${t.total}, 10s ${t.tens}, Xs ${t.xs}, hits ${t.hits}.`,
        '',
        'The card is attached as a PDF. Anyone can check that it is unchanged since it was signed here:',
        url,
        '',
        'Ringcall',
      ].join('\n'),
      attachments: [{ filename: fileName(card.archer.name), content: pdf, contentType: 'application/pdf' }],
    });
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    await record('failed', reason.slice(0, 1000));
    throw new HttpError(
      502,
      'mail_failed',
      `The mail server did not take the card for ${to}. Try sending it again later.`,
    );
  }
  await record('sent', null);
  return { sentTo: to };
}

/**
 * After a push made cards final: mail each one. Runs after the push is committed and never
 * throws: a mail failure is recorded (card_mailings) and logged, and the organizer can send the
 * card again; the signatures are already safe.
 */
export function mailFinalCards(
  db: Db,
  mailer: Mailer,
  cards: { sessionId: number; entryId: number }[],
  baseUrl: string,
): Promise<void> {
  return cards
    .reduce(
      (chain, card) =>
        chain.then(() =>
          sendFinalCard(db, mailer, card.sessionId, card.entryId, baseUrl).then(
            () => undefined,
            (error: unknown) => {
              const reason = error instanceof Error ? error.message : String(error);
              console.error(`The final card of entry ${card.entryId} was not mailed: ${reason}`);
            },
          ),
        ),
      Promise.resolve(),
    )
    .catch(() => undefined);
}
