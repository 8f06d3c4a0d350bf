import { resolve } from 'node:path';
import { z } from 'zod';

/** Everything the server reads from the environment, with defaults that work out of the box. */
const envSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('0.0.0.0'),
  DATABASE_FILE: z.string().default('data/ringcall.sqlite'),
  DATA_DIR: z.string().default('data'),
  CLIENT_DIR: z.string().default('dist'),
  PUBLIC_URL: z.string().url().optional(),
  DEMO_SEED: z.enum(['on', 'off']).default('on'),
  LOG_REQUESTS: z.enum(['on', 'off']).default('on'),
  AUTH_SECRET: z.string().min(32, 'use at least 32 characters').optional(),
  /** The private EC P-256 key that signs ends and cards, as a JWK; made in DATA_DIR when unset. */
  SIGNING_KEY_JWK: z.string().min(1).optional(),
  SMTP_URL: z.string().url().optional(),
  MAIL_FROM: z.string().default('Ringcall <no-reply@ringcall.local>'),
  MAIL_CATCHER_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  /** Catch mail instead of sending it: on by default, off by default when NODE_ENV=production. */
  MAIL_CATCHER: z.enum(['on', 'off']).optional(),
  /** The operator's key to the caught-mail inbox; made in DATA_DIR when unset. */
  MAIL_INBOX_SECRET: z.string().min(32, 'use at least 32 characters').optional(),
  NODE_ENV: z.string().optional(),
  TRUST_PROXY: z.string().optional(),
});

/**
 * Where mail goes: a real server (SMTP_URL), the app's own catcher, or nowhere. A production
 * server never catches mail unless asked to, so no inbox of other people's links is left open.
 */
export type MailMode = 'smtp' | 'catcher' | 'off';

/**
 * Express's `trust proxy` from TRUST_PROXY: off unless set, because a trusted proxy's
 * X-Forwarded-For decides the address every per-address limit counts under, and anyone can send
 * that header. A number is the count of proxies in front; anything else is Express's list of
 * addresses or subnets (e.g. `loopback`, `10.0.0.2`).
 */
export function trustProxySetting(value: string | undefined): boolean | number | string {
  const v = value?.trim() ?? '';
  if (v === '' || v === 'off' || v === 'false') return false;
  if (v === 'true') return true;
  return /^\d+$/.test(v) ? Number(v) : v;
}

export type ServerConfig = {
  port: number;
  host: string;
  databaseFile: string;
  dataDir: string;
  clientDir: string;
  publicUrl: string | undefined;
  demoSeed: boolean;
  logRequests: boolean;
  authSecret: string | undefined;
  signingKeyJwk: string | undefined;
  smtpUrl: string | undefined;
  mailFrom: string;
  mailCatcherPort: number;
  mail: MailMode;
  mailInboxSecret: string | undefined;
  trustProxy: boolean | number | string;
};

function mailMode(e: z.infer<typeof envSchema>): MailMode {
  if (e.SMTP_URL && e.MAIL_CATCHER === 'on')
    throw new Error(
      'Ringcall cannot start: set SMTP_URL to send real mail, or MAIL_CATCHER=on to catch it, not both.',
    );
  if (e.SMTP_URL) return 'smtp';
  const catcher = e.MAIL_CATCHER ?? (e.NODE_ENV === 'production' ? 'off' : 'on');
  return catcher === 'on' ? 'catcher' : 'off';
}

export function readConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Ringcall cannot start: the environment has bad settings:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    port: e.PORT,
    host: e.HOST,
    databaseFile: resolve(e.DATABASE_FILE),
    dataDir: resolve(e.DATA_DIR),
    clientDir: resolve(e.CLIENT_DIR),
    publicUrl: e.PUBLIC_URL,
    demoSeed: e.DEMO_SEED === 'on',
    logRequests: e.LOG_REQUESTS === 'on',
    authSecret: e.AUTH_SECRET,
    signingKeyJwk: e.SIGNING_KEY_JWK,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    mailCatcherPort: e.MAIL_CATCHER_PORT,
    mail: mailMode(e),
    mailInboxSecret: e.MAIL_INBOX_SECRET,
    trustProxy: trustProxySetting(e.TRUST_PROXY),
  };
}
