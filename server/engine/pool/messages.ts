/** Messages between the simulation pool and its worker threads. */
import type { ContractIssue } from '../../../shared/contracts/contract-issue.ts';
import type { SimulationResult } from '../../../shared/contracts/result.ts';

/** One simulation job: untrusted body and sequence JSON, validated in the worker. */
export interface PoolRequest {
  id: number;
  body: unknown;
  sequence: unknown;
  /** `finalOnly`: search mode (final attitude and checks, no samples or audit). */
  options: { rateHz?: number; rtol?: number; finalOnly?: boolean };
}

/** The worker's answer. */
export type PoolReply =
  | { id: number; kind: 'result'; result: SimulationResult }
  | { id: number; kind: 'invalid'; which: 'body' | 'sequence'; issues: ContractIssue[] }
  | { id: number; kind: 'failed'; message: string };

/** Sent once by a worker when the engine has loaded (thread start-up is not part of a job's budget). */
export interface WorkerReady {
  kind: 'ready';
}
