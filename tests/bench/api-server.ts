/**
 * Child process of `npm run bench:api`: the product's own server (server/scripts/serve.ts) over the
 * bench's database, in a process of its own so the load generator does not share its event loop.
 * Reports its URL to the parent over IPC and stops on SIGTERM.
 */
import { loadConfig } from '../../server/config.ts';
import { serve } from '../../server/scripts/serve.ts';

const server = await serve(loadConfig(process.env), { seed: false });
process.send?.({ url: server.url });
process.on('SIGTERM', () => {
  void server.close().finally(() => process.exit(0));
});
