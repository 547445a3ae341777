import type { Server } from 'node:http';

import { runMigrations } from '../../db/migrate.ts';
import { seedDemo } from '../../db/seed/run-seed.ts';
import { createApp } from '../app.ts';
import type { Config } from '../config.ts';
import { createContext } from '../context.ts';
import { startJobQueue } from '../jobs/job-queue.ts';
import type { ReceivedMail } from '../mail/smtp-fake.ts';
import { queueEngineRechecks } from '../maneuvers/engine-recheck.ts';

/** A running Holonaut server. */
export interface RunningServer {
  url: string;
  close(): Promise<void>;
}

/** Migrates, optionally seeds the demo, and listens; `close()` drains connections and the pool. */
export async function serve(config: Config, opts: { seed: boolean; devMailbox?: readonly ReceivedMail[] }): Promise<RunningServer & { seeded: boolean }> {
  const ctx = createContext(config, opts.devMailbox);
  await runMigrations(ctx.db);
  const seeded = opts.seed ? await seedDemo(ctx.db, config.BCRYPT_COST, ctx.simulation.product) : false;
  // The API only sends jobs; worker processes (`npm run worker`, started by `npm start`) run them.
  const jobs = await startJobQueue(ctx, { worker: false });
  ctx.jobs = jobs;
  // Cleared versions verified by another engine are re-verified in the background (DECISIONS.md "An engine change").
  await queueEngineRechecks(ctx).catch((err: unknown) => ctx.logger.error({ err }, 'queueing engine re-verifications failed; the next start tries again'));
  const app = createApp(ctx);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, (err?: Error) => (err ? reject(err) : resolve(s)));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  return {
    url: `http://${config.HOST}:${port}`,
    seeded,
    close: async () => {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeIdleConnections();
        setTimeout(() => server.closeAllConnections(), 3000).unref();
      });
      await jobs.stop();
      await ctx.close();
    },
  };
}
