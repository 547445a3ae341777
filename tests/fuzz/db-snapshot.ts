/**
 * A fingerprint of every table in the app's schema: row count and an order-independent checksum of
 * the rows' contents. Two equal snapshots mean a request wrote nothing (no partial writes).
 */
import type pg from 'pg';

/** Per table: `count:checksum`. */
export type DbSnapshot = Record<string, string>;

/** Tables of the public schema (the app's own; pg-boss and drizzle's bookkeeping live elsewhere). */
export async function appTables(pool: pg.Pool): Promise<string[]> {
  const res = await pool.query<{ t: string }>(`SELECT tablename AS t FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`);
  return res.rows.map((r) => r.t);
}

/** Row count and md5 over the sorted md5s of every row's text form, for each table, in one statement. */
export async function snapshot(pool: pg.Pool, tables: readonly string[]): Promise<DbSnapshot> {
  const parts = tables.map((t) => `SELECT '${t}' AS t, count(*)::text || ':' || coalesce(md5(string_agg(h, '' ORDER BY h)), '-') AS v FROM (SELECT md5(x::text) AS h FROM "${t}" x) s`);
  const res = await pool.query<{ t: string; v: string }>(parts.join(' UNION ALL '));
  return Object.fromEntries(res.rows.map((r) => [r.t, r.v]));
}

/** Tables whose fingerprint differs between two snapshots. */
export function changedTables(before: DbSnapshot, after: DbSnapshot): string[] {
  return Object.keys({ ...before, ...after }).filter((t) => before[t] !== after[t]);
}

/** Row count of a table from its fingerprint. */
export function rowCount(s: DbSnapshot, table: string): number {
  return Number((s[table] ?? '0:').split(':')[0]);
}
