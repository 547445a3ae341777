/**
 * Reading a JSON column. `$type<>()` in db/schema only tells the compiler what was written; the
 * value read back is checked here against the shared zod schema it was written from, once, where
 * the row is read. A value that does not match is an error naming the column and the field, never
 * a silent default.
 */
import type { z } from 'zod';

/** A stored JSON value that does not match its schema (a damaged row or an unmigrated old shape). */
export class StoredDataError extends Error {
  constructor(readonly column: string, readonly field: string, reason: string, readonly row?: string) {
    super(`${column}${field ? `.${field}` : ''}${row ? ` of ${row}` : ''}: ${reason} (stored value unreadable)`);
    this.name = 'StoredDataError';
  }
}

/**
 * `value` (read from `column`, e.g. "plans.settings", of `row`, e.g. "upload 5f…") parsed with
 * `schema`; throws StoredDataError.
 */
export function readStored<S extends z.ZodType>(schema: S, value: unknown, column: string, row?: string): z.output<S> {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  throw new StoredDataError(column, issue?.path.map(String).join('.') ?? '', issue?.message ?? 'does not match its schema', row);
}
