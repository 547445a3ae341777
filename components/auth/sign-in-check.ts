import type { FieldErrors, Resolver, ResolverResult } from 'react-hook-form';

import type { SignInRequest } from '@/shared/contracts/auth';

/**
 * The e-mail pattern of zod 4.6.7's `email()` check (node_modules/zod/v4/core/regexes.js), which the
 * server's signInRequestSchema applies; a test checks both agree.
 */
const EMAIL = /^(?:[A-Za-z0-9_'+\-]+\.)*[A-Za-z0-9_'+\-]*[A-Za-z0-9_+-]@(?:[A-Za-z0-9][A-Za-z0-9\-]*\.)+[A-Za-z]{2,}$/;

/**
 * The sign-in form's own check, the same rules as signInRequestSchema (shared/contracts/auth.ts)
 * without the zod runtime, so the first page stays light; the server still applies the schema and
 * its field errors show beside the fields.
 */
export const signInResolver: Resolver<SignInRequest> = (values): ResolverResult<SignInRequest> => {
  const email = values.email.trim().toLowerCase();
  const errors: FieldErrors<SignInRequest> = {};
  if (!EMAIL.test(email)) errors.email = { type: 'pattern', message: 'Enter a valid e-mail address.' };
  else if (email.length > 254) errors.email = { type: 'maxLength', message: 'Too big: expected string to have <=254 characters' };
  if (values.password.length < 1) errors.password = { type: 'minLength', message: 'Enter your password.' };
  else if (values.password.length > 200) errors.password = { type: 'maxLength', message: 'Too big: expected string to have <=200 characters' };
  if (Object.keys(errors).length) return { values: {} as Record<string, never>, errors };
  return { values: { email, password: values.password }, errors: {} };
};
