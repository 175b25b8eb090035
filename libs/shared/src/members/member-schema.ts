import * as z from 'zod';
import { emailSchema } from '../auth/auth-schema';
import { roleSchema } from '../auth/roles';

export const memberSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;
export const memberListSchema = z.object({ items: z.array(memberSchema) });

export const invitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: roleSchema,
  createdAt: z.string(),
  expiresAt: z.string(),
  /**
   * On the answer to an invitation only: how many pending invitations to the same address this
   * one replaced (their links stop working).
   */
  replaced: z.number().int().optional(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationListSchema = z.object({ items: z.array(invitationSchema) });

export const invitationCreateSchema = z.object({ email: emailSchema, role: roleSchema });
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;

export const memberRoleChangeSchema = z.object({ role: roleSchema });
export type MemberRoleChange = z.infer<typeof memberRoleChangeSchema>;

/** Sort keys the members table accepts. */
export const memberSortSchema = z.enum(['name', 'email', 'role', 'joinedAt']).default('name');
export const memberListQuerySchema = z.object({
  sort: memberSortSchema,
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export type MemberListQuery = z.infer<typeof memberListQuerySchema>;
