import { z } from 'zod';

import { roleSchema } from './roles.ts';

/** Minimum password length for invitees and password changes (NIST SP 800-63B asks for at least 8). */
export const PASSWORD_MIN_LENGTH = 10;

/** Longest password accepted wherever one is typed (set, sign-in, change). */
const PASSWORD_MAX_LENGTH = 200;

export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(254);
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`);

/** A password typed to be checked against the stored hash: present and within the length bound (its strength was checked when it was set). */
const enteredPassword = (missing: string) => z.string().min(1, missing).max(PASSWORD_MAX_LENGTH);

/** POST /api/auth/sign-in */
export const signInRequestSchema = z.object({
  email: emailSchema,
  password: enteredPassword('Enter your password.'),
});
export type SignInRequest = z.infer<typeof signInRequestSchema>;

/** The signed-in user as the API returns it (never the hash). */
export const sessionUserSchema = z.object({
  id: z.string().uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  crewMemberId: z.string().uuid().nullable(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** Response of sign-in and invitation acceptance; `token` is for non-browser clients (Bearer). */
export const signInResponseSchema = z.object({ user: sessionUserSchema, token: z.string() });
export type SignInResponse = z.infer<typeof signInResponseSchema>;

/** POST /api/auth/password */
export const changePasswordRequestSchema = z.object({
  currentPassword: enteredPassword('Enter your current password.'),
  newPassword: passwordSchema,
});
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;
