import { Router, type RequestHandler } from 'express';
import { simpleParser } from 'mailparser';
import type { AppContext } from '../context';
import { HttpError, notFound } from '../http/httpError';
import { idParam } from '../http/params';
import { isMailInboxKey } from '../mail/inboxKey';

export const OPERATOR_KEY_HEADER = 'X-Operator-Key';

/**
 * The mail catcher's inbox, for the person running the server (demo, development, tests). It
 * holds other people's confirmation and invitation links, so no account or event role opens it:
 * only the operator's key, sent in a header (never in the address, so it stays out of logs).
 * Absent when mail is really sent or switched off.
 */
export function operatorMailRoutes(ctx: AppContext): Router {
  const router = Router();
  const key = ctx.mailInboxKey;
  if (!key) return router;
  const { db } = ctx;

  const operatorOnly: RequestHandler = (req, res, next) => {
    const given = req.get(OPERATOR_KEY_HEADER);
    if (!given || !isMailInboxKey(given, key)) {
      next(
        new HttpError(
          401,
          'operator_only',
          'The caught-mail inbox is only for the person running this server: open the inbox address it printed when it started.',
        ),
      );
      return;
    }
    res.setHeader('Cache-Control', 'no-store');
    next();
  };
  router.use('/operator/mail', operatorOnly);

  const message = async (id: number) => {
    const row = await db('caught_mail').where({ id }).first();
    if (!row) throw notFound('That mail is not in the catcher.');
    return row;
  };

  router.get('/operator/mail', async (_req, res) => {
    const rows = await db('caught_mail')
      .orderBy('id', 'desc')
      .limit(200)
      .select('id', 'mail_from', 'mail_to', 'subject', 'received_at');
    res.json({
      messages: rows.map((r) => ({
        id: r.id,
        from: r.mail_from,
        to: r.mail_to,
        subject: r.subject,
        receivedAt: r.received_at,
      })),
    });
  });

  router.get('/operator/mail/:id', async (req, res) => {
    const row = await message(idParam(req, 'id', 'mail'));
    const parsed = await simpleParser(row.raw);
    res.json({
      id: row.id,
      from: row.mail_from,
      to: row.mail_to,
      subject: row.subject,
      receivedAt: row.received_at,
      text: row.text_body,
      attachments: parsed.attachments.map((a, index) => ({
        index,
        filename: a.filename ?? `attachment-${index}`,
        contentType: a.contentType,
        size: a.size,
      })),
    });
  });

  router.get('/operator/mail/:id/attachments/:index', async (req, res) => {
    const row = await message(idParam(req, 'id', 'mail'));
    const parsed = await simpleParser(row.raw);
    const attachment = parsed.attachments[Number(req.params.index)];
    if (!attachment) throw notFound('That mail has no such attachment.');
    res.setHeader('Content-Type', attachment.contentType);
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="${(attachment.filename ?? 'attachment').replace(/["\r\n]/g, '')}"`,
    );
    res.send(attachment.content);
  });

  return router;
}
