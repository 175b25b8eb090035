import {
  acceptInvitationExistingSchema,
  acceptInvitationSchema,
  tokenSchema,
  type InvitationCreate,
  type InvitationPreview,
  type MemberListQuery,
  type Role,
} from '@batchproof/shared';
import * as z from 'zod';
import { hashToken, newOpaqueToken } from '../auth/access-tokens';
import { hashPassword, passwordMatches } from '../auth/auth-domain';
import { findUserByEmail, type SessionUser } from '../auth/auth-repository';
import type { AuthUser } from '../auth/authenticate';
import { parse } from '../core/validate';
import { AppError, conflict, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { invitationMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import * as repo from './members-repository';

const INVITATION_DAYS = 7;
const iso = <T extends Record<string, unknown>>(row: T) =>
  Object.fromEntries(
    Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v]),
  );

export async function listMembers(db: Database, actor: AuthUser, q: MemberListQuery) {
  return { items: (await repo.listMembers(db, actor.workshopId, q)).map(iso) };
}

export async function listInvitations(db: Database, actor: AuthUser) {
  return { items: (await repo.listPendingInvitations(db, actor.workshopId)).map(iso) };
}

const alreadyMember = () =>
  conflict('This e-mail already belongs to a member of this workshop.', {
    email: ['This e-mail already belongs to a member of this workshop.'],
  });

/**
 * Creates an invitation and e-mails its one-time link. An invitation to the same address in this
 * workshop that was not accepted yet is replaced: one link stays valid, the newest. An address
 * that already has an account may be invited (accepting adds a membership), unless that account
 * is a member here already.
 */
export async function invite(
  db: Database,
  mailer: Mailer,
  appUrl: string,
  actor: AuthUser,
  input: InvitationCreate,
) {
  if (await repo.isMemberByEmail(db, actor.workshopId, input.email)) throw alreadyMember();
  const token = newOpaqueToken();
  const created = await db.transaction(async (tx) => {
    await repo.lockInvitationsTo(tx, actor.workshopId, input.email);
    const replaced = await repo.deleteUnacceptedInvitationsTo(tx, actor.workshopId, input.email);
    const row = await repo.insertInvitation(tx, {
      workshopId: actor.workshopId,
      email: input.email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedBy: actor.id,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
    });
    return { ...row, replaced };
  });
  const workshop = await db.query.workshops.findFirst({
    where: (w, { eq }) => eq(w.id, actor.workshopId),
  });
  await mailer.send(
    invitationMail({
      to: input.email,
      workshopName: workshop!.name,
      inviterName: actor.name,
      role: input.role,
      link: `${appUrl}/accept-invite/${encodeURIComponent(token)}`,
      days: INVITATION_DAYS,
    }),
  );
  return iso(created);
}

export async function revokeInvitation(db: Database, actor: AuthUser, id: string) {
  if (!(await repo.deleteInvitation(db, actor.workshopId, id))) throw notFound('That invitation');
}

/** Refusals of an invitation link, one code each, so the accept page can say which it is. */
const linkRefusals = {
  unknown: () =>
    new AppError(
      404,
      'invitation_unknown',
      'This invitation link is not valid: it may be incomplete, withdrawn or replaced by a newer ' +
        'invitation. Open the link in the latest invitation e-mail, or ask the workshop owner to ' +
        'invite you again.',
    ),
  used: () =>
    new AppError(
      410,
      'invitation_used',
      'This invitation has already been used to join the workshop. Sign in with the invited ' +
        'e-mail instead.',
    ),
  expired: () =>
    new AppError(
      410,
      'invitation_expired',
      `This invitation has expired (links last ${INVITATION_DAYS} days). Ask the workshop owner ` +
        'to send a new one.',
    ),
};

/**
 * The invitation a link's token names, if it can still be accepted; otherwise the refusal says
 * which it is: unknown (never issued, revoked or replaced), used, or expired.
 */
async function usableInvitation(db: Database, token: string) {
  const found = await repo.findInvitationByToken(db, hashToken(token));
  if (!found) throw linkRefusals.unknown();
  if (found.acceptedAt) throw linkRefusals.used();
  if (found.expiresAt.getTime() <= Date.now()) throw linkRefusals.expired();
  return found;
}

export async function previewInvitation(db: Database, token: string): Promise<InvitationPreview> {
  const found = await usableInvitation(db, token);
  return {
    email: found.email,
    role: found.role,
    workshopName: found.workshopName,
    invitedBy: found.invitedBy ?? 'A workshop owner',
    existingAccount: (await repo.countUsersWithEmail(db, found.email)) > 0,
  };
}

const wrongPassword = () =>
  new AppError(401, 'unauthenticated', 'That password does not match the invited account.', {
    password: ['That password does not match the invited account.'],
  });

/**
 * Accepts a live invitation, once, and answers the member in the invited workshop. For a new
 * address the body is `acceptInvitationSchema` (a name and a new password: the account is
 * created); for an address that already has an account it is `acceptInvitationExistingSchema`
 * (that account's password: a membership is added).
 */
export async function acceptInvitation(db: Database, body: unknown): Promise<SessionUser> {
  const tokenOnly = z.object({ token: tokenSchema }).safeParse(body ?? {});
  // Without a well-formed token the account is unknown: the new-account shape names every bad
  // field (and throws).
  const token = tokenOnly.success
    ? tokenOnly.data.token
    : parse(acceptInvitationSchema, body).token;
  const invited = await usableInvitation(db, token);
  const account = await findUserByEmail(db, invited.email);
  if (account) {
    const { password } = parse(acceptInvitationExistingSchema, body);
    if (!(await passwordMatches(account, password))) throw wrongPassword();
    return db.transaction(async (tx) => {
      const found = await acceptOnce(tx, token);
      if (await repo.isMemberByEmail(tx, found.workshopId, found.email)) throw alreadyMember();
      const membership = { workshopId: found.workshopId, userId: account.id, role: found.role };
      await repo.insertMembership(tx, membership);
      const { passwordHash: _hash, ...user } = account;
      return { ...user, workshopId: found.workshopId, role: found.role };
    });
  }
  const input = parse(acceptInvitationSchema, body);
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const found = await acceptOnce(tx, token);
    if (await repo.countUsersWithEmail(tx, found.email)) {
      throw conflict('This e-mail already belongs to a Batchproof account. Sign in instead.');
    }
    const member = await repo.insertMember(tx, {
      workshopId: found.workshopId,
      email: found.email,
      name: input.name,
      passwordHash,
      role: found.role,
    });
    return { ...member, tokenVersion: 0 };
  });
}

/** Marks the invitation accepted inside the caller's transaction; a second use is refused. */
async function acceptOnce(tx: Database, token: string) {
  const found = await usableInvitation(tx, token);
  // Another acceptance of the same link committed first: this one is the second use.
  if (!(await repo.markInvitationAccepted(tx, found.id))) throw linkRefusals.used();
  return found;
}

const lastOwner = () =>
  new AppError(
    409,
    'conflict',
    'A workshop needs at least one owner. Make someone else owner first.',
    {
      role: ['A workshop needs at least one owner.'],
    },
  );

/** Changes a member's role; the last owner cannot be demoted. */
export async function changeRole(db: Database, actor: AuthUser, id: string, role: Role) {
  return db.transaction(async (tx) => {
    const owners = await repo.lockOwners(tx, actor.workshopId);
    const member = await repo.findMember(tx, actor.workshopId, id);
    if (!member) throw notFound('That member');
    if (member.role === 'owner' && role !== 'owner' && owners.length <= 1) throw lastOwner();
    return iso((await repo.setRole(tx, actor.workshopId, id, role))!);
  });
}

/** Removes a member; the last owner cannot be removed. */
export async function removeMember(db: Database, actor: AuthUser, id: string) {
  await db.transaction(async (tx) => {
    const owners = await repo.lockOwners(tx, actor.workshopId);
    const member = await repo.findMember(tx, actor.workshopId, id);
    if (!member) throw notFound('That member');
    if (member.role === 'owner' && owners.length <= 1) throw lastOwner();
    await repo.deleteMember(tx, actor.workshopId, id);
  });
}
