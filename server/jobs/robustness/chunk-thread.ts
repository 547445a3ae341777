/** Worker-thread body: computes robustness samples [from, to) per message and posts them back. */
import { parentPort } from 'node:worker_threads';

import { robustnessSamples } from '../../planning/robustness.ts';
import type { ChunkReply, ChunkRequest, ChunkThreadReady } from './chunk-messages.ts';

parentPort?.on('message', (msg: ChunkRequest) => {
  let reply: ChunkReply;
  try {
    reply = { id: msg.id, kind: 'done', samples: robustnessSamples(msg.inputs, msg.from, msg.to) };
  } catch (err) {
    reply = { id: msg.id, kind: 'failed', message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});

// Tell the pool the model has loaded (a warmed pool starts its first chunk without the load time).
parentPort?.postMessage({ kind: 'ready' } satisfies ChunkThreadReady);
