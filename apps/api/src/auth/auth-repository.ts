import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Role } from '@batchproof/shared';
import type { Database } from '../db/database';
import { passwordResets, refreshSessions, users, workshops } from '../db/schema';
import type { AuthUser } from './authenticate';

const authUserColumns = {
  id: users.id,
  workshopId: users.workshopId,
  role: users.role,
  name: users.name,
  email: users.email,
};

export async function findUserById(db: Database, id: string): Promise<AuthUser | undefined> {
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
): Promise<AuthUser> {
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
  row: { userId: string; workshopId: string; tokenHash: string; expiresAt: Date },
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
    .returning({ userId: refreshSessions.userId, workshopId: refreshSessions.workshopId });
  return row;
}

export async function revokeRefreshSession(db: Database, tokenHash: string) {
  await db
    .update(refreshSessions)
    .set({ revokedAt: new Date() })
    .where(and(eq(refreshSessions.tokenHash, tokenHash), isNull(refreshSessions.revokedAt)));
}

export async function revokeAllSessionsOfUser(db: Database, userId: string) {
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

/** Spends a live reset token and sets the new password in one transaction. */
export async function completePasswordReset(db: Database, tokenHash: string, passwordHash: string) {
  return db.transaction(async (tx) => {
    const [reset] = await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(
        and(
          eq(passwordResets.tokenHash, tokenHash),
          isNull(passwordResets.usedAt),
          gt(passwordResets.expiresAt, new Date()),
        ),
      )
      .returning({ userId: passwordResets.userId });
    if (!reset) return undefined;
    await tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId));
    await tx
      .update(refreshSessions)
      .set({ revokedAt: new Date() })
      .where(and(eq(refreshSessions.userId, reset.userId), isNull(refreshSessions.revokedAt)));
    return reset;
  });
}
