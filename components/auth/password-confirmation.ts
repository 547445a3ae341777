import { z } from 'zod';

import { changePasswordRequestSchema } from '@/shared/contracts/auth';
import { acceptInvitationRequestSchema } from '@/shared/contracts/team';

const SAME = 'The two passwords differ. Type the same password twice.';

/** Invitation acceptance form: the API's body plus a confirmation that must match. */
export const acceptInvitationFormSchema = acceptInvitationRequestSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { message: SAME, path: ['confirm'] });
export type AcceptInvitationForm = z.infer<typeof acceptInvitationFormSchema>;

/** Change-password form: the API's body plus a confirmation of the new password. */
export const changePasswordFormSchema = changePasswordRequestSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.newPassword === v.confirm, { message: SAME, path: ['confirm'] });
export type ChangePasswordForm = z.infer<typeof changePasswordFormSchema>;
