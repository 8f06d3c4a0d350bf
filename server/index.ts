import { networkInterfaces } from 'node:os';
import { readConfig } from './config';
import { migrate, openDb } from './db';
import { createApp } from './app';
import { seedDemoIfEmpty } from './demo/seedDemo';
import { DEMO_ARCHER_EMAIL, DEMO_JUDGES, DEMO_ORGANIZER, DEMO_PASSWORD } from './demo/demoPeople';
import { APP_VERSION } from './version';
import { loadAuthSecret } from './auth/secret';
import { startMailCatcher } from './mail/mailCatcher';
import { createMailer } from './mail/mailer';
import { loadSigningKeys } from './signing/serverKeys';

/** Addresses phones on the same field network can use. */
function lanAddresses(): string[] {
  return Object.values(networkInterfaces())
    .flat()
    .filter((a) => a && a.family === 'IPv4' && !a.internal)
    .map((a) => a!.address);
}

async function main(): Promise<void> {
  const config = readConfig();
  const db = openDb(config.databaseFile);
  await migrate(db);
  const signingKeys = await loadSigningKeys(config.dataDir, config.signingKeyJwk);
  const seeded = config.demoSeed ? await seedDemoIfEmpty(db, signingKeys) : false;

  const secret = loadAuthSecret(config.dataDir, config.authSecret);
  // Without a real SMTP server, mail goes to the app's own catcher and can be read in the app.
  const catcher = config.smtpUrl ? undefined : await startMailCatcher(db, config.mailCatcherPort);
  const mailer = createMailer(config.smtpUrl ?? catcher!.smtpUrl, config.mailFrom);

  const app = createApp({
    db,
    version: APP_VERSION,
    secret,
    mailer,
    mailCaught: !config.smtpUrl,
    dataDir: config.dataDir,
    signingKeys,
    ...(config.publicUrl ? { publicUrl: config.publicUrl } : {}),
    clientDir: config.clientDir,
    logRequests: config.logRequests,
    trustProxy: config.trustProxy,
  });
  const server = app.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    const lines = [
      `Ringcall ${APP_VERSION} is running.`,
      `  Open:      http://localhost:${port}/`,
      ...lanAddresses().map((ip) => `  On the field network: http://${ip}:${port}/`),
      `  Database:  ${config.databaseFile}`,
      `  Signing:   ${config.signingKeyJwk ? 'key from SIGNING_KEY_JWK' : `key in ${config.dataDir}`} (public half at /.well-known/jwks.json; back it up with the database)`,
      catcher
        ? `  Mail:      caught locally (SMTP on 127.0.0.1:${catcher.port}); read it in the app under "Caught mail"`
        : '  Mail:      sent through SMTP_URL',
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
  });

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
