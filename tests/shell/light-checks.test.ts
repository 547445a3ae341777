/**
 * The sign-in page's zod-free checks (kept off zod so the first page loads less JavaScript) must
 * agree with the zod schemas the server applies: two code paths that must agree, on fixed inputs.
 */
import { describe, expect, it } from 'vitest';

import { isApiErrorBody } from '../../components/api/client.ts';
import { signInResolver } from '../../components/auth/sign-in-check.ts';
import { apiErrorSchema } from '../../shared/contracts/api-error.ts';
import { signInRequestSchema } from '../../shared/contracts/auth.ts';

const resolve = (email: string, password: string) =>
  signInResolver({ email, password }, undefined, { fields: {}, shouldUseNativeValidation: false }) as { values: Record<string, unknown>; errors: Record<string, { message?: string }> };

const SIGN_IN_CASES: [string, string][] = [
  ['orrin.vale@lumen.example.test', 'lumen-ring-demo'],
  ['  Orrin.Vale@Lumen.Example.TEST ', 'x'],
  ['first.last+tag@sub.example.org', 'p'],
  ['o\'neil@example.org', 'p'],
  ['no-at-sign.example.org', 'p'],
  ['two@@example.org', 'p'],
  ['.leading-dot@example.org', 'p'],
  ['double..dot@example.org', 'p'],
  ['trailing-dot.@example.org', 'p'],
  ['user@localhost', 'p'],
  ['user@example.c', 'p'],
  ['user@-example.org', 'p'],
  ['', ''],
  ['user@example.org', ''],
  [`${'a'.repeat(250)}@example.org`, 'p'],
  ['user@example.org', 'p'.repeat(200)],
  ['user@example.org', 'p'.repeat(201)],
];

describe('sign-in check without zod', () => {
  it.each(SIGN_IN_CASES)('agrees with signInRequestSchema on %j', (email, password) => {
    const zod = signInRequestSchema.safeParse({ email, password });
    const own = resolve(email, password);
    if (zod.success) {
      expect(own.errors).toEqual({});
      expect(own.values).toEqual(zod.data);
    } else {
      const fields = distinct(zod.error.issues.map((i) => String(i.path[0])));
      expect(Object.keys(own.errors).sort()).toEqual(fields);
      // The first message per field, as the zod resolver would show it.
      for (const f of fields) expect(own.errors[f].message).toBe(zod.error.issues.find((i) => i.path[0] === f)!.message);
    }
  });
});

/** Distinct, sorted. */
function distinct(xs: string[]): string[] {
  return [...new Set(xs)].sort();
}

describe('API error body check without zod', () => {
  const bodies: unknown[] = [
    { error: { code: 'bad', message: 'Bad.' } },
    { error: { code: 'bad', message: 'Bad.', field: 'email' } },
    { error: { code: 'bad', message: 'Bad.', field: 3 } },
    { error: { code: 'bad' } },
    { error: 'text' },
    { error: null },
    null,
    'text',
    42,
    undefined,
    [],
  ];
  it.each(bodies.map((b) => [JSON.stringify(b) ?? 'undefined', b]))('agrees with apiErrorSchema on %s', (_label, body) => {
    expect(isApiErrorBody(body)).toBe(apiErrorSchema.safeParse(body).success);
  });
});
