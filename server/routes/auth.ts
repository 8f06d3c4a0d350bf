import { Router, type Request, type Response } from 'express';
import type { AuthSession } from '../../src/contract/auth';
import {
  acceptInvitationSchema,
  signInSchema,
  signUpSchema,
  verifyEmailSchema,
} from '../../src/contract/auth';
import type { AppContext } from '../context';
import { validateBody } from '../http/validate';
import { unauthorized } from '../http/httpError';
import { signAccessToken } from '../auth/tokens';
import { issueRefreshToken, revokeRefreshFamily, rotateRefreshToken } from '../auth/refreshTokens';
import { signInLimits, signUpLimit } from '../auth/rateLimits';
import {
  acceptInvitation,
  checkCredentials,
  loadMe,
  sendVerificationMail,
  signUp,
  toSessionUser,
  verifyEmail,
} from '../services/accounts';

const COOKIE = 'rc_refresh';
const COOKIE_PATH = '/api/auth';

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

  async function startSession(req: Request, res: Response, userId: number, status = 200) {
    const user = toSessionUser(await db('users').where({ id: userId }).first());
    setRefreshCookie(req, res, await issueRefreshToken(db, userId, req.get('user-agent') ?? ''));
    const access = await signAccessToken(secret, userId);
    const body: AuthSession = { accessToken: access.token, expiresAt: access.expiresAt, user };
    res.status(status).json(body);
  }

  router.post('/auth/sign-up', signUpLimit(), validateBody(signUpSchema), async (req, res) => {
    const user = await signUp(db, ctx.mailer, req.body, {
      bcryptCost: ctx.bcryptCost,
      baseUrl: ctx.linkAddress.url,
    });
    await startSession(req, res, user.id, 201);
  });

  router.post('/auth/sign-in', ...signInLimits(), validateBody(signInSchema), async (req, res) => {
    const user = await checkCredentials(db, req.body.email, req.body.password, ctx.bcryptCost);
    if (!user) throw unauthorized('The e-mail address or the password is not right.');
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
    const access = await signAccessToken(secret, rotated.userId);
    const user = toSessionUser(await db('users').where({ id: rotated.userId }).first());
    const body: AuthSession = { accessToken: access.token, expiresAt: access.expiresAt, user };
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

  router.get('/me', ctx.requireUser, async (req, res) => {
    res.json(await loadMe(db, req.user!));
  });

  router.post('/me/send-verification', ctx.requireUser, async (req, res) => {
    const row = await db('users').where({ id: req.user!.id }).first();
    await sendVerificationMail(db, ctx.mailer, row, ctx.linkAddress.url);
    res.status(202).json({ sent: true });
  });

  router.post(
    '/invitations/accept',
    ctx.requireUser,
    validateBody(acceptInvitationSchema),
    async (req, res) => {
      res.json(await acceptInvitation(db, req.body.token, req.user!.id));
    },
  );

  return router;
}
