import { describe, expect, it } from 'vitest';

import { safeReturnPath, signInHrefFor } from '../../components/shell/return-path.ts';

describe('return path after sign-in', () => {
  it('keeps an app path with its query', () => {
    expect(safeReturnPath('/reviews/abc?x=1')).toBe('/reviews/abc?x=1');
  });

  it('refuses another origin, protocol-relative and backslash tricks', () => {
    expect(safeReturnPath('https://elsewhere.test/')).toBeNull();
    expect(safeReturnPath('//elsewhere.test/')).toBeNull();
    expect(safeReturnPath('/\\elsewhere.test/')).toBeNull();
  });

  it('never returns to sign-in or an invitation', () => {
    expect(safeReturnPath('/sign-in?next=/x')).toBeNull();
    expect(safeReturnPath('/invite/token')).toBeNull();
  });

  it('builds the sign-in address round trip', () => {
    const href = signInHrefFor('/reviews/v1', '?tab=report');
    const next = new URL(href, 'http://h').searchParams.get('next');
    expect(safeReturnPath(next ?? undefined)).toBe('/reviews/v1?tab=report');
  });
});
