/** Worker-thread body: runs the planner on workerData and posts progress and the result. */
import { parentPort, workerData } from 'node:worker_threads';

import { planManeuver } from './plan-maneuver.ts';
import type { PlannerThreadInput, PlannerThreadMessage } from './planner-messages.ts';

const post = (m: PlannerThreadMessage) => parentPort!.postMessage(m);
try {
  const input = workerData as PlannerThreadInput;
  const { candidates, notes } = planManeuver({ ...input, onProgress: (fraction, note) => post({ kind: 'progress', fraction, note }) });
  if (!candidates.length) post({ kind: 'failed', message: notes.join(' ') || 'the planner found no candidate', notes });
  else post({ kind: 'done', candidates, notes });
} catch (err) {
  post({ kind: 'failed', message: err instanceof Error ? err.message : String(err) });
}
