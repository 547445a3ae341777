/** Worker-thread body: computes robustness samples [from, to) per message and posts them back. */
import { performance } from 'node:perf_hooks';
import { parentPort } from 'node:worker_threads';

import { type PreparedRobustness, prepareRobustness, robustnessSamples } from '../../planning/robustness.ts';
import type { ChunkReply, ChunkRequest, ChunkThreadReady } from './chunk-messages.ts';

// The run this thread last worked on: its next chunks skip sending the inputs and recomputing the nominal plan.
let current: { key: string; prepared: PreparedRobustness } | null = null;

parentPort?.on('message', (msg: ChunkRequest) => {
  let reply: ChunkReply;
  try {
    const t0 = performance.now();
    if (msg.inputs) {
      current = null;
      current = { key: msg.key, prepared: prepareRobustness(msg.inputs) };
    }
    if (!current || current.key !== msg.key) throw new Error(`chunk of run ${msg.key} arrived without its inputs`);
    const samples = robustnessSamples(current.prepared.inputs, msg.from, msg.to, current.prepared);
    reply = { id: msg.id, kind: 'done', samples, computeMs: performance.now() - t0 };
  } catch (err) {
    reply = { id: msg.id, kind: 'failed', message: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});

// Tell the pool the model has loaded (a warmed pool starts its first chunk without the load time).
parentPort?.postMessage({ kind: 'ready' } satisfies ChunkThreadReady);
