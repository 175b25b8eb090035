import bcrypt from 'bcryptjs';
import type { SignIn, SignUp, User } from '@batchproof/shared';
import { AppError, conflict } from '../core/app-error';
import type { Database } from '../db/database';
import { passwordResetMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import { hashToken, newOpaqueToken, signAccessToken } from './access-tokens';
import * as repo from './auth-repository';
import type { AuthUser } from './authenticate';

/** bcrypt cost factor for stored passwords. */
export const BCRYPT_COST = 12;
const RESET_MINUTES = 60;

/** A hash to compare against when the e-mail is unknown, so timing does not reveal accounts. */
const decoyHash = bcrypt.hashSync('decoy-password-never-used', BCRYPT_COST);

export interface AuthConfig {
  jwtSecret: string;
  accessTokenSeconds: number;
  refreshTokenDays: number;
  appUrl: string;
}

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_COST);

export async function toUser(db: Database, u: AuthUser): Promise<User> {
  const workshop = await repo.findWorkshop(db, u.workshopId);
  return { id: u.id, name: u.name, email: u.email, role: u.role, workshop: workshop! };
}

/** Issues an access token and a fresh refresh token for a user. */
export async function issueSession(db: Database, config: AuthConfig, u: AuthUser) {
  const accessToken = signAccessToken(
    { sub: u.id, wid: u.workshopId, role: u.role },
    config.jwtSecret,
    config.accessTokenSeconds,
  );
  const refreshToken = newOpaqueToken();
  const refreshExpires = new Date(Date.now() + config.refreshTokenDays * 86_400_000);
  await repo.insertRefreshSession(db, {
    userId: u.id,
    workshopId: u.workshopId,
    tokenHash: hashToken(refreshToken),
    expiresAt: refreshExpires,
  });
  return {
    session: { accessToken, expiresIn: config.accessTokenSeconds, user: await toUser(db, u) },
    refreshToken,
    refreshExpires,
  };
}

export async function signUp(db: Database, input: SignUp): Promise<AuthUser> {
  if (await repo.findUserByEmail(db, input.email)) {
    throw conflict('An account with this e-mail already exists. Sign in instead.', {
      email: ['An account with this e-mail already exists.'],
    });
  }
  return repo.createWorkshopWithOwner(db, {
    workshopName: input.workshopName,
    name: input.name,
    email: input.email,
    passwordHash: await hashPassword(input.password),
  });
}

export async function verifyCredentials(db: Database, input: SignIn): Promise<AuthUser> {
  const found = await repo.findUserByEmail(db, input.email);
  const ok = await bcrypt.compare(input.password, found?.passwordHash ?? decoyHash);
  if (!found || !ok) {
    throw new AppError(401, 'unauthenticated', 'That e-mail and password do not match an account.');
  }
  const { passwordHash: _omit, ...user } = found;
  return user;
}

/** Spends a refresh token and returns its user; a reused or unknown token is refused. */
export async function refresh(db: Database, token: string | undefined): Promise<AuthUser> {
  const spent = token ? await repo.spendRefreshSession(db, hashToken(token)) : undefined;
  const user = spent ? await repo.findUserById(db, spent.userId) : undefined;
  if (!user || user.workshopId !== spent!.workshopId) {
    throw new AppError(401, 'unauthenticated', 'Your session has ended. Sign in again.');
  }
  return user;
}

export async function signOut(db: Database, token: string | undefined) {
  if (token) await repo.revokeRefreshSession(db, hashToken(token));
}

/** Sends a reset link when the account exists; answers the same either way. */
export async function requestPasswordReset(
  db: Database,
  mailer: Mailer,
  appUrl: string,
  email: string,
) {
  const user = await repo.findUserByEmail(db, email);
  if (!user) return;
  const token = newOpaqueToken();
  await repo.insertPasswordReset(db, {
    userId: user.id,
    workshopId: user.workshopId,
    tokenHash: hashToken(token),
    expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000),
  });
  const link = `${appUrl}/reset-password/${encodeURIComponent(token)}`;
  await mailer.send(passwordResetMail({ to: user.email, link, minutes: RESET_MINUTES }));
}

export async function completePasswordReset(db: Database, token: string, password: string) {
  const done = await repo.completePasswordReset(db, hashToken(token), await hashPassword(password));
  if (!done) {
    throw new AppError(
      400,
      'validation_failed',
      'This reset link has expired or was already used.',
      {
        token: ['This reset link has expired or was already used. Ask for a new one.'],
      },
    );
  }
}
