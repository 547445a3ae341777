import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { sql } from 'drizzle-orm';
import { migrate } from 'drizzle-orm/node-postgres/migrator';

import type { Database } from './client.ts';

/** Folder of the committed drizzle-kit migrations, independent of the working directory. */
export const MIGRATIONS_FOLDER = path.join(path.dirname(fileURLToPath(import.meta.url)), 'migrations');

/** Applies every pending migration. */
export async function runMigrations(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
}

/** When the newest committed migration was generated (drizzle-kit's journal `when`, ms). */
function newestMigrationMillis(): number {
  const journal = JSON.parse(readFileSync(path.join(MIGRATIONS_FOLDER, 'meta', '_journal.json'), 'utf8')) as { entries: { when: number }[] };
  return Math.max(...journal.entries.map((e) => e.when));
}

/**
 * True when every committed migration has been applied to this database. drizzle's migrator
 * records each migration's journal timestamp in `drizzle.__drizzle_migrations.created_at`.
 * Rejects when the database cannot be reached.
 */
export async function migrationsApplied(db: Database): Promise<boolean> {
  const table = await db.execute<{ exists: boolean }>(sql`SELECT to_regclass('drizzle.__drizzle_migrations') IS NOT NULL AS exists`);
  if (!table.rows[0]?.exists) return false;
  const res = await db.execute<{ newest: string | null }>(sql`SELECT max(created_at)::text AS newest FROM drizzle.__drizzle_migrations`);
  return Number(res.rows[0]?.newest ?? 0) >= newestMigrationMillis();
}
