import { Router } from 'express';
import type { AppContext } from '../context';
import type { MyCard, MyCards } from '../../src/contract/myCards';
import { cardsToSign } from '../services/judging/cardsToSign';

/**
 * The signed-in person's own scorecards (one per session they are assigned to), and the cards
 * they kept as a writer and must sign as scorer.
 */
export function myCardsRoutes(ctx: AppContext): Router {
  const router = Router();
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
  return router;
}
