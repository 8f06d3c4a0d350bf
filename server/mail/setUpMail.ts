import type { MailMode } from '../config';
import type { Db } from '../db';
import { HttpError } from '../http/httpError';
import { startMailCatcher, type MailCatcher } from './mailCatcher';
import { createMailer, type Mailer } from './mailer';

export type MailSetup = { mailer: Mailer; catcher: MailCatcher | undefined };

/** A server with neither SMTP_URL nor a catcher says so to whoever needed the mail. */
const noMail: Mailer = {
  send: () =>
    Promise.reject(
      new HttpError(
        503,
        'mail_off',
        'This server sends no mail: the person running it has not set a mail server (SMTP_URL). Ask them to set one up.',
      ),
    ),
};

/** Opens the way mail leaves the server, as the configuration says (see MailMode). */
export async function setUpMail(
  db: Db,
  settings: { mail: MailMode; smtpUrl: string | undefined; mailFrom: string; mailCatcherPort: number },
): Promise<MailSetup> {
  if (settings.mail === 'smtp')
    return { mailer: createMailer(settings.smtpUrl!, settings.mailFrom), catcher: undefined };
  if (settings.mail === 'off') return { mailer: noMail, catcher: undefined };
  const catcher = await startMailCatcher(db, settings.mailCatcherPort);
  return { mailer: createMailer(catcher.smtpUrl, settings.mailFrom), catcher };
}
