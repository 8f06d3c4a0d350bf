import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError, badRequest } from './httpError';

/**
 * One photo in the `photo` field, kept in memory (written to disk only once it is known to be an
 * image), size-limited. What kind of file it is is decided by its first bytes (see photoKind),
 * not by the name or type the browser sends.
 */
export function photoUpload(maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 6 },
  }).single('photo');

  return (req, res, next) => {
    if (!req.is('multipart/form-data'))
      return next(badRequest('Send the photo as a form upload in the field "photo".'));
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new HttpError(
              413,
              'too_large',
              `The photo is larger than ${Math.round(maxBytes / (1024 * 1024))} MB. Take it at a lower resolution, or crop it, and upload it again.`,
            ),
          );
        return next(badRequest('Upload exactly one photo in the field "photo".'));
      }
      if (err) return next(badRequest('The upload could not be read. Try again.'));
      if (!req.file) return next(badRequest('Choose a photo to upload.'));
      next();
    });
  };
}

export type PhotoKind = { mime: 'image/jpeg' | 'image/png' | 'image/webp'; ext: 'jpg' | 'png' | 'webp' };

/** JPEG, PNG or WebP by their signatures (magic bytes); anything else is not accepted as a photo. */
export function photoKind(bytes: Buffer): PhotoKind | undefined {
  const starts = (sig: number[], at = 0) => sig.every((b, i) => bytes[at + i] === b);
  if (starts([0xff, 0xd8, 0xff])) return { mime: 'image/jpeg', ext: 'jpg' };
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { mime: 'image/png', ext: 'png' };
  if (starts([0x52, 0x49, 0x46, 0x46]) && starts([0x57, 0x45, 0x42, 0x50], 8))
    return { mime: 'image/webp', ext: 'webp' };
  return undefined;
}
