import { Router, type Request, type Response } from 'express';
import type { AuthSession, SignUpPending } from '../../src/contract/auth';
import {
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
  verifyEmailSchema,
} from '../../src/contract/auth';
import type { AppContext } from '../context';
import { validateBody } from '../http/validate';
import { unauthorized } from '../http/httpError';
import { signAccessToken } from '../auth/tokens';
import { issueRefreshToken, revokeRefreshFamily, rotateRefreshToken } from '../auth/refreshTokens';
import { forgotPasswordLimits, signUpLimit } from '../auth/rateLimits';
import { SignInThrottle } from '../auth/signInThrottle';
import { deviceCookies } from '../auth/deviceCookie';
import { tooManyAttempts } from '../auth/tooManyAttempts';
import { checkCredentials, signUp, toSessionUser, verifyEmail } from '../services/accounts';
import { forgotPassword, resetPassword } from '../services/passwordReset';

const COOKIE = 'rc_refresh';
const COOKIE_PATH = '/api/auth';

/** Secure whenever the request came over HTTPS (directly, or through a proxy named in TRUST_PROXY). */
function setRefreshCookie(req: Request, res: Response, token: string) {
  res.cookie(COOKIE, token, {
    httpOnly: true,
    sameSite: 'strict',
    secure: req.secure,
    path: COOKIE_PATH,
    maxAge: 30 * 24 * 3600 * 1000,
  });
}

export function authRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db, secret } = ctx;
  const throttle = new SignInThrottle();
  const devices = deviceCookies(secret);

  /** Signs this phone in: a refresh cookie, the phone remembered as the account's, an access token. */
  async function startSession(req: Request, res: Response, userId: number, status = 200) {
    const row = await db('users').where({ id: userId }).first();
    setRefreshCookie(req, res, await issueRefreshToken(db, userId, req.get('user-agent') ?? ''));
    devices.remember(req, res, row.email);
    const access = await signAccessToken(secret, userId, row.session_version);
    const body: AuthSession = {
      accessToken: access.token,
      expiresAt: access.expiresAt,
      user: toSessionUser(row),
    };
    res.status(status).json(body);
  }

  router.post('/auth/sign-up', signUpLimit(), validateBody(signUpSchema), async (req, res) => {
    const result = await signUp(db, ctx.mailer, req.body, {
      bcryptCost: ctx.bcryptCost,
      baseUrl: ctx.linkAddress.url,
    });
    if (result.kind === 'pending') {
      const body: SignUpPending = { confirmByMail: true, email: result.email };
      res.status(202).json(body);
      return;
    }
    await startSession(req, res, result.user.id, 201);
  });

  router.post('/auth/sign-in', validateBody(signInSchema), async (req, res) => {
    const { email, password } = req.body as { email: string; password: string };
    const keys = throttle.keys(email, req.ip, devices.knownDevice(req, email));
    const wait = throttle.wait(keys);
    if (wait) {
      throw tooManyAttempts(res, wait.ms, (time) =>
        wait.reason === 'account'
          ? `Too many wrong passwords for this account. Wait ${time} and try again, or choose "Forgot your password?".`
          : `Many sign-ins from this network have failed. Wait ${time} and try again.`,
      );
    }
    const user = await checkCredentials(db, email, password, ctx.bcryptCost);
    if (!user) {
      throttle.failed(keys);
      throw unauthorized('The e-mail address or the password is not right.');
    }
    throttle.succeeded(keys);
    await startSession(req, res, user.id);
  });

  router.post('/auth/refresh', async (req, res) => {
    const token = (req.cookies as Record<string, string> | undefined)?.[COOKIE];
    if (!token) throw unauthorized('Please sign in.');
    const rotated = await rotateRefreshToken(db, token, req.get('user-agent') ?? '');
    if (!rotated.ok) {
      res.clearCookie(COOKIE, { path: COOKIE_PATH });
      throw unauthorized('Your sign-in has ended. Please sign in again.');
    }
    setRefreshCookie(req, res, rotated.token);
    const row = await db('users').where({ id: rotated.userId }).first();
    const access = await signAccessToken(secret, rotated.userId, row.session_version);
    const body: AuthSession = {
      accessToken: access.token,
      expiresAt: access.expiresAt,
      user: toSessionUser(row),
    };
    res.json(body);
  });

  router.post('/auth/sign-out', async (req, res) => {
    const token = (req.cookies as Record<string, string> | undefined)?.[COOKIE];
    if (token) await revokeRefreshFamily(db, token);
    res.clearCookie(COOKIE, { path: COOKIE_PATH });
    res.status(204).end();
  });

  router.post('/auth/verify-email', validateBody(verifyEmailSchema), async (req, res) => {
    res.json({ user: await verifyEmail(db, req.body.token) });
  });

  // The same answer whether or not the address has an account, given before any mail is sent,
  // so neither the words nor the time taken tell.
  router.post(
    '/auth/forgot-password',
    validateBody(forgotPasswordSchema),
    ...forgotPasswordLimits(),
    (req, res) => {
      const email = (req.body as { email: string }).email;
      res.status(202).json({ sent: true });
      forgotPassword(db, ctx.mailer, email, ctx.linkAddress.url).catch((err: unknown) =>
        console.error('The password link could not be mailed:', err instanceof Error ? err.message : err),
      );
    },
  );

  router.post('/auth/reset-password', validateBody(resetPasswordSchema), async (req, res) => {
    const { userId } = await resetPassword(db, req.body, ctx.bcryptCost);
    await startSession(req, res, userId);
  });

  return router;
}
