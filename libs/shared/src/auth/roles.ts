import * as z from 'zod';

/** The roles a workshop member can hold; see the product brief for what each may do. */
export const ROLES = ['owner', 'formulator', 'production', 'assessor', 'viewer'] as const;
export const roleSchema = z.enum(ROLES, { error: 'Choose one of the workshop roles.' });
export type Role = z.infer<typeof roleSchema>;

/**
 * Plain-language description of each role, shown beside role pickers and on the home page. Each
 * says what the role can do in the app as it is today, nothing that is not built yet.
 */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  owner:
    'Everything a formulator does, plus members and their roles, production settings, recalls and the audit log, releasing a version over blocking findings with a recorded reason, and sharing formula versions with safety assessors.',
  formulator:
    'Materials, suppliers, documents, lots and formulas: writes them, runs the checks and releases versions that pass; releases and corrects batches; prints labels; writes the safety notes an assessor reads and records notification references for each market.',
  production:
    'Records goods-in and corrects stock; starts and records batches from the weigh sheet and prints their labels; records customers, deliveries and complaints; reads formulas, materials and documents.',
  assessor:
    'Reads the formula versions shared with them, writes and signs their safety assessments, and reads the reference lists the checks rest on.',
  viewer:
    'Reads formulas, materials, documents, lots, batches, deliveries, traces, recalls, complaints, safety assessments, market readiness and members, and changes nothing. For bookkeepers and auditors.',
};

/** Sets of roles that routes and screens allow; one place so client and server agree. */
export const ROLE_SETS = {
  everyone: ROLES,
  members: ['owner', 'formulator', 'production', 'viewer'],
  ownerOnly: ['owner'],
  writers: ['owner', 'formulator'],
  /** Who records goods-in: production receives deliveries as well as the writers. */
  goodsIn: ['owner', 'formulator', 'production'],
  /**
   * Who opens Assessments: the workshop's owner, formulators and viewers see every assessment;
   * an assessor sees only the versions shared with them.
   */
  assessments: ['owner', 'formulator', 'viewer', 'assessor'],
} as const satisfies Record<string, readonly Role[]>;
