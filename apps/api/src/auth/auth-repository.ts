import { and, eq, gt, inArray, isNotNull, isNull, ne, sql } from 'drizzle-orm';
import type { Role } from '@batchproof/shared';
import type { Database } from '../db/database';
import { passwordResets, refreshSessions, signUpRequests, users, workshops } from '../db/schema';
import type { AuthUser } from './authenticate';

const authUserColumns = {
  id: users.id,
  workshopId: users.workshopId,
  role: users.role,
  name: users.name,
  email: users.email,
  tokenVersion: users.tokenVersion,
};

/** A member as the session code reads them: with the version their access tokens must carry. */
export type SessionUser = AuthUser & { tokenVersion: number };

export async function findUserById(db: Database, id: string): Promise<SessionUser | undefined> {
  const [row] = await db.select(authUserColumns).from(users).where(eq(users.id, id));
  return row;
}

export async function findUserByEmail(db: Database, email: string) {
  const [row] = await db
    .select({ ...authUserColumns, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, email));
  return row;
}

export async function findWorkshop(db: Database, id: string) {
  const [row] = await db
    .select({ id: workshops.id, name: workshops.name })
    .from(workshops)
    .where(eq(workshops.id, id));
  return row;
}

export async function createWorkshopWithOwner(
  db: Database,
  input: { workshopName: string; name: string; email: string; passwordHash: string },
): Promise<SessionUser> {
  return db.transaction(async (tx) => {
    const [workshop] = await tx.insert(workshops).values({ name: input.workshopName }).returning();
    const [user] = await tx
      .insert(users)
      .values({
        workshopId: workshop!.id,
        email: input.email,
        name: input.name,
        passwordHash: input.passwordHash,
        role: 'owner' satisfies Role,
      })
      .returning(authUserColumns);
    return user!;
  });
}

export async function insertRefreshSession(
  db: Database,
  row: { userId: string; workshopId: string; familyId: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(refreshSessions).values(row);
}

/**
 * Marks a live refresh session used and returns it; undefined when the token is unknown,
 * expired or already revoked. The update is the claim, so a token can be spent once.
 */
export async function spendRefreshSession(db: Database, tokenHash: string) {
  const [row] = await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(refreshSessions.tokenHash, tokenHash),
        isNull(refreshSessions.revokedAt),
        gt(refreshSessions.expiresAt, new Date()),
      ),
    )
    .returning({
      userId: refreshSessions.userId,
      workshopId: refreshSessions.workshopId,
      familyId: refreshSessions.familyId,
    });
  return row;
}

/**
 * When `tokenHash` names a token that was already spent or revoked, revokes every live session of
 * its family: a replayed token means it was copied, and the copy may be the one still in use.
 * Returns how many sessions it ended.
 */
export async function revokeFamilyOfSpentToken(db: Database, tokenHash: string) {
  const family = db
    .select({ familyId: refreshSessions.familyId })
    .from(refreshSessions)
    .where(and(eq(refreshSessions.tokenHash, tokenHash), isNotNull(refreshSessions.revokedAt)));
  const ended = await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(and(inArray(refreshSessions.familyId, family), isNull(refreshSessions.revokedAt)))
    .returning({ id: refreshSessions.id });
  return ended.length;
}

export async function revokeRefreshSession(db: Database, tokenHash: string) {
  await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(and(eq(refreshSessions.tokenHash, tokenHash), isNull(refreshSessions.revokedAt)));
}

/**
 * Ends every session of a user: revokes their refresh tokens and raises their token version, so
 * the access tokens already handed out fail on their next request. Run inside the caller's
 * transaction when it goes with another change (a new password).
 */
export async function endAllSessionsOfUser(db: Database, userId: string) {
  await db
    .update(users)
    .set({ tokenVersion: sql`${users.tokenVersion} + 1` })
    .where(eq(users.id, userId));
  await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(and(eq(refreshSessions.userId, userId), isNull(refreshSessions.revokedAt)));
}

export async function insertPasswordReset(
  db: Database,
  row: { userId: string; workshopId: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(passwordResets).values(row);
}

/**
 * Spends a live reset token, sets the new password, spends the user's other reset links and ends
 * all their sessions, in one transaction.
 */
export async function completePasswordReset(db: Database, tokenHash: string, passwordHash: string) {
  return db.transaction(async (tx) => {
    const now = new Date();
    const [reset] = await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(
        and(
          eq(passwordResets.tokenHash, tokenHash),
          isNull(passwordResets.usedAt),
          gt(passwordResets.expiresAt, now),
        ),
      )
      .returning({ id: passwordResets.id, userId: passwordResets.userId });
    if (!reset) return undefined;
    await tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId));
    await tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(
        and(
          eq(passwordResets.userId, reset.userId),
          ne(passwordResets.id, reset.id),
          isNull(passwordResets.usedAt),
        ),
      );
    await endAllSessionsOfUser(tx, reset.userId);
    return reset;
  });
}

export async function insertSignUpRequest(
  db: Database,
  row: {
    email: string;
    name: string;
    workshopName: string;
    passwordHash: string;
    tokenHash: string;
    expiresAt: Date;
  },
) {
  await db.insert(signUpRequests).values(row);
}

/** Marks a live sign-up request used and returns it; undefined when unknown, expired or used. */
export async function spendSignUpRequest(db: Database, tokenHash: string) {
  const now = new Date();
  const [row] = await db
    .update(signUpRequests)
    .set({ usedAt: now })
    .where(
      and(
        eq(signUpRequests.tokenHash, tokenHash),
        isNull(signUpRequests.usedAt),
        gt(signUpRequests.expiresAt, now),
      ),
    )
    .returning({
      email: signUpRequests.email,
      name: signUpRequests.name,
      workshopName: signUpRequests.workshopName,
      passwordHash: signUpRequests.passwordHash,
    });
  return row;
}
