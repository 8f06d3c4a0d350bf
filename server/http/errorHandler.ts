import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ApiErrorBody } from '../../src/contract/apiError';
import { HttpError, notFound } from './httpError';

type BodyParserError = Error & { type?: string; status?: number; expose?: boolean };

function fromBodyParser(err: BodyParserError): HttpError | undefined {
  switch (err.type) {
    case 'entity.too.large':
      return new HttpError(413, 'too_large', 'The request is too large. Send fewer items at once.');
    case 'entity.parse.failed':
      return new HttpError(400, 'bad_json', 'The request body is not valid JSON.');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new HttpError(
        415,
        'unsupported_encoding',
        'The request uses an encoding the server does not read.',
      );
    default:
      return undefined;
  }
}

/** A 4xx a library attached to its error: the request's fault, never logged as the server's. */
const isClientStatus = (status: unknown): status is number =>
  typeof status === 'number' && status >= 400 && status < 500;

export const routeNotFound: RequestHandler = (req, _res, next) => {
  next(notFound(`Nothing is at ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

/**
 * What a failure is answered with: its own status when it is the request's fault, else a 500
 * whose details are only logged (`where`: the request's method and address).
 */
export function httpErrorOf(err: unknown, where: string): HttpError {
  if (err instanceof HttpError) return err;
  const parserError = err instanceof Error ? fromBodyParser(err as BodyParserError) : undefined;
  if (parserError) return parserError;
  // The router could not decode a %-escape in the address (`/api/photos/%zz`).
  if (err instanceof URIError)
    return new HttpError(400, 'bad_address', 'The address has a broken %-escape. Check the link.');
  if (err instanceof Error && isClientStatus((err as BodyParserError).status)) {
    const status = (err as BodyParserError).status!;
    const message = (err as BodyParserError).expose ? err.message : 'The request could not be read.';
    return new HttpError(status, 'bad_request', message);
  }
  console.error(`Unexpected error on ${where}:`, err);
  return new HttpError(
    500,
    'internal',
    'Something went wrong on the server. Try again; if it keeps happening, tell the organizer.',
  );
}

/** The body of every failure: `{error: {code, message}}`, with the fields a 400 names. */
export const errorBody = (httpError: HttpError): ApiErrorBody => ({
  error: {
    code: httpError.code,
    message: httpError.message,
    ...(httpError.fields ? { fields: httpError.fields } : {}),
  },
});

/** Turns every failure into `{error: {code, message}}` with a fitting status; hides internals on 5xx. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  const httpError = httpErrorOf(err, `${req.method} ${req.originalUrl}`);
  // A failure in the middle of a streamed answer (a printout): the status is long sent, so the
  // connection is cut and the reader sees an incomplete file rather than a second answer.
  if (res.headersSent) {
    res.destroy();
    return;
  }
  res.status(httpError.status).json(errorBody(httpError));
};
