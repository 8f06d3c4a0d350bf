import type { IncomingMessage } from 'node:http';
import { HttpError } from './httpError';

const tooLarge = () => new HttpError(413, 'too_large', 'The request is too large. Send fewer items at once.');
const notJson = () => new HttpError(400, 'bad_json', 'The request body is not valid JSON.');
const cutOff = () =>
  new HttpError(400, 'cut_off', 'The request was cut off before all of it arrived. Send it again.');
const unreadable = () =>
  new HttpError(415, 'unsupported_encoding', 'The request uses an encoding the server does not read.');

/** `application/json`, with or without parameters. */
const JSON_TYPE = /^application\/json\s*(;|$)/i;
const CHARSET = /;\s*charset\s*=\s*"?([^";\s]+)/i;

/**
 * A request's JSON body as the API's JSON parser reads it (`express.json`, server/app.ts), for
 * the field lane, which answers before Express (server/routes/syncLane.ts): at most `limit`
 * bytes (413 beyond, nothing kept), UTF-8, an object or an array at the top (400 otherwise),
 * `undefined` when the body is not JSON, `{}` when there is none. A compressed body is refused (415):
 * the app's phones never send one.
 */
export function readJsonBody(req: IncomingMessage, limit: number): Promise<unknown> {
  const type = req.headers['content-type'] ?? '';
  if (!JSON_TYPE.test(type)) return Promise.resolve(undefined);
  const charset = CHARSET.exec(type)?.[1]?.toLowerCase();
  const encoding = (req.headers['content-encoding'] ?? 'identity').toLowerCase();
  if ((charset !== undefined && charset !== 'utf-8' && charset !== 'utf8') || encoding !== 'identity')
    return Promise.reject(unreadable());
  if (Number(req.headers['content-length'] ?? 0) > limit) return Promise.reject(tooLarge());
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    const onData = (chunk: Buffer) => {
      size += chunk.length;
      if (size <= limit) return void chunks.push(chunk);
      // The stream flows on, dropping the rest, while the 413 is sent.
      req.off('data', onData);
      chunks.length = 0;
      reject(tooLarge());
    };
    req.on('data', onData);
    // The phone went away, or the server cut off a request too slow to arrive (http/fieldServer.ts):
    // the request's doing, not the server's, as Express's parser counts it too.
    req.once('error', () => reject(cutOff()));
    req.once('end', () => {
      if (size > limit) return;
      const text = chunks.length === 1 ? chunks[0]!.toString('utf8') : Buffer.concat(chunks).toString('utf8');
      try {
        resolve(parseStrict(text));
      } catch (error) {
        reject(error);
      }
    });
  });
}

/** JSON.parse of an object or array at the top (the API's parser is strict), `{}` for nothing. */
function parseStrict(text: string): unknown {
  if (text.length === 0) return {};
  const first = /^[\s\uFEFF]*(.)/.exec(text)?.[1];
  if (first !== '{' && first !== '[') throw notJson();
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch {
    throw notJson();
  }
}
