/** Worker-thread body: runs one simulation per message and posts back the result or the contract issues. */
import { parentPort } from 'node:worker_threads';

import { simulateJson } from '../simulate.ts';
import type { PoolReply, PoolRequest, WorkerReady } from './messages.ts';

parentPort?.on('message', (msg: PoolRequest) => {
  let reply: PoolReply;
  try {
    const r = simulateJson(msg.body, msg.sequence, msg.options);
    reply = r.ok ? { id: msg.id, kind: 'result', result: r.result } : { id: msg.id, kind: 'invalid', which: r.which, issues: r.issues };
  } catch (err) {
    reply = { id: msg.id, kind: 'failed', message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});

// Tell the pool the engine is loaded, so a job's time budget starts now, not at thread start-up.
parentPort?.postMessage({ kind: 'ready' } satisfies WorkerReady);
