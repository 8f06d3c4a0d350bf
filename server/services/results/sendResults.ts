import type { EventResults, ResultsSendReport, StandingRow } from '../../../src/contract/results';
import type { Db } from '../../db';
import { conflict } from '../../http/httpError';
import type { Mailer } from '../../mail/mailer';
import { reserveMail } from '../limits/mailLimits';
import type { DivisionFinalPlaces } from './bracketPlaces';

type Entrant = { id: number; name: string; email: string | null; account_email: string | null };

const TRUST_WORDS = {
  provisional: 'provisional: some ends are not signed yet',
  signed: 'every end signed by a judge',
  final: 'final',
} as const;

/**
 * Each line of an archer's own places: session, division, place of how many, total, trust; then
 * their final place in each bracket they shot in.
 */
function placesOf(results: EventResults, finals: DivisionFinalPlaces[], entryId: number): string[] {
  const lines: string[] = [];
  for (const session of results.sessions)
    for (const division of session.divisions) {
      const row: StandingRow | undefined = division.rows.find((r) => r.entryId === entryId);
      if (!row) continue;
      const place = `${row.tied ? 'shared ' : ''}place ${row.place} of ${division.rows.length}`;
      const shootOff = row.shootOff ? ', shoot-off needed' : '';
      lines.push(
        `- ${session.name}, ${division.name}: ${place}, total ${row.total} (${TRUST_WORDS[row.trust]}${shootOff})`,
      );
      const inClass = division.classes.find((c) => c.name === row.className)?.rows;
      const classRow = inClass?.find((r) => r.entryId === entryId);
      if (inClass && classRow)
        lines.push(
          `  in ${row.className}: ${classRow.tied ? 'shared ' : ''}place ${classRow.place} of ${inClass.length}`,
        );
    }
  for (const final of finals) {
    const mine = final.places.find((p) => p.entryId === entryId);
    if (mine)
      lines.push(`- ${final.divisionName}, eliminations: final place ${mine.place} of ${final.entrants}`);
  }
  return lines;
}

/**
 * "Send results": one mail to every entrant of the event with an address (their entry's, else
 * their account's), with their own places (and final places after the eliminations) and the link to the public results page. Only
 * published results are sent, since the link must open for everyone. Counted as one send
 * against the event's limit before any mail leaves; a mail the server refuses is counted, not
 * retried, so one bad address does not stop the others.
 */
export async function sendResults(
  db: Db,
  mailer: Mailer,
  results: EventResults,
  by: { userId: number; pageUrl: string },
  finals: DivisionFinalPlaces[] = [],
): Promise<ResultsSendReport> {
  const event = results.event;
  if (!event.published)
    throw conflict('Publish the results first: the mail links to the public results page.');
  const entrants = (await db('entries as e')
    .leftJoin('users as u', 'u.id', 'e.user_id')
    .where('e.event_id', event.id)
    .orderBy('e.id')
    .select('e.id', 'e.name', 'e.email', 'u.email as account_email')) as Entrant[];
  const addressed = entrants.filter((e) => e.email || e.account_email);
  if (addressed.length === 0)
    throw conflict('No archer of this event has an e-mail address. Add them in the entry list first.');
  await reserveMail(db, {
    kind: 'results',
    sentBy: by.userId,
    eventId: event.id,
    recipient: `${addressed.length} entrants of event ${event.id}`,
  });

  const report: ResultsSendReport = {
    sent: 0,
    withoutAddress: entrants.length - addressed.length,
    failed: 0,
  };
  for (const entrant of addressed) {
    const places = placesOf(results, finals, entrant.id);
    const text = [
      `Hello ${entrant.name},`,
      '',
      `The results of ${event.name} are published.`,
      ...(places.length > 0
        ? ['', places.length === 1 ? 'Your place:' : 'Your places:', ...places]
        : ['', 'You have no place in the standings: no card of yours was scored.']),
      '',
      `Every archer's place, kept up to date until all cards are final:`,
      by.pageUrl,
      '',
      'Ringcall',
    ].join('\n');
    try {
      await mailer.send({
        to: (entrant.email ?? entrant.account_email)!,
        subject: `Results: ${event.name}`,
        text,
      });
      report.sent += 1;
    } catch {
      report.failed += 1;
    }
  }
  return report;
}
