/** Worker-thread body: runs one simulation per message and posts back the result or the contract issues. */
import { parentPort } from 'node:worker_threads';
import { simulateJson, type EngineOptions } from '../simulate.ts';
import type { PoolReply, PoolRequest } from './messages.ts';

parentPort?.on('message', (msg: PoolRequest) => {
  let reply: PoolReply;
  try {
    const r = simulateJson(msg.body, msg.sequence, msg.options as EngineOptions);
    reply = r.ok ? { id: msg.id, kind: 'result', result: r.result } : { id: msg.id, kind: 'invalid', which: r.which, issues: r.issues };
  } catch (err) {
    reply = { id: msg.id, kind: 'failed', message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});
