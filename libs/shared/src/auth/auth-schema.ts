import * as z from 'zod';
import { roleSchema } from './roles';

const trimmed = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, `${label} is required.`)
    .max(max, `${label} must be at most ${max} characters.`);

/** E-mail address, trimmed and lower-cased so sign-in is case-insensitive. */
export const emailSchema = z
  .string({ error: 'E-mail is required.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254));

/** A new password: long enough to resist guessing, short enough for bcrypt (72 bytes). */
export const newPasswordSchema = z
  .string({ error: 'Password is required.' })
  .min(10, 'Use at least 10 characters.')
  .max(72, 'Use at most 72 characters.');

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

export const userSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  workshop: workshopSummarySchema,
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
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const tokenSchema = z
  .string({ error: 'The link is missing its token.' })
  .trim()
  .min(20, 'The link is incomplete; open it again from the e-mail.')
  .max(200);

export const acceptInvitationSchema = z.object({
  token: tokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetCompleteSchema = z.object({
  token: tokenSchema,
  password: newPasswordSchema,
});
export type PasswordResetComplete = z.infer<typeof passwordResetCompleteSchema>;
