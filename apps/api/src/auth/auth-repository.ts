import { and, asc, eq, gt, inArray, isNotNull, isNull, ne, sql } from 'drizzle-orm';
import type { Membership, Role } from '@batchproof/shared';
import type { Database } from '../db/database';
import {
  memberships,
  passwordResets,
  refreshSessions,
  signUpRequests,
  users,
  workshops,
} from '../db/schema';
import type { AuthUser } from './authenticate';

/** A person in one of their workshops: the user's columns with that membership's role. */
const authUserColumns = {
  id: users.id,
  workshopId: memberships.workshopId,
  role: memberships.role,
  name: users.name,
  email: users.email,
  tokenVersion: users.tokenVersion,
};

/** A member as the session code reads them: with the version their access tokens must carry. */
export type SessionUser = AuthUser & { tokenVersion: number };

/** People in their workshops: one row per membership. */
const sessionUsers = (db: Database) =>
  db.select(authUserColumns).from(memberships).innerJoin(users, eq(users.id, memberships.userId));

/** The user as a member of one workshop; undefined when they are not (or no longer) a member. */
export async function findSessionUser(
  db: Database,
  userId: string,
  workshopId: string,
): Promise<SessionUser | undefined> {
  const [row] = await sessionUsers(db).where(
    and(eq(memberships.userId, userId), eq(memberships.workshopId, workshopId)),
  );
  return row;
}

/**
 * The user in the workshop they worked in last (latest `last_active_at`; never-opened
 * memberships after those, oldest first); undefined when they belong to no workshop.
 */
export async function findLatestSessionUser(
  db: Database,
  userId: string,
): Promise<SessionUser | undefined> {
  const [row] = await sessionUsers(db)
    .where(eq(memberships.userId, userId))
    .orderBy(
      sql`${memberships.lastActiveAt} desc nulls last`,
      asc(memberships.createdAt),
      asc(memberships.workshopId),
    )
    .limit(1);
  return row;
}

/** Every workshop the user belongs to, by workshop name. */
export async function listMemberships(db: Database, userId: string): Promise<Membership[]> {
  return db
    .select({
      workshopId: memberships.workshopId,
      workshopName: workshops.name,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(workshops, eq(workshops.id, memberships.workshopId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workshops.name), asc(workshops.id));
}

/** Records that the user works in this workshop now, so their next sign-in opens it. */
export async function touchMembership(db: Database, userId: string, workshopId: string) {
  await db
    .update(memberships)
    .set({ lastActiveAt: new Date() })
    .where(and(eq(memberships.userId, userId), eq(memberships.workshopId, workshopId)));
}

/** The account an e-mail names, with its password hash; undefined when there is none. */
export async function findUserByEmail(db: Database, email: string) {
  const [row] = await db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      tokenVersion: users.tokenVersion,
      passwordHash: users.passwordHash,
    })
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
      .values({ email: input.email, name: input.name, passwordHash: input.passwordHash })
      .returning();
    const role: Role = 'owner';
    await tx
      .insert(memberships)
      .values({ workshopId: workshop!.id, userId: user!.id, role, lastActiveAt: new Date() });
    return {
      id: user!.id,
      workshopId: workshop!.id,
      role,
      name: user!.name,
      email: user!.email,
      tokenVersion: user!.tokenVersion,
    };
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
 * With `userId`, only that user's session is spent.
 */
export async function spendRefreshSession(db: Database, tokenHash: string, userId?: string) {
  const [row] = await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(refreshSessions.tokenHash, tokenHash),
        isNull(refreshSessions.revokedAt),
        gt(refreshSessions.expiresAt, new Date()),
        userId === undefined ? undefined : eq(refreshSessions.userId, userId),
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
