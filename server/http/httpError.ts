/** An error that knows its HTTP status and a message a person can act on. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: { path: string; message: string }[],
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, fields?: { path: string; message: string }[]) =>
  new HttpError(400, 'bad_request', message, fields);
export const unauthorized = (message = 'Please sign in to continue.') =>
  new HttpError(401, 'unauthorized', message);
export const forbidden = (message = 'Your role in this event does not allow this.') =>
  new HttpError(403, 'forbidden', message);
export const notFound = (message = 'Nothing was found at this address.') =>
  new HttpError(404, 'not_found', message);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);
