import { Router } from 'express';
import { simpleParser } from 'mailparser';
import type { AppContext } from '../context';
import { forbidden, notFound } from '../http/httpError';

/**
 * The local mail catcher's inbox (demo, development, tests). Organizers read every caught mail;
 * anyone else only mail addressed to them. Absent when a real SMTP server is configured.
 */
export function caughtMailRoutes(ctx: AppContext): Router {
  const router = Router();
  if (!ctx.mailCaught) return router;
  const { db } = ctx;

  async function visibleTo(userId: number, email: string) {
    const organizer = await db('event_roles').where({ user_id: userId, role: 'organizer' }).first('id');
    const query = db('caught_mail').orderBy('id', 'desc');
    // Ringcall sends every mail to one recipient, so an exact match finds a person's own mail.
    if (organizer) return () => query.clone();
    return () => query.clone().where('mail_to', email);
  }

  router.get('/caught-mail', ctx.requireUser, async (req, res) => {
    const rows = await (
      await visibleTo(req.user!.id, req.user!.email)
    )()
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

  router.get('/caught-mail/:id', ctx.requireUser, async (req, res) => {
    const row = await (
      await visibleTo(req.user!.id, req.user!.email)
    )()
      .where({ id: Number(req.params.id) })
      .first();
    if (!row) throw notFound('That mail is not in the catcher, or it is not addressed to you.');
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

  router.get('/caught-mail/:id/attachments/:index', ctx.requireUser, async (req, res) => {
    const row = await (
      await visibleTo(req.user!.id, req.user!.email)
    )()
      .where({ id: Number(req.params.id) })
      .first();
    if (!row) throw forbidden('That mail is not addressed to you.');
    const parsed = await simpleParser(row.raw);
    const attachment = parsed.attachments[Number(req.params.index)];
    if (!attachment) throw notFound('That mail has no such attachment.');
    res.setHeader('Content-Type', attachment.contentType);
    res.setHeader(
      'Content-Disposition',
      `attachment; filename="${(attachment.filename ?? 'attachment').replace(/"/g, '')}"`,
    );
    res.send(attachment.content);
  });

  return router;
}
