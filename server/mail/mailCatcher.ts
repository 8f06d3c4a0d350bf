import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Db } from '../db';
import { nowIso } from '../time';

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export type MailCatcher = { port: number; smtpUrl: string; close: () => Promise<void> };

/**
 * A local SMTP server inside the app for the demo, development and tests: it accepts every
 * message on loopback and keeps it in the database, where organizers can read it.
 */
export async function startMailCatcher(db: Db, port = 0): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        simpleParser(raw)
          .then((parsed) =>
            db('caught_mail').insert({
              mail_from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              mail_to: session.envelope.rcptTo.map((r) => r.address).join(', '),
              subject: (parsed.subject ?? '(no subject)').slice(0, 300),
              text_body: parsed.text ?? '',
              raw,
              received_at: nowIso(),
            }),
          )
          .then(() => callback(), callback);
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    smtpUrl: `smtp://127.0.0.1:${address.port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
