import * as z from 'zod';
import { textField } from '../records/record-fields';
import { roleSchema } from './roles';

const trimmed = (label: string, max: number) =>
  textField(label, `${label} is required.`)
    .trim()
    .min(1, `${label} is required.`)
    .max(max, `${label} must be at most ${max} characters.`);

/** E-mail address, trimmed and lower-cased so sign-in is case-insensitive. */
export const emailSchema = textField('E-mail', 'E-mail is required.')
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254));

/** bcrypt reads only the first 72 bytes of a password; anything after them would be ignored. */
export const PASSWORD_MAX_BYTES = 72;

/** Length of a string in UTF-8 bytes (a lone surrogate counts as the 3-byte replacement). */
export function utf8ByteLength(text: string): number {
  let bytes = 0;
  for (const char of text) {
    const code = char.codePointAt(0)!;
    bytes += code < 0x80 ? 1 : code < 0x800 ? 2 : code < 0x10000 ? 3 : 4;
  }
  return bytes;
}

/**
 * A new password: long enough to resist guessing, and within bcrypt's 72 bytes, counted in
 * bytes because an accented letter takes two and an emoji four.
 */
export const newPasswordSchema = z
  .string({ error: 'Password is required.' })
  .min(10, 'Use at least 10 characters.')
  .refine(
    (password) => utf8ByteLength(password) <= PASSWORD_MAX_BYTES,
    `Use a shorter password: at most ${PASSWORD_MAX_BYTES} bytes, which is 72 plain letters and digits, fewer with accented letters or emoji.`,
  );

export const personNameSchema = trimmed('Name', 120);

export const signUpSchema = z.object({
  workshopName: trimmed('Workshop name', 120),
  name: personNameSchema,
  email: emailSchema,
  password: newPasswordSchema,
});
export type SignUp = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required.' }).min(1, 'Password is required.').max(200),
});
export type SignIn = z.infer<typeof signInSchema>;

export const workshopSummarySchema = z.object({ id: z.string(), name: z.string() });

/** One workshop a person belongs to, with the role they hold there. */
export const membershipSchema = z.object({
  workshopId: z.string(),
  workshopName: z.string(),
  role: roleSchema,
});
export type Membership = z.infer<typeof membershipSchema>;

/**
 * The signed-in person as `GET /api/me` and every session answer give it: `role` and `workshop`
 * are those of the active workshop (the one the access token names); `memberships` lists every
 * workshop they belong to, the active one included, by name.
 */
export const userSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  workshop: workshopSummarySchema,
  memberships: z.array(membershipSchema),
});
export type User = z.infer<typeof userSchema>;

export const sessionSchema = z.object({
  accessToken: z.string(),
  expiresIn: z.number(),
  user: userSchema,
});
export type Session = z.infer<typeof sessionSchema>;

export const invitationPreviewSchema = z.object({
  email: z.string(),
  role: roleSchema,
  workshopName: z.string(),
  invitedBy: z.string(),
  /**
   * True when the address already has a Batchproof account: accepting then asks for that
   * account's password and adds a membership, instead of creating an account.
   */
  existingAccount: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const tokenSchema = textField('The link', 'The link is missing its token.')
  .trim()
  .min(20, 'The link is incomplete; open it again from the e-mail.')
  .max(200);

/** Accepting an invitation for a new account: a name and a new password. */
export const acceptInvitationSchema = z.object({
  token: tokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

/**
 * Accepting an invitation with an account that already exists: that account's password (the
 * name is already known). The invitation then adds a membership.
 */
export const acceptInvitationExistingSchema = z.object({
  token: tokenSchema,
  password: z.string({ error: 'Password is required.' }).min(1, 'Password is required.').max(200),
});
export type AcceptInvitationExisting = z.infer<typeof acceptInvitationExistingSchema>;

/** `POST /api/auth/workshop`: the workshop to work in; answers a new session for it. */
export const switchWorkshopSchema = z.object({
  workshopId: z.uuid({ error: 'Choose one of your workshops.' }),
});
export type SwitchWorkshop = z.infer<typeof switchWorkshopSchema>;

/** `POST /api/auth/sign-up/confirm`: the token from the confirmation e-mail. */
export const signUpConfirmSchema = z.object({ token: tokenSchema });
export type SignUpConfirm = z.infer<typeof signUpConfirmSchema>;

/** The answer to a sign-up or reset request: the same whether or not the address has an account. */
export const emailSentSchema = z.object({ message: z.string() });
export type EmailSent = z.infer<typeof emailSentSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetCompleteSchema = z.object({
  token: tokenSchema,
  password: newPasswordSchema,
});
export type PasswordResetComplete = z.infer<typeof passwordResetCompleteSchema>;
