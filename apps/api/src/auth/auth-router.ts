import { Router, type CookieOptions, type Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import {
  acceptInvitationSchema,
  passwordResetCompleteSchema,
  passwordResetRequestSchema,
  signInSchema,
  signUpSchema,
  tokenSchema,
} from '@batchproof/shared';
import { AppError } from '../core/app-error';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import { acceptInvitation, previewInvitation } from '../members/members-domain';
import * as auth from './auth-domain';
import type { Authenticator } from './authenticate';

/** Name and path of the httpOnly cookie that carries the refresh token. */
export const REFRESH_COOKIE = 'bp_refresh';
const REFRESH_PATH = '/api/auth';

export interface AuthRouterDeps {
  db: Database;
  mailer: Mailer;
  authn: Authenticator;
  config: auth.AuthConfig & { signInLimit: number; secureCookies: boolean };
}

export function authRouter({ db, mailer, config }: AuthRouterDeps): Router {
  const router = Router();
  const cookieOptions = (expires?: Date): CookieOptions => ({
    httpOnly: true,
    sameSite: 'strict',
    secure: config.secureCookies,
    path: REFRESH_PATH,
    expires,
  });
  const respondWithSession = async (
    res: Response,
    user: Parameters<typeof auth.issueSession>[2],
    status = 200,
  ) => {
    const { session, refreshToken, refreshExpires } = await auth.issueSession(db, config, user);
    res.cookie(REFRESH_COOKIE, refreshToken, cookieOptions(refreshExpires));
    res.status(status).json(session);
  };

  // Counts failed and successful attempts per address and e-mail, so guessing one account's
  // password is slow without locking out a whole shared workshop network.
  const signInLimiter = rateLimit({
    windowMs: 15 * 60_000,
    limit: config.signInLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) =>
      `${ipKeyGenerator(req.ip ?? '')}|${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: (_req, _res, next) =>
      next(
        new AppError(
          429,
          'rate_limited',
          'Too many sign-in attempts. Wait a few minutes and try again.',
        ),
      ),
  });

  router.post('/sign-up', async (req, res) => {
    const input = parse(signUpSchema, req.body);
    await respondWithSession(res, await auth.signUp(db, input), 201);
  });

  router.post('/sign-in', signInLimiter, async (req, res) => {
    const input = parse(signInSchema, req.body);
    await respondWithSession(res, await auth.verifyCredentials(db, input));
  });

  router.post('/refresh', async (req, res) => {
    const user = await auth.refresh(db, req.cookies?.[REFRESH_COOKIE]);
    await respondWithSession(res, user);
  });

  router.post('/sign-out', async (req, res) => {
    await auth.signOut(db, req.cookies?.[REFRESH_COOKIE]);
    res.clearCookie(REFRESH_COOKIE, cookieOptions());
    res.status(204).end();
  });

  router.get('/invitations/:token', async (req, res) => {
    res.json(await previewInvitation(db, parse(tokenSchema, req.params.token)));
  });

  router.post('/invitations/accept', async (req, res) => {
    const input = parse(acceptInvitationSchema, req.body);
    await respondWithSession(res, await acceptInvitation(db, input), 201);
  });

  router.post('/password-reset/request', async (req, res) => {
    const { email } = parse(passwordResetRequestSchema, req.body);
    await auth.requestPasswordReset(db, mailer, config.appUrl, email);
    res
      .status(202)
      .json({ message: 'If an account uses that e-mail, a reset link is on its way.' });
  });

  router.post('/password-reset/complete', async (req, res) => {
    const input = parse(passwordResetCompleteSchema, req.body);
    await auth.completePasswordReset(db, input.token, input.password);
    res.status(204).end();
  });

  return router;
}

/** `GET /api/me`: the signed-in user, their workshop and role. */
export function meRouter({ db, authn }: Pick<AuthRouterDeps, 'db' | 'authn'>): Router {
  const router = Router();
  router.get('/', authn.authenticate, async (req, res) => {
    res.json(await auth.toUser(db, req.user!));
  });
  return router;
}
