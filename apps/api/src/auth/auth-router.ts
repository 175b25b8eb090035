import { Router, type CookieOptions, type Response } from 'express';
import {
  type EmailSent,
  passwordResetCompleteSchema,
  passwordResetRequestSchema,
  signInSchema,
  signUpConfirmSchema,
  signUpSchema,
  switchWorkshopSchema,
  tokenSchema,
} from '@batchproof/shared';
import { runAfterAnswer } from '../core/after-answer';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import { acceptInvitation, previewInvitation } from '../members/members-domain';
import * as auth from './auth-domain';
import type { Authenticator } from './authenticate';
import type { RateLimits } from './rate-limits';

/** Name and path of the httpOnly cookie that carries the refresh token. */
export const REFRESH_COOKIE = 'bp_refresh';
const REFRESH_PATH = '/api/auth';

export interface AuthRouterDeps {
  db: Database;
  mailer: Mailer;
  authn: Authenticator;
  limits: RateLimits;
  config: auth.AuthConfig & { secureCookies: boolean };
}

export function authRouter({ db, mailer, authn, limits, config }: AuthRouterDeps): Router {
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
    familyId?: string,
  ) => {
    const { session, refreshToken, refreshExpires } = await auth.issueSession(
      db,
      config,
      user,
      familyId,
    );
    res.cookie(REFRESH_COOKIE, refreshToken, cookieOptions(refreshExpires));
    res.status(status).json(session);
  };

  const clearRefreshCookie = (res: Response) => res.clearCookie(REFRESH_COOKIE, cookieOptions());

  // Answers at once and sends the confirmation (or, for a known address, a note to its owner)
  // afterwards, so the answer and its timing never say whether the address has an account.
  router.post('/sign-up', ...limits.signUp, async (req, res) => {
    const input = parse(signUpSchema, req.body);
    res.status(202).json({
      message: `We sent a link to ${input.email}. Open it to confirm the address and set up your workshop.`,
    } satisfies EmailSent);
    runAfterAnswer('sign-up mail', () => auth.requestSignUp(db, mailer, config.appUrl, input));
  });

  router.post('/sign-up/confirm', ...limits.linkToken, async (req, res) => {
    const { token } = parse(signUpConfirmSchema, req.body);
    await respondWithSession(res, await auth.confirmSignUp(db, token), 201);
  });

  router.post('/sign-in', ...limits.signIn, async (req, res) => {
    const input = parse(signInSchema, req.body);
    await respondWithSession(res, await auth.verifyCredentials(db, input));
  });

  router.post('/refresh', ...limits.refresh, async (req, res) => {
    const { user, familyId } = await auth.refresh(db, req.cookies?.[REFRESH_COOKIE]);
    await respondWithSession(res, user, 200, familyId);
  });

  // Works in another of the user's workshops from now on: a new access token naming it, and a
  // refresh cookie (same family as the one presented) that keeps the session there.
  router.post('/workshop', ...limits.refresh, authn.authenticate, async (req, res) => {
    const { workshopId } = parse(switchWorkshopSchema, req.body);
    const { user, familyId } = await auth.switchWorkshop(
      db,
      req.user!,
      workshopId,
      req.cookies?.[REFRESH_COOKIE],
    );
    await respondWithSession(res, user, 200, familyId);
  });

  router.post('/sign-out', async (req, res) => {
    await auth.signOut(db, req.cookies?.[REFRESH_COOKIE]);
    clearRefreshCookie(res);
    res.status(204).end();
  });

  router.post('/sign-out-everywhere', authn.authenticate, async (req, res) => {
    await auth.signOutEverywhere(db, req.user!.id);
    clearRefreshCookie(res);
    res.status(204).end();
  });

  router.get('/invitations/:token', ...limits.linkToken, async (req, res) => {
    res.json(await previewInvitation(db, parse(tokenSchema, req.params.token)));
  });

  router.post('/invitations/accept', ...limits.linkToken, async (req, res) => {
    await respondWithSession(res, await acceptInvitation(db, req.body), 201);
  });

  // Answers before looking the address up: the same answer in the same time either way.
  router.post('/password-reset/request', ...limits.passwordReset, async (req, res) => {
    const { email } = parse(passwordResetRequestSchema, req.body);
    res.status(202).json({
      message: 'If an account uses that e-mail, a reset link is on its way.',
    } satisfies EmailSent);
    runAfterAnswer('password-reset mail', () =>
      auth.requestPasswordReset(db, mailer, config.appUrl, email),
    );
  });

  router.post('/password-reset/complete', ...limits.linkToken, async (req, res) => {
    const input = parse(passwordResetCompleteSchema, req.body);
    await auth.completePasswordReset(db, input.token, input.password);
    res.status(204).end();
  });

  return router;
}

/** `GET /api/me`: the signed-in user, their active workshop and role, and all their workshops. */
export function meRouter({ db, authn }: Pick<AuthRouterDeps, 'db' | 'authn'>): Router {
  const router = Router();
  router.get('/', authn.authenticate, async (req, res) => {
    res.json(await auth.toUser(db, req.user!));
  });
  return router;
}
