/** Messages between the planning job and its worker thread. */
import type { Body } from '../../shared/contracts/body.ts';
import type { SequenceTarget } from '../../shared/contracts/maneuver.ts';
import type { PlanCandidate, PlanSettings } from '../../shared/contracts/plan.ts';

/** workerData of the thread. */
export interface PlannerThreadInput {
  body: Body;
  target: SequenceTarget;
  settings: PlanSettings;
}

/** What the thread posts: progress notes, then the candidates or a failure. */
export type PlannerThreadMessage =
  | { kind: 'progress'; fraction: number; note: string }
  | { kind: 'done'; candidates: PlanCandidate[]; notes: string[] }
  /** `notes`: the planner's own reasons when it found no candidate (which axis, which limit). */
  | { kind: 'failed'; message: string; notes?: string[] };
