/** Messages between the chunk pool and its threads. */
import type { RobustnessInputs, RobustnessSample } from '../../planning/robustness.ts';

export interface ChunkRequest {
  id: number;
  inputs: RobustnessInputs;
  from: number;
  to: number;
}

export type ChunkReply =
  | { id: number; kind: 'done'; samples: RobustnessSample[] }
  | { id: number; kind: 'failed'; message: string };

/** Sent once by a thread when the model has loaded. */
export interface ChunkThreadReady {
  kind: 'ready';
}
