import { randomUUID } from 'node:crypto';

import pg from 'pg';
import { inject } from 'vitest';

/** Creates a fresh database cloned from the migrated template; returns its URL and a drop function. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const templateUrl = inject('pgTemplateUrl');
  const name = `t_${randomUUID().replaceAll('-', '')}`;
  const admin = new pg.Client({ connectionString: templateUrl.replace(/\/[^/]+$/, '/postgres') });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name} TEMPLATE holonaut_template`);
  await admin.end();
  return {
    url: templateUrl.replace(/\/[^/]+$/, `/${name}`),
    drop: async () => {
      const c = new pg.Client({ connectionString: templateUrl.replace(/\/[^/]+$/, '/postgres') });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await c.end();
    },
  };
}
