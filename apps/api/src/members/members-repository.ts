import { and, asc, count, desc, eq, gt, isNull, sql, type SQL } from 'drizzle-orm';
import type { MemberListQuery, Role } from '@batchproof/shared';
import type { Database } from '../db/database';
import { invitations, memberships, users, workshops } from '../db/schema';

/** A member: the person's name and e-mail, with the role and joining date of this membership. */
const memberColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: memberships.role,
  joinedAt: memberships.createdAt,
};

const sortColumns = {
  name: users.name,
  email: users.email,
  role: memberships.role,
  joinedAt: memberships.createdAt,
} as const;

const ofWorkshop = (workshopId: string, userId?: string) =>
  and(
    eq(memberships.workshopId, workshopId),
    userId === undefined ? undefined : eq(memberships.userId, userId),
  );

export async function listMembers(db: Database, workshopId: string, q: MemberListQuery) {
  const order = q.dir === 'desc' ? desc : asc;
  return db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(ofWorkshop(workshopId))
    .orderBy(order(sortColumns[q.sort]), asc(users.id));
}

export async function findMember(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(ofWorkshop(workshopId, id));
  return row;
}

/** Locks the workshop's owners so two concurrent changes can't both remove "the other" owner. */
export async function lockOwners(tx: Database, workshopId: string) {
  return tx
    .select({ id: memberships.userId })
    .from(memberships)
    .where(and(ofWorkshop(workshopId), eq(memberships.role, 'owner')))
    .for('update');
}

export async function setRole(db: Database, workshopId: string, id: string, role: Role) {
  const [row] = await db
    .update(memberships)
    .set({ role })
    .where(ofWorkshop(workshopId, id))
    .returning({ id: memberships.userId });
  return row && findMember(db, workshopId, id);
}

/**
 * Ends someone's membership of the workshop; a person left with no workshop at all is deleted
 * (they could no longer sign in to anything).
 */
export async function deleteMember(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(memberships)
    .where(ofWorkshop(workshopId, id))
    .returning({ id: memberships.userId });
  if (!row) return undefined;
  const [left] = await db
    .select({ n: count() })
    .from(memberships)
    .where(eq(memberships.userId, id));
  if ((left?.n ?? 0) === 0) await db.delete(users).where(eq(users.id, id));
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

/** Whether the account with this e-mail is already a member of the workshop. */
export async function isMemberByEmail(db: Database, workshopId: string, email: string) {
  const [row] = await db
    .select({ n: count() })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(ofWorkshop(workshopId), eq(users.email, email)));
  return (row?.n ?? 0) > 0;
}

export async function markInvitationAccepted(db: Database, id: string) {
  const [row] = await db
    .update(invitations)
    .set({ acceptedAt: new Date() })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt)))
    .returning({ id: invitations.id });
  return row;
}

/** Adds an existing person to a workshop with a role; they work there from now on. */
export async function insertMembership(
  db: Database,
  row: { workshopId: string; userId: string; role: Role },
) {
  await db.insert(memberships).values({ ...row, lastActiveAt: new Date() });
}

/** Creates a person and their membership of the workshop that invited them. */
export async function insertMember(
  db: Database,
  row: { workshopId: string; email: string; name: string; passwordHash: string; role: Role },
) {
  const [created] = await db
    .insert(users)
    .values({ email: row.email, name: row.name, passwordHash: row.passwordHash })
    .returning({ id: users.id, name: users.name, email: users.email });
  await insertMembership(db, { workshopId: row.workshopId, userId: created!.id, role: row.role });
  return { ...created!, workshopId: row.workshopId, role: row.role };
}
