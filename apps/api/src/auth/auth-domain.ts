import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { SignIn, SignUp, User } from '@batchproof/shared';
import { AppError, conflict } from '../core/app-error';
import type { Database } from '../db/database';
import { accountExistsMail, confirmSignUpMail, passwordResetMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import { hashToken, newOpaqueToken, signAccessToken } from './access-tokens';
import * as repo from './auth-repository';
import type { AuthUser } from './authenticate';

/** bcrypt cost factor for stored passwords. */
export const BCRYPT_COST = 12;
const RESET_MINUTES = 60;
const SIGN_UP_HOURS = 24;

/** A hash to compare against when the e-mail is unknown, so timing does not reveal accounts. */
const decoyHash = bcrypt.hashSync('decoy-password-never-used', BCRYPT_COST);

export interface AuthConfig {
  jwtSecret: string;
  accessTokenSeconds: number;
  refreshTokenDays: number;
  appUrl: string;
}

export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_COST);

/** The signed-in person in their active workshop, with every workshop they belong to. */
export async function toUser(db: Database, u: AuthUser): Promise<User> {
  const memberships = await repo.listMemberships(db, u.id);
  const active = memberships.find((m) => m.workshopId === u.workshopId);
  const workshop = active
    ? { id: active.workshopId, name: active.workshopName }
    : (await repo.findWorkshop(db, u.workshopId))!;
  return { id: u.id, name: u.name, email: u.email, role: u.role, workshop, memberships };
}

/**
 * Issues an access token and a fresh refresh token for a user. A refresh continues its token's
 * family; a sign-in starts a new one. A member created a moment ago has token version 0.
 */
export async function issueSession(
  db: Database,
  config: AuthConfig,
  u: AuthUser & { tokenVersion?: number },
  familyId: string = randomUUID(),
) {
  const accessToken = signAccessToken(
    { sub: u.id, wid: u.workshopId, role: u.role, ver: u.tokenVersion ?? 0 },
    config.jwtSecret,
    config.accessTokenSeconds,
  );
  const refreshToken = newOpaqueToken();
  const refreshExpires = new Date(Date.now() + config.refreshTokenDays * 86_400_000);
  await repo.insertRefreshSession(db, {
    userId: u.id,
    workshopId: u.workshopId,
    familyId,
    tokenHash: hashToken(refreshToken),
    expiresAt: refreshExpires,
  });
  return {
    session: { accessToken, expiresIn: config.accessTokenSeconds, user: await toUser(db, u) },
    refreshToken,
    refreshExpires,
  };
}

/**
 * Starts a sign-up. A new address gets a confirmation link (the workshop is created when it is
 * opened); an address that already has an account gets a note to its owner instead. The caller
 * answers before this runs, so neither the answer nor its timing says which happened.
 */
export async function requestSignUp(db: Database, mailer: Mailer, appUrl: string, input: SignUp) {
  const existing = await repo.findUserByEmail(db, input.email);
  if (existing) {
    await mailer.send(
      accountExistsMail({ to: existing.email, resetLink: `${appUrl}/reset-password` }),
    );
    return;
  }
  const token = newOpaqueToken();
  await repo.insertSignUpRequest(db, {
    email: input.email,
    name: input.name,
    workshopName: input.workshopName,
    passwordHash: await hashPassword(input.password),
    tokenHash: hashToken(token),
    expiresAt: new Date(Date.now() + SIGN_UP_HOURS * 3_600_000),
  });
  await mailer.send(
    confirmSignUpMail({
      to: input.email,
      workshopName: input.workshopName,
      link: `${appUrl}/confirm-sign-up/${encodeURIComponent(token)}`,
      hours: SIGN_UP_HOURS,
    }),
  );
}

const spentLink = (what: string) =>
  new AppError(400, 'validation_failed', `This ${what} link has expired or was already used.`, {
    token: [`This ${what} link has expired or was already used. Ask for a new one.`],
  });

/**
 * Creates the workshop and its owner from a confirmed sign-up link, once. Whoever holds the link
 * owns the address, so telling them it already has an account reveals nothing.
 */
export async function confirmSignUp(db: Database, token: string) {
  return db.transaction(async (tx) => {
    const request = await repo.spendSignUpRequest(tx, hashToken(token));
    if (!request) throw spentLink('sign-up');
    if (await repo.findUserByEmail(tx, request.email)) {
      throw conflict('An account with this e-mail already exists. Sign in instead.', {
        email: ['An account with this e-mail already exists.'],
      });
    }
    return repo.createWorkshopWithOwner(tx, request);
  });
}

/** Whether `password` is the account's; compares against a decoy when there is no account. */
export async function passwordMatches(
  account: { passwordHash: string } | undefined,
  password: string,
) {
  const ok = await bcrypt.compare(password, account?.passwordHash ?? decoyHash);
  return ok && account !== undefined;
}

/**
 * Checks an e-mail and password and answers the user in the workshop they worked in last
 * (which this sign-in marks as worked in now).
 */
export async function verifyCredentials(db: Database, input: SignIn): Promise<repo.SessionUser> {
  const found = await repo.findUserByEmail(db, input.email);
  const ok = await passwordMatches(found, input.password);
  const user = found && ok ? await repo.findLatestSessionUser(db, found.id) : undefined;
  if (!user) {
    throw new AppError(401, 'unauthenticated', 'That e-mail and password do not match an account.');
  }
  await repo.touchMembership(db, user.id, user.workshopId);
  return user;
}

/**
 * Moves the signed-in user to another of their workshops: marks it worked in now and spends the
 * refresh token they presented (if it is theirs and live), so the new session continues its
 * family. Refused with a field error when they are not a member there.
 */
export async function switchWorkshop(
  db: Database,
  actor: AuthUser,
  workshopId: string,
  refreshToken: string | undefined,
) {
  const user = await repo.findSessionUser(db, actor.id, workshopId);
  if (!user) {
    throw new AppError(400, 'validation_failed', 'You are not a member of that workshop.', {
      workshopId: ['Choose one of your workshops.'],
    });
  }
  await repo.touchMembership(db, user.id, workshopId);
  const spent = refreshToken
    ? await repo.spendRefreshSession(db, hashToken(refreshToken), actor.id)
    : undefined;
  return { user, familyId: spent?.familyId };
}

const sessionEnded = () =>
  new AppError(401, 'unauthenticated', 'Your session has ended. Sign in again.');

/**
 * Spends a refresh token and returns its user and token family. A token that was already spent
 * is refused and ends every session of its family (whoever replays it holds a copy).
 */
export async function refresh(db: Database, token: string | undefined) {
  if (!token) throw sessionEnded();
  const spent = await repo.spendRefreshSession(db, hashToken(token));
  if (!spent) {
    await repo.revokeFamilyOfSpentToken(db, hashToken(token));
    throw sessionEnded();
  }
  // The session stays in its workshop, as long as the user is still a member there.
  const user = await repo.findSessionUser(db, spent.userId, spent.workshopId);
  if (!user) throw sessionEnded();
  return { user, familyId: spent.familyId };
}

export async function signOut(db: Database, token: string | undefined) {
  if (token) await repo.revokeRefreshSession(db, hashToken(token));
}

/** Ends every session of the user on every device, access tokens included. */
export async function signOutEverywhere(db: Database, userId: string) {
  await db.transaction((tx) => repo.endAllSessionsOfUser(tx, userId));
}

/**
 * Sends a reset link when the account exists. The caller answers before this runs, so the
 * answer and its timing are the same either way.
 */
export async function requestPasswordReset(
  db: Database,
  mailer: Mailer,
  appUrl: string,
  email: string,
) {
  const account = await repo.findUserByEmail(db, email);
  // A reset row belongs to a membership: the one the user worked in last.
  const user = account && (await repo.findLatestSessionUser(db, account.id));
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

/** Sets the new password; spends this and every other reset link and ends all sessions. */
export async function completePasswordReset(db: Database, token: string, password: string) {
  const done = await repo.completePasswordReset(db, hashToken(token), await hashPassword(password));
  if (!done) throw spentLink('reset');
}
