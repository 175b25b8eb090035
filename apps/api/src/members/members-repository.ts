import { and, asc, count, desc, eq, gt, isNull, sql, type SQL } from 'drizzle-orm';
import type { MemberListQuery, Role } from '@batchproof/shared';
import type { Database } from '../db/database';
import { invitations, users, workshops } from '../db/schema';

const memberColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: users.role,
  joinedAt: users.createdAt,
};

const sortColumns = {
  name: users.name,
  email: users.email,
  role: users.role,
  joinedAt: users.createdAt,
} as const;

export async function listMembers(db: Database, workshopId: string, q: MemberListQuery) {
  const order = q.dir === 'desc' ? desc : asc;
  return db
    .select(memberColumns)
    .from(users)
    .where(eq(users.workshopId, workshopId))
    .orderBy(order(sortColumns[q.sort]), asc(users.id));
}

export async function findMember(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(memberColumns)
    .from(users)
    .where(and(eq(users.workshopId, workshopId), eq(users.id, id)));
  return row;
}

/** Locks the workshop's owners so two concurrent changes can't both remove "the other" owner. */
export async function lockOwners(tx: Database, workshopId: string) {
  return tx
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.workshopId, workshopId), eq(users.role, 'owner')))
    .for('update');
}

export async function setRole(db: Database, workshopId: string, id: string, role: Role) {
  const [row] = await db
    .update(users)
    .set({ role })
    .where(and(eq(users.workshopId, workshopId), eq(users.id, id)))
    .returning(memberColumns);
  return row;
}

export async function deleteMember(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(users)
    .where(and(eq(users.workshopId, workshopId), eq(users.id, id)))
    .returning({ id: users.id });
  return row;
}

const invitationColumns = {
  id: invitations.id,
  email: invitations.email,
  role: invitations.role,
  createdAt: invitations.createdAt,
  expiresAt: invitations.expiresAt,
};

export async function listPendingInvitations(db: Database, workshopId: string) {
  return db
    .select(invitationColumns)
    .from(invitations)
    .where(
      and(
        eq(invitations.workshopId, workshopId),
        isNull(invitations.acceptedAt),
        gt(invitations.expiresAt, new Date()),
      ),
    )
    .orderBy(desc(invitations.createdAt));
}

export async function insertInvitation(
  db: Database,
  row: {
    workshopId: string;
    email: string;
    role: Role;
    tokenHash: string;
    invitedBy: string;
    expiresAt: Date;
  },
) {
  const [created] = await db.insert(invitations).values(row).returning(invitationColumns);
  return created!;
}

/**
 * Holds, until the transaction ends, the right to change one address's invitations in one
 * workshop, so two invitations sent at once cannot both stay pending.
 */
export async function lockInvitationsTo(tx: Database, workshopId: string, email: string) {
  await tx.execute(
    sql`select pg_advisory_xact_lock(hashtextextended(${`invitation:${workshopId}:${email}`}, 0))`,
  );
}

/** Deletes the workshop's invitations that `which` picks, as long as they were not accepted. */
function deleteUnaccepted(db: Database, workshopId: string, which: SQL) {
  return db
    .delete(invitations)
    .where(and(eq(invitations.workshopId, workshopId), which, isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id, expiresAt: invitations.expiresAt });
}

/**
 * Deletes the invitations to `email` in the workshop that were not accepted (live or expired),
 * and answers how many of them were still live.
 */
export async function deleteUnacceptedInvitationsTo(
  tx: Database,
  workshopId: string,
  email: string,
) {
  const rows = await deleteUnaccepted(tx, workshopId, eq(invitations.email, email));
  const now = Date.now();
  return rows.filter((r) => r.expiresAt.getTime() > now).length;
}

export async function deleteInvitation(db: Database, workshopId: string, id: string) {
  const [row] = await deleteUnaccepted(db, workshopId, eq(invitations.id, id));
  return row;
}

/**
 * The invitation a token names, live or not, with its workshop's name and the inviter's name;
 * undefined when no invitation has that token (never issued, revoked or replaced).
 */
export async function findInvitationByToken(db: Database, tokenHash: string) {
  const [row] = await db
    .select({
      id: invitations.id,
      workshopId: invitations.workshopId,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      acceptedAt: invitations.acceptedAt,
      workshopName: workshops.name,
      invitedBy: users.name,
    })
    .from(invitations)
    .innerJoin(workshops, eq(workshops.id, invitations.workshopId))
    .leftJoin(users, eq(users.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash));
  return row;
}

export async function countUsersWithEmail(db: Database, email: string) {
  const [row] = await db.select({ n: count() }).from(users).where(eq(users.email, email));
  return row?.n ?? 0;
}

export async function markInvitationAccepted(db: Database, id: string) {
  const [row] = await db
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id });
  return row;
}

export async function insertMember(
  db: Database,
  row: { workshopId: string; email: string; name: string; passwordHash: string; role: Role },
) {
  const [created] = await db.insert(users).values(row).returning({
    id: users.id,
    workshopId: users.workshopId,
    role: users.role,
    name: users.name,
    email: users.email,
  });
  return created!;
}
