import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

import type { TestProject } from 'vitest/node';

import { createDatabase } from '../../db/client.ts';
import { runMigrations } from '../../db/migrate.ts';
import { startLocalCluster } from '../../server/scripts/postgres-cluster.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    /** URL of the throwaway cluster's migrated template database. */
    pgTemplateUrl: string;
  }
}

/** One throwaway PostgreSQL cluster for the whole run; each test file clones the migrated template. */
export default async function setup(project: TestProject) {
  // Short path: the socket folder must stay under 107 bytes; /tmp is traversable by the postgres user.
  const dir = mkdtempSync(path.join(os.tmpdir(), 'hn-pg-'));
  const cluster = await startLocalCluster({ dir, database: 'holonaut_template', throwaway: true });
  const { db, pool } = createDatabase(cluster.url, { max: 2 });
  await runMigrations(db);
  await pool.end();
  project.provide('pgTemplateUrl', cluster.url);
  return () => cluster.stop();
}
