import { Router } from 'express';
import type { AppContext } from '../context';
import type { MyCard, MyCards, TournamentCards } from '../../src/contract/myCards';
import { loadMe, sendVerificationMail } from '../services/accounts';
import { cardsToSign } from '../services/judging/cardsToSign';
import { tournamentCards } from '../services/practice/tournamentCards';

/**
 * The signed-in person: who they are and their roles, a new confirmation mail, their own
 * scorecards (one per session they are assigned to), the cards they kept as a writer and
 * must sign as scorer, and their signed tournament ends for the practice log.
 */
export function meRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/me', ctx.requireUser, async (req, res) => {
    res.json(await loadMe(ctx.db, req.user!));
  });

  router.post('/me/send-verification', ctx.requireUser, async (req, res) => {
    const row = await ctx.db('users').where({ id: req.user!.id }).first();
    await sendVerificationMail(ctx.db, ctx.mailer, row, ctx.linkAddress.url);
    res.status(202).json({ sent: true });
  });

  router.get('/me/cards', ctx.requireUser, async (req, res) => {
    const rows = await ctx
      .db('entries')
      .join('events', 'events.id', 'entries.event_id')
      .join('divisions', 'divisions.id', 'entries.division_id')
      .join('target_assignments', 'target_assignments.entry_id', 'entries.id')
      .join('event_sessions', 'event_sessions.id', 'target_assignments.session_id')
      .where('entries.user_id', req.user!.id)
      .orderBy([{ column: 'events.starts_on', order: 'desc' }, { column: 'event_sessions.starts_at' }])
      .select(
        'entries.id as entryId',
        'event_sessions.id as sessionId',
        'events.name as eventName',
        'event_sessions.name as sessionName',
        'divisions.name as division',
        'target_assignments.target_number as targetNumber',
        'target_assignments.position as position',
      );
    const cards: MyCard[] = rows;
    res.setHeader('Cache-Control', 'no-store');
    res.json({ cards, toSign: await cardsToSign(ctx.db, req.user!.id) } satisfies MyCards);
  });

  // Only ever the person's own cards: the practice log's history and progress (docs/practice.md).
  router.get('/me/practice-cards', ctx.requireUser, async (req, res) => {
    res.json({ cards: await tournamentCards(ctx.db, req.user!.id) } satisfies TournamentCards);
  });
  return router;
}
