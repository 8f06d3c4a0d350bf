import nodemailer from 'nodemailer';

export type MailAttachment = { filename: string; content: Buffer; contentType: string };
export type MailMessage = { to: string; subject: string; text: string; attachments?: MailAttachment[] };

export type Mailer = { send: (message: MailMessage) => Promise<void> };

/** Sends through SMTP: a real server (SMTP_URL) or the app's own local catcher. */
export function createMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(message) {
      await transport.sendMail({ from, ...message });
    },
  };
}
