import type { Db } from '../../db';
import { HttpError } from '../../http/httpError';
import { refuseOverWindow, type Window } from './window';

/**
 * A judge takes a photo when ruling on an end: a few an hour, even on a busy field. The quota
 * bounds what one event may keep on the server's disk (about a hundred full-size phone photos).
 */
export const PHOTO_LIMITS = {
  perPerson: { max: 10, minutes: 10 } satisfies Window,
  perEvent: { max: 60, minutes: 60 } satisfies Window,
  bytesPerEvent: 500 * 1024 * 1024,
};

const mb = (bytes: number) => `${Math.ceil(bytes / (1024 * 1024))} MB`;

/**
 * Refuses a new photo of an event when its uploader or the event has sent too many lately (429),
 * or when it would take the event past its storage quota (413). Call inside the transaction that
 * stores the photo's row, so uploads arriving together are counted one after another.
 */
export async function refusePhotoOverLimits(
  db: Db,
  userId: number,
  eventId: number,
  bytes: number,
): Promise<void> {
  await refuseOverWindow(
    db('photos').where({ uploaded_by: userId }),
    'uploaded_at',
    PHOTO_LIMITS.perPerson,
    (within, wait) =>
      `You have uploaded ${PHOTO_LIMITS.perPerson.max} photos in the last ${within}. Upload the next one in ${wait}.`,
  );
  await refuseOverWindow(
    db('photos').where({ event_id: eventId }),
    'uploaded_at',
    PHOTO_LIMITS.perEvent,
    (within, wait) =>
      `This event has received ${PHOTO_LIMITS.perEvent.max} photos in the last ${within}. Upload the next one in ${wait}.`,
  );
  const used = Number(
    (
      (await db('photos').where({ event_id: eventId }).sum({ n: 'size_bytes' }).first()) as {
        n: number | null;
      }
    ).n ?? 0,
  );
  if (used + bytes > PHOTO_LIMITS.bytesPerEvent)
    throw new HttpError(
      413,
      'quota_full',
      `This event's photos already use ${mb(used)} of its ${mb(PHOTO_LIMITS.bytesPerEvent)} on the server, and this one does not fit. Ask the person running the server for more room.`,
    );
}
