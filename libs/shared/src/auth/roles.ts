import * as z from 'zod';

/** The roles a workshop member can hold; see the product brief for what each may do. */
export const ROLES = ['owner', 'formulator', 'production', 'assessor', 'viewer'] as const;
export const roleSchema = z.enum(ROLES, { error: 'Choose one of the workshop roles.' });
export type Role = z.infer<typeof roleSchema>;

/** Plain-language description of each role, shown beside role pickers. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  owner: 'Everything, including members, workshop settings, releases and recalls.',
  formulator: 'Materials, supplier documents, formulas and their checks, labels.',
  production: 'Batch records, weigh sheets, lot picks and label printing.',
  assessor: 'Read-only access to the formula versions shared for safety assessment.',
  viewer: 'Read-only access, for bookkeepers and auditors.',
};

/** Sets of roles that routes and screens allow; one place so client and server agree. */
export const ROLE_SETS = {
  everyone: ROLES,
  members: ['owner', 'formulator', 'production', 'viewer'],
  ownerOnly: ['owner'],
  writers: ['owner', 'formulator'],
} as const satisfies Record<string, readonly Role[]>;
