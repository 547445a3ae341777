/**
 * The reproducibility hash of a verification: sha256 of the canonical JSON of the exact body and
 * compiled sequence the engine ran (object keys sorted at every level, no whitespace).
 */
import { createHash } from 'node:crypto';

/** JSON with object keys sorted recursively, so equal content always gives equal text. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/** sha256 (hex) of canonical JSON of `{ body, sequence }`. */
export function inputsHash(body: unknown, sequence: unknown): string {
  return createHash('sha256').update(canonicalJson({ body, sequence })).digest('hex');
}
