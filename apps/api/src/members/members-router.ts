import { Router } from 'express';
import * as z from 'zod';
import {
  invitationCreateSchema,
  memberListQuerySchema,
  memberRoleChangeSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import type { Authenticator } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { parse } from '../core/validate';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import * as members from './members-domain';

const idParam = z.uuid();

/** Parses a record id from the path; a malformed id is simply not found. */
function recordId(raw: unknown, what: string): string {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) throw notFound(what);
  return parsed.data;
}

export function membersRouter(deps: {
  db: Database;
  mailer: Mailer;
  authn: Authenticator;
  appUrl: string;
}) {
  const { db, mailer, authn, appUrl } = deps;
  const router = Router();

  router.get('/', ...authn.allow(ROLE_SETS.members), async (req, res) => {
    res.json(await members.listMembers(db, req.user!, parse(memberListQuerySchema, req.query)));
  });

  router.get('/invitations', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    res.json(await members.listInvitations(db, req.user!));
  });

  router.post('/invitations', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    const input = parse(invitationCreateSchema, req.body);
    res.status(201).json(await members.invite(db, mailer, appUrl, req.user!, input));
  });

  router.delete('/invitations/:id', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    await members.revokeInvitation(db, req.user!, recordId(req.params.id, 'That invitation'));
    res.status(204).end();
  });

  router.patch('/:id', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    const id = recordId(req.params.id, 'That member');
    const { role } = parse(memberRoleChangeSchema, req.body);
    res.json(await members.changeRole(db, req.user!, id, role));
  });

  router.delete('/:id', ...authn.allow(ROLE_SETS.ownerOnly), async (req, res) => {
    await members.removeMember(db, req.user!, recordId(req.params.id, 'That member'));
    res.status(204).end();
  });

  return router;
}
