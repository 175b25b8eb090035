import { createSecretKey } from 'node:crypto';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Role } from '@batchproof/shared';
import { AppError, forbidden } from '../core/app-error';
import { isRecordId } from '../core/record-id';
import type { Database } from '../db/database';
import { JWT_ALGORITHM, JWT_AUDIENCE, JWT_ISSUER } from './access-tokens';
import { findSessionUser } from './auth-repository';

/**
 * The signed-in member, as handlers see it on `req.user`: the person in the workshop their
 * access token names (its `wid`), with the role they hold there.
 */
export interface AuthUser {
  id: string;
  workshopId: string;
  role: Role;
  name: string;
  email: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AuthUser {}
  }
}

/**
 * Builds the bearer-token authenticator. The user and their membership of the token's workshop
 * are loaded from the database on every request, so a removed member, a changed role or a raised
 * token version (password reset, sign out
 * everywhere) takes effect at once, not when the token expires.
 */
export function createAuthenticator(db: Database, secret: string) {
  const strategy = new JwtStrategy(
    {
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      // A key object prepared once: given the string, jsonwebtoken would first try to read it as
      // a PEM public key and then derive a secret key from it on every request (about 0.5 ms
      // against 0.01 ms). passport-jwt passes the key through; its types predate key objects.
      secretOrKey: createSecretKey(Buffer.from(secret, 'utf8')) as unknown as string,
      algorithms: [JWT_ALGORITHM],
      issuer: JWT_ISSUER,
      audience: JWT_AUDIENCE,
    },
    (
      payload: { sub?: string; wid?: string; ver?: number },
      done: (e: unknown, u?: AuthUser | false) => void,
    ) => {
      // A subject that is not a record id is no one: refused before it reaches a uuid column.
      if (!isRecordId(payload.sub) || !isRecordId(payload.wid)) return done(null, false);
      // The person as a member of the token's workshop: no membership there (removed, or never
      // a member) is no one. A token signed before the user's last password reset or sign-out
      // everywhere is refused.
      findSessionUser(db, payload.sub, payload.wid).then(
        (u) => {
          if (!u || u.tokenVersion !== (payload.ver ?? 0)) return done(null, false);
          const { tokenVersion: _version, ...user } = u;
          done(null, user);
        },
        (err) => done(err),
      );
    },
  );
  const instance = new passport.Passport();
  instance.use('jwt', strategy);

  const authenticate: RequestHandler = (req, res, next) => {
    instance.authenticate('jwt', { session: false }, (err: unknown, user: AuthUser | false) => {
      if (err) return next(err);
      if (!user) {
        return next(new AppError(401, 'unauthenticated', 'Sign in to continue.'));
      }
      req.user = user;
      next();
    })(req, res, next);
  };

  /** Authenticates, then lets through only the given roles (403 otherwise). */
  const allow = (roles: readonly Role[]): RequestHandler[] => [
    authenticate,
    (req, _res, next) => next(roles.includes(req.user!.role) ? undefined : forbidden()),
  ];

  return { authenticate, allow };
}

export type Authenticator = ReturnType<typeof createAuthenticator>;
