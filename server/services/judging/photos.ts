import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import type { PhotoUploadResult } from '../../../src/contract/judging';
import type { Db } from '../../db';
import { HttpError, forbidden, notFound } from '../../http/httpError';
import { photoKind } from '../../http/photoUpload';
import { nowIso } from '../../time';
import { audit } from '../audit';
import { refusePhotoOverLimits } from '../limits/photoLimits';

/** Photos live in DATA_DIR/photos, outside the web root: only the API serves them, to those allowed. */
export const photoDir = (dataDir: string): string => join(dataDir, 'photos');

/**
 * Keeps a judge's photo of a target: checked to be an image by its first bytes, stored once by
 * its SHA-256 (the same picture twice is one file, and one photo per event).
 */
export async function storePhoto(
  db: Db,
  dataDir: string,
  userId: number,
  eventId: number,
  bytes: Buffer,
): Promise<{ created: boolean; result: PhotoUploadResult }> {
  const kind = photoKind(bytes);
  if (!kind)
    throw new HttpError(
      415,
      'not_a_photo',
      'That file is not a photo Ringcall can keep. Upload a JPEG, PNG or WebP picture of the target.',
    );
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const stored = `${sha256}.${kind.ext}`;
  const file = join(photoDir(dataDir), stored);
  return db.transaction(async (trx) => {
    const existing = await trx('photos').where({ event_id: eventId, sha256 }).first('id');
    if (existing) {
      writeOnce(file, bytes);
      return { created: false, result: { photoId: existing.id, sha256 } };
    }
    await refusePhotoOverLimits(trx, userId, eventId, bytes.length);
    writeOnce(file, bytes);
    const [row] = (await trx('photos')
      .insert({
        event_id: eventId,
        sha256,
        mime_type: kind.mime,
        size_bytes: bytes.length,
        stored_name: stored,
        uploaded_by: userId,
        uploaded_at: nowIso(),
      })
      .returning('id')) as { id: number }[];
    await audit(trx, { userId, eventId, action: 'photo.uploaded', details: { photoId: row!.id, sha256 } });
    return { created: true, result: { photoId: row!.id, sha256 } };
  });
}

/** Stores a picture's file once (the same picture in two events is one file). */
function writeOnce(file: string, bytes: Buffer): void {
  if (existsSync(file)) return;
  mkdirSync(dirname(file), { recursive: true, mode: 0o700 });
  // Written beside and renamed, so a half-written file is never served.
  const partial = `${file}.${process.pid}.part`;
  writeFileSync(partial, bytes, { mode: 0o600 });
  renameSync(partial, file);
}

/**
 * Whether the person may see a photo a judge attached to a ruling: a member of the group of the
 * target the ruled archer shoots on (every phone of the target shows the ruling), or the archer.
 */
async function seesRuling(db: Db, userId: number, photoId: number): Promise<boolean> {
  const found = await db('end_rulings as r')
    .join('target_assignments as ta', function () {
      this.on('ta.session_id', 'r.session_id').andOn('ta.entry_id', 'r.entry_id');
    })
    .join('entries as e', 'e.id', 'r.entry_id')
    .leftJoin('target_members as tm', function () {
      this.on('tm.session_id', 'ta.session_id')
        .andOn('tm.target_number', 'ta.target_number')
        .andOn('tm.user_id', db.raw('?', [userId]));
    })
    .where('r.photo_id', photoId)
    .where((who) => who.whereNotNull('tm.id').orWhere('e.user_id', userId))
    .first('r.id');
  return !!found;
}

/** A photo's bytes, for the judges and organizers of its event, and those who see its ruling. */
export async function readPhoto(
  db: Db,
  dataDir: string,
  userId: number,
  photoId: number,
): Promise<{ mime: string; bytes: Buffer; name: string }> {
  const photo = await db('photos').where({ id: photoId }).first();
  if (!photo) throw notFound('That photo does not exist.');
  const staff = await db('event_roles')
    .where({ event_id: photo.event_id, user_id: userId })
    .whereIn('role', ['organizer', 'judge'])
    .first('id');
  if (!staff && !(await seesRuling(db, userId, photoId)))
    throw forbidden(
      "Only the event's judges and organizers, and the ruled archer's target, can see this photo.",
    );
  try {
    return {
      mime: photo.mime_type,
      bytes: await readFile(join(photoDir(dataDir), photo.stored_name)),
      name: photo.stored_name,
    };
  } catch {
    throw notFound('The file of that photo is missing on the server. Upload it again.');
  }
}
