/**
 * Text PostgreSQL cannot store or that is not valid Unicode: a NUL character (text and jsonb refuse
 * U+0000) or an unpaired UTF-16 surrogate (JSON allows "\ud800"; it is not a character). Found once
 * for every request, before validation, so each route answers 400 naming the field instead of
 * failing in the database.
 */

/** Where the bad text is and what is wrong with it. */
export interface UnsafeText {
  /** Dotted path of the field ("steps.2.note"; a key's own path when the key itself is bad). */
  field: string;
  reason: string;
}

const MAX_DEPTH = 64;

function problem(s: string): string | null {
  if (s.includes('\u0000')) return 'contains a NUL character (U+0000), which text cannot hold';
  if (!(s as string & { isWellFormed(): boolean }).isWellFormed()) return 'contains an unpaired UTF-16 surrogate (not valid Unicode text)';
  return null;
}

/** The first string (value or object key) with a NUL or an unpaired surrogate, or null. */
export function findUnsafeText(value: unknown, path: string[] = [], depth = 0): UnsafeText | null {
  if (typeof value === 'string') {
    const reason = problem(value);
    return reason ? { field: path.join('.'), reason } : null;
  }
  if (value === null || typeof value !== 'object' || depth > MAX_DEPTH) return null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = findUnsafeText(value[i], [...path, String(i)], depth + 1);
      if (found) return found;
    }
    return null;
  }
  for (const [key, v] of Object.entries(value)) {
    const keyReason = problem(key);
    if (keyReason) return { field: [...path, key.replace(/[\u0000\uD800-\uDFFF]/g, '\uFFFD')].join('.'), reason: `its key ${keyReason}` };
    const found = findUnsafeText(v, [...path, key], depth + 1);
    if (found) return found;
  }
  return null;
}
