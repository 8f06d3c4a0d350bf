import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError, badRequest } from './httpError';

/**
 * One CSV file in the `file` field, kept in memory (never written to disk), size-limited.
 * Spreadsheet programs label CSV files differently, so the name's ending is what decides.
 */
export function csvUpload(maxBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 6 },
    fileFilter(_req, file, done) {
      const csvName = /\.csv$/i.test(file.originalname);
      const csvType = [
        'text/csv',
        'application/csv',
        'text/plain',
        'application/vnd.ms-excel',
        'application/octet-stream',
        '',
      ].includes(file.mimetype);
      if (csvName && csvType) done(null, true);
      else
        done(
          new HttpError(
            415,
            'not_csv',
            'Upload a CSV file (a name ending in .csv). In a spreadsheet, use "Save as" and choose CSV.',
          ),
        );
    },
  }).single('file');

  return (req, res, next) => {
    if (!req.is('multipart/form-data'))
      return next(badRequest('Send the CSV file as a form upload in the field "file".'));
    upload(req, res, (err: unknown) => {
      if (err instanceof HttpError) return next(err);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new HttpError(
              413,
              'too_large',
              `The file is larger than ${Math.round(maxBytes / 1024)} KB. Split it and upload the parts one at a time.`,
            ),
          );
        return next(badRequest('Upload exactly one CSV file in the field "file".'));
      }
      if (err) return next(badRequest('The upload could not be read. Try again.'));
      if (!req.file) return next(badRequest('Choose a CSV file to upload.'));
      next();
    });
  };
}
