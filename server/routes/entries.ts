import { Router } from 'express';
import { ENTRY_CSV_MAX_BYTES, entryInputSchema, updateEntrySchema } from '../../src/contract/events';
import { importRowsSchema } from '../../src/contract/entryImport';
import type { AppContext } from '../context';
import { requireEventRole } from '../auth/eventRoles';
import { csvUpload } from '../http/csvUpload';
import { idParam } from '../http/params';
import { validateBody } from '../http/validate';
import { createEntry, deleteEntry, listEntries, updateEntry } from '../services/organizer/entries';
import { entryTemplateCsv, importEntries, previewEntryImport } from '../services/organizer/entryImport';

/** The entry list: by form, or a CSV file previewed, corrected row by row and imported all at once. */
export function entryRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;
  const organizer = [ctx.requireUser, requireEventRole(db, 'organizer')];
  const upload = csvUpload(ENTRY_CSV_MAX_BYTES);

  router.get(
    '/events/:eventId/entries',
    ctx.requireUser,
    requireEventRole(db, 'organizer', 'judge'),
    async (req, res) => {
      res.json(await listEntries(db, Number(req.params.eventId)));
    },
  );

  router.get('/events/:eventId/entries/template.csv', ...organizer, async (req, res) => {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="ringcall-entries.csv"');
    res.send(await entryTemplateCsv(db, Number(req.params.eventId)));
  });

  router.post('/events/:eventId/entries', ...organizer, validateBody(entryInputSchema), async (req, res) => {
    res.status(201).json(await createEntry(db, req.user!.id, Number(req.params.eventId), req.body));
  });

  router.post('/events/:eventId/entries/import/preview', ...organizer, upload, async (req, res) => {
    res.json(await previewEntryImport(db, Number(req.params.eventId), req.file!.buffer));
  });

  // The rows as corrected in the preview, never the file: what is stored is what the organizer saw.
  router.post(
    '/events/:eventId/entries/import',
    ...organizer,
    validateBody(importRowsSchema),
    async (req, res) => {
      res.status(201).json(await importEntries(db, req.user!.id, Number(req.params.eventId), req.body));
    },
  );

  router.patch(
    '/events/:eventId/entries/:entryId',
    ...organizer,
    validateBody(updateEntrySchema),
    async (req, res) => {
      res.json(
        await updateEntry(
          db,
          req.user!.id,
          Number(req.params.eventId),
          idParam(req, 'entryId', 'entry'),
          req.body,
        ),
      );
    },
  );

  router.delete('/events/:eventId/entries/:entryId', ...organizer, async (req, res) => {
    await deleteEntry(db, req.user!.id, Number(req.params.eventId), idParam(req, 'entryId', 'entry'));
    res.status(204).end();
  });

  return router;
}
