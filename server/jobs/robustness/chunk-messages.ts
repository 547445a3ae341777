/** Messages between the chunk pool and its threads. */
import type { RobustnessSample } from '../../../shared/contracts/robustness-stored.ts';
import type { RobustnessInputs } from '../../planning/robustness.ts';

/**
 * Compute samples [from, to) of the run `key`. `inputs` comes with the first chunk of a run a thread
 * sees; the thread keeps them (and what every sample shares) for that run's next chunks.
 */
export interface ChunkRequest {
  id: number;
  key: string;
  inputs?: RobustnessInputs;
  from: number;
  to: number;
}

export type ChunkReply =
  | { id: number; kind: 'done'; samples: RobustnessSample[]; computeMs: number }
  | { id: number; kind: 'failed'; message: string };

/** Sent once by a thread when the model has loaded. */
export interface ChunkThreadReady {
  kind: 'ready';
}
