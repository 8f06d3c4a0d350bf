import type { AddressInfo } from 'node:net';
import { readConfig } from './config';
import { migrate, openDb } from './db';
import { createApp } from './app';
import { createFieldServer } from './http/fieldServer';
import { seedDemoIfEmpty } from './demo/seedDemo';
import { DEMO_ARCHER_EMAIL, DEMO_JUDGES, DEMO_ORGANIZER, DEMO_PASSWORD } from './demo/demoPeople';
import { APP_VERSION } from './version';
import { loadAuthSecret } from './auth/secret';
import { lanAddresses, linkAddressLine, resolveLinkAddress } from './linkAddress';
import { loadMailInboxKey } from './mail/inboxKey';
import { setUpMail } from './mail/setUpMail';
import { loadSigningKeys } from './services/signing/serverKeys';

async function main(): Promise<void> {
  const config = readConfig();
  const db = openDb(config.databaseFile);
  await migrate(db);
  const signingKeys = await loadSigningKeys(config.dataDir, config.signingKeyJwk);
  const seeded = config.demoSeed ? await seedDemoIfEmpty(db, signingKeys) : false;

  const secret = loadAuthSecret(config.dataDir, config.authSecret);
  const { mailer, catcher } = await setUpMail(db, config);
  const mailInboxKey = catcher ? loadMailInboxKey(config.dataDir, config.mailInboxSecret) : undefined;

  // The port is known only once listening (PORT=0 picks one), and links need it: listen, then serve.
  const server = createFieldServer();
  await new Promise<void>((resolve) => server.listen(config.port, config.host, resolve));
  const port = (server.address() as AddressInfo).port;
  const linkAddress = resolveLinkAddress({ publicUrl: config.publicUrl, host: config.host, port });
  const app = createApp({
    db,
    version: APP_VERSION,
    secret,
    mailer,
    ...(mailInboxKey ? { mailInboxKey } : {}),
    dataDir: config.dataDir,
    signingKeys,
    linkAddress,
    clientDir: config.clientDir,
    logRequests: config.logRequests,
    trustProxy: config.trustProxy,
  });
  server.on('request', app);

  const mailLine = {
    smtp: '  Mail:      sent through SMTP_URL',
    off: '  Mail:      ▲ OFF (no SMTP_URL, and the catcher is off, as in production): invitations and confirmations cannot be sent. Set SMTP_URL, or MAIL_CATCHER=on for a trial.',
    catcher: `  Mail:      caught, not sent (SMTP on 127.0.0.1:${catcher?.port}). Only you, the operator, read it:\n  Mail inbox: ${linkAddress.url}/operator/mail#key=${mailInboxKey} (keep this address to yourself)`,
  }[config.mail];
  const lines = [
    `Ringcall ${APP_VERSION} is running.`,
    `  Open:      http://localhost:${port}/`,
    ...(config.host === '0.0.0.0'
      ? lanAddresses().map((ip) => `  On the field network: http://${ip}:${port}/`)
      : []),
    linkAddressLine(linkAddress),
    `  Database:  ${config.databaseFile}`,
    `  Signing:   ${config.signingKeyJwk ? 'key from SIGNING_KEY_JWK' : `key in ${config.dataDir}`} (public half at /.well-known/jwks.json; back it up with the database)`,
    mailLine,
  ];
  if (config.demoSeed) {
    lines.push(
      seeded
        ? '  Demo event created (invented data).'
        : '  Demo sign-ins (if this database holds the demo event):',
      `    organizer  ${DEMO_ORGANIZER.email}`,
      ...DEMO_JUDGES.map((j) => `    judge      ${j.email}`),
      `    archer     ${DEMO_ARCHER_EMAIL()}`,
      `    password   ${DEMO_PASSWORD}`,
    );
  }
  console.log(lines.join('\n'));

  const stop = () => {
    server.close(() => {
      void Promise.all([db.destroy(), catcher?.close()]).then(() => process.exit(0));
    });
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
